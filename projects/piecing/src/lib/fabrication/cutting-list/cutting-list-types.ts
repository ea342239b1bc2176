/*
 * The cutting list of a pattern: plain, JSON-serialisable data (no Maps, no undefined: absent values are
 * null) shared by the command line, the server, the app's cutting-list screen and the print set.
 * Lengths in inches; every count already multiplied by ring repeats and by the block count.
 */

/** One patch of one section template and what it is cut from. */
export interface CuttingListPatch {
  sectionId: string;
  sectionLabel: string;
  /** `A1`, `B3` … */
  patchLabel: string;
  patchNumber: number;
  /** Fabric of a plain patch; null for a strip-set patch or a patch without fabric. */
  fabricId: string | null;
  /** Strip set the patch is sub-cut from, or null. */
  stripSetId: string | null;
  /** Rough-cut size (shorter × longer side), rounded up to ⅛ in.; for a strip-set patch, the sub-cut. */
  cutWidthIn: number;
  cutLengthIn: number;
  /** Direction of the rectangle's first side on the template, degrees (for placing the piece). */
  rectangleAngleDeg: number;
  /** How many of this patch the whole pattern needs: ring repeats × block count. */
  count: number;
  /** Whether the size is the rough cut the designer set for the patch (`roughCut`), not the computed one. */
  roughCutSetByDesigner: boolean;
}

/** Equal rough-cut pieces of one fabric, and the strips they come from. */
export interface CuttingListPieceGroup {
  widthIn: number;
  lengthIn: number;
  count: number;
  patchLabels: string[];
  /** Strips across the WOF; null when the piece is longer than the WOF both ways (see `lengthwiseIn`). */
  stripWidthIn: number | null;
  pieceLengthIn: number | null;
  piecesPerStrip: number | null;
  stripCount: number;
  /** Fabric length for pieces too long for the WOF, cut along the length instead; 0 otherwise. */
  lengthwiseIn: number;
}

/** Strips of one fabric for one strip set. */
export interface CuttingListStripSetStrips {
  stripSetId: string;
  stripIndex: number;
  finishedWidthIn: number;
  cutWidthIn: number;
  stripCount: number;
}

/** Everything to cut from one fabric, and how much to buy. */
export interface CuttingListFabric {
  fabricId: string;
  name: string;
  colour: string;
  usableWofIn: number;
  pieces: CuttingListPieceGroup[];
  stripSetStrips: CuttingListStripSetStrips[];
  pieceCount: number;
  /** Strips across the WOF, for pieces and for strip sets. */
  stripCount: number;
  /** Total length of those strips: stripCount × usable WOF, in inches. */
  totalStripLengthIn: number;
  /** Fabric taken off the bolt by the strips (and lengthwise pieces), before rounding, in inches. */
  fabricLengthIn: number;
  /** Yardage to buy: fabricLengthIn rounded up to ⅛ yd (4.5 in.), in inches, in yards and in eighths of a yard. */
  yardageIn: number;
  yardageYd: number;
  yardageEighths: number;
}

/** A strip set: its strips, the sewn width and the sub-cuts the pattern needs. */
export interface CuttingListStripSet {
  stripSetId: string;
  name: string | null;
  /** What quilters see: the designer's name, or "Strip set n" for the n-th set of the list (never the id). */
  displayName: string;
  strips: Array<{ fabricId: string; finishedWidthIn: number; cutWidthIn: number }>;
  /** Width of the sewn set (finished + 2 × allowance). */
  sewnWidthIn: number;
  /** Sub-cut length: the designer's (`subCutLengthIn`), else the longest patch extent along the strips + 2 × (allowance + margin), rounded up to ⅛ in. */
  subCutLengthIn: number;
  /** Whether the sub-cut length is the one the designer set. */
  subCutSetByDesigner: boolean;
  /** Sub-cuts needed: patches using the set × ring repeats × blocks. */
  subCutCount: number;
  /** Sub-cuts from one sewn set across the WOF: floor(shortest usable WOF of its fabrics / sub-cut length). */
  subCutsPerSet: number;
  /** Sewn sets needed (each strip of the set is cut this many times across the WOF). */
  setCount: number;
  patchLabels: string[];
}

/** Something the cutting list could not handle, or that the designer should know. */
export interface CuttingListProblem {
  sectionId: string | null;
  patchLabel: string | null;
  message: string;
}

/** The cutting list of a pattern. */
export interface CuttingList {
  title: string;
  seamAllowanceIn: number;
  piecingMarginIn: number;
  blockCount: number;
  patches: CuttingListPatch[];
  fabrics: CuttingListFabric[];
  stripSets: CuttingListStripSet[];
  /** Sum of the yardages, in inches. */
  totalYardageIn: number;
  problems: CuttingListProblem[];
}
