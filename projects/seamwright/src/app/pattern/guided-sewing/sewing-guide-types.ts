import type { DerivedPatch, Point } from '@seamwright/piecing';

/** What a quilter takes from the cut pile for one patch. */
export interface GuidePiece {
  /** A plain piece of one fabric, a slice of a sewn strip set, or a patch without fabric yet. */
  kind: 'fabric' | 'strip-set' | 'none';
  /** The fabric's name, or the strip set's name as quilters see it (never an id). */
  name: string;
  /** Swatch colour, `#rrggbb`; null for a strip set (its strips are listed) or no fabric. */
  colour: string | null;
  /** The strips of a strip set, first to last. */
  strips: { name: string; colour: string }[];
  /** Rough-cut size (or the strip-set slice) from the cutting list, e.g. "2 ¾ × 4 ⅛ in.". */
  sizeText: string;
}

/** One patch added to the foundation. */
export interface PieceStep {
  kind: 'piece';
  /** Place among the section's piecing steps, from 1. */
  position: number;
  patchNumber: number;
  /** `B3`. */
  patchLabel: string;
  /** The patch's identity in the section's derived patches (for the drawing). */
  patchIndex: number;
  piece: GuidePiece;
  /** The line to sew (the stretch shared with the patches sewn before); null for the first patch. */
  sewLine: { from: Point; to: Point } | null;
  /** How to press once sewn; null for the first patch (nothing sewn yet). */
  press: string | null;
  /** What to pre-trim before the next patch; null after the last patch. */
  preTrim: string | null;
  /** Why this patch cannot be sewn here, when the section's order fails at it. */
  caution: string | null;
}

/** Trimming the pieced section on its cutting line. */
export interface TrimStep {
  kind: 'trim';
  text: string;
}

export type SectionStep = PieceStep | TrimStep;

/** A section as guided sewing walks it: its piecing steps, then trimming. */
export interface SectionGuide {
  id: string;
  label: string;
  /** Copies to sew: ring repeats × blocks. */
  copies: number;
  /** Ring copies per block (1 without a ring repeat). */
  ringCount: number;
  note: string | null;
  /** The section's patches from the piecing library, drawn as they are. */
  patches: DerivedPatch[];
  steps: SectionStep[];
}

/** One join of the joining plan, done once per block. */
export interface JoinGuideStep {
  number: number;
  kind: 'ring' | 'join';
  label: string;
  partA: string;
  partB: string;
  /** Sections the join brings together (both parts): their copies of the block are joined when it is done. */
  sectionIds: string[];
  /** The seam of the join, as paths in the drawing plane (front of the block). */
  seamPaths: Point[][];
  seamText: string;
  press: string;
  /** Matching marks to pin together, in the drawing plane. */
  marks: Point[];
}

/** Everything guided sewing shows for a pattern. */
export interface SewingGuide {
  /** Sections in joining order. */
  sections: SectionGuide[];
  joins: JoinGuideStep[];
  /** Whether the joins are the piecing library's default plan (the designer has set none). */
  joinsAreDefault: boolean;
  blockCount: number;
  /** Every patch of every ring copy, for drawing the joins (front of the block). */
  blockPatches: { sectionId: string; polygon: Point[]; colour: string | null }[];
  /** What is wrong with the joining plan, in words (insets, parts that do not touch …). */
  problems: string[];
}

/** Which part guided sewing is on: a section (and its copy) or the joins (and the block). */
export interface GuidedPlace {
  /** A section id, or {@link JOINS_PART}. */
  part: string;
  /** The copy of the section, or the block for the joins, from 1. */
  copy: number;
  /** The step within the part, from 0. */
  step: number;
}

/** The `part` of the joins in a {@link GuidedPlace}. */
export const JOINS_PART = '#joins';
