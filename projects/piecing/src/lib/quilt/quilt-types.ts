/*
 * A quilt plan: what the library works out for a quilt layout in one size and one colourway
 * (design §11, docs/quilt-layout.md). Plain, JSON-serialisable data (absent values are null); every
 * length in inches, finished unless named `cut…`; yards as decimals.
 */
import type { CuttingList } from '../fabrication/cutting-list/cutting-list-types';

/** Width and height in inches. */
export interface SizeIn {
  width: number;
  height: number;
}

/** A 2-D affine transform [a b c d e f]: x' = a·x + c·y + e, y' = b·x + d·y + f (as in SVG and canvas). */
export type AffineTransform = readonly [number, number, number, number, number, number];

/** One block position of the quilt. */
export interface QuiltPlanCell {
  /** Straight: row from the top. On point: the horizontal row of block centres from the top (0 … 2·rows − 2). */
  row: number;
  /** Straight: column from the left. On point: the block's place along its row from the left. */
  col: number;
  /** The designer's turn of the block, clockwise on screen (the 45° of an on-point setting not included). */
  rotateDeg: 0 | 90 | 180 | 270;
  mirrored: boolean;
  /** A plain block of the alternate fabric in place of the pieced block. */
  alternate: boolean;
  /** Centre of the block on the quilt, from the quilt's top-left corner (outside of the outer border). */
  centreIn: { x: number; y: number };
  /**
   * Maps the block's drawing coordinates (the document's plane: x right, y down) onto the quilt: scales the
   * drawn block's bounds to the finished block size, mirrors, turns (on point 45° more), and moves its
   * centre onto `centreIn`.
   */
  transform: AffineTransform;
}

/** A rectangle to draw on the quilt picture (sashing, cornerstones, borders), in quilt coordinates. */
export interface QuiltRect {
  xIn: number;
  yIn: number;
  widthIn: number;
  heightIn: number;
  fabricId: string | null;
}

/** A polygon to draw on the quilt picture (setting triangles), in quilt coordinates. */
export interface QuiltPolygon {
  points: Array<{ x: number; y: number }>;
  fabricId: string | null;
}

/** On-point setting triangles: the squares they are cut from. */
export interface QuiltSettingTriangles {
  fabricId: string | null;
  /** Side triangles along the edges: 2(columns − 1) + 2(rows − 1). */
  sideTriangles: number;
  /** Cut square for the side triangles: d + 1¼ in. rounded up to ⅛ in., cut twice on the diagonal (4 each). */
  sideCutSquareIn: number;
  sideSquares: number;
  cornerTriangles: number;
  /** Cut square for the corners: d/2 + ⅞ in. rounded up to ⅛ in., cut once on the diagonal (2 each). */
  cornerCutSquareIn: number;
  cornerSquares: number;
}

/**
 * Sashing strips and cornerstones where they cross. Straight: between blocks only. On point: every block
 * framed (strips between the turned blocks along the diagonals and between the outer blocks and the setting
 * triangles), all in `diagonalStrips`.
 */
export interface QuiltSashing {
  fabricId: string;
  widthIn: number;
  /** Straight: strips between blocks side by side in a row: cut (width + 2·allowance) × (block height + 2·allowance). On point: count 0. */
  verticalStrips: { count: number; cutWidthIn: number; cutLengthIn: number };
  /** Straight: strips between rows, one under each block: cut (width + 2·allowance) × (block width + 2·allowance). On point: count 0. */
  horizontalStrips: { count: number; cutWidthIn: number; cutLengthIn: number };
  /** On point: the 4·columns·rows strips along the block sides, cut (width + 2·allowance) × (block side + 2·allowance); null when straight. */
  diagonalStrips: { count: number; cutWidthIn: number; cutLengthIn: number } | null;
  /** Squares where sashing strips cross (of the cornerstone fabric, else the sashing fabric). */
  cornerstones: { count: number; cutSquareIn: number; fabricId: string };
}

/** Plain alternate blocks. */
export interface QuiltAlternateBlocks {
  fabricId: string;
  count: number;
  cutWidthIn: number;
  cutHeightIn: number;
}

/** One border, sides first at the measured height, then top and bottom at the measured width. */
export interface QuiltPlanBorder {
  /** 1 = innermost. */
  index: number;
  fabricId: string;
  widthIn: number;
  /** Strips across the WOF are cut this wide: width + 2·allowance. */
  cutWidthIn: number;
  /** Quilt (inner) size the border is sewn to, finished. */
  innerSizeIn: SizeIn;
  /** Two side strips, cut to the height measured through the centre (+ 2·allowance): sewn first. */
  sides: { count: 2; cutLengthIn: number };
  /** Then two strips for top and bottom, cut to the width measured through the centre, side borders included. */
  topAndBottom: { count: 2; cutLengthIn: number };
  /** Sum of the four cut lengths. */
  totalLengthIn: number;
  /** Strips across the WOF joined end to end: ceil(total length / usable WOF). */
  strips: number;
  /** Joins in the long strip: strips − 1. */
  joins: number;
  usableWofIn: number;
}

export interface QuiltBinding {
  fabricId: string | null;
  strips: number;
  stripWidthIn: number;
  perimeterIn: number;
  extraIn: number;
  /** Perimeter + extra. */
  lengthIn: number;
  usableWofIn: number;
  /** strips × strip width, rounded up to ⅛ yd, in yards. */
  yards: number;
}

export type BackingSeams = 'across' | 'lengthwise' | 'none';

export interface QuiltBacking {
  fabricId: string | null;
  marginIn: number;
  widthIn: number;
  heightIn: number;
  usableWofIn: number;
  /** Full widths of fabric sewn together. */
  widths: number;
  /** Which way the seams run across the quilt: "across" = horizontal, "lengthwise" = vertical, "none" = one width. */
  seams: BackingSeams;
  /** Length of each width (the side the widths run along). */
  widthLengthIn: number;
  /** widths × widthLengthIn. */
  lengthIn: number;
  /** lengthIn rounded up to ⅛ yd, in yards. */
  yards: number;
}

/** One rectangle size cut from a fabric for the setting of the quilt (not the blocks). */
export interface QuiltSettingPieceGroup {
  /** What it is for: "sashing", "cornerstone", "alternate block", "side setting triangle square", … */
  use: string;
  widthIn: number;
  lengthIn: number;
  count: number;
  stripWidthIn: number | null;
  piecesPerStrip: number | null;
  stripCount: number;
  /** Fabric length for pieces too long for the WOF, cut along the length; 0 otherwise. */
  lengthwiseIn: number;
}

/** Everything one fabric gives the whole quilt, and how much to buy. */
export interface QuiltFabricNeed {
  id: string;
  name: string;
  colour: string;
  usableWofIn: number;
  /** Fabric length the blocks take (pieces and strip-set strips of the block cutting list for all blocks), inches, before rounding. */
  blocksIn: number;
  /** Setting pieces: sashing, cornerstones, alternate blocks, setting-triangle squares. */
  settingPieces: QuiltSettingPieceGroup[];
  settingIn: number;
  /** Border strips across the WOF. */
  borderStrips: number;
  bordersIn: number;
  bindingStrips: number;
  bindingIn: number;
  backingIn: number;
  /** Sum of the above, before rounding. */
  fabricLengthIn: number;
  /** Rounded up to ⅛ yd. */
  yardageIn: number;
  yards: number;
}

/** What a quilt layout comes to in one size and one colourway. */
export interface QuiltPlan {
  title: string;
  setting: 'straight' | 'on-point';
  /** The named size chosen, or null for the layout's own columns and rows. */
  sizeName: string | null;
  colourwayId: string | null;
  columns: number;
  rows: number;
  /** Finished block size. */
  blockSizeIn: SizeIn;
  /** The block's drawing bounds (sewing lines, ring copies included) the cell transforms start from. */
  blockBoundsIn: { x: number; y: number; width: number; height: number };
  /** Block diagonal on point (w·√2), else null. */
  blockDiagonalIn: number | null;
  /** On point: the diagonal of a sashed unit, (w + sashing)·√2 (= blockDiagonalIn without sashing); else null. */
  unitDiagonalIn: number | null;
  /** Size inside the borders, finished. */
  centreSizeIn: SizeIn;
  finishedSizeIn: SizeIn;
  /** Block positions (pieced and plain). */
  positions: number;
  /** Pieced blocks: positions − plain alternates. */
  blockCount: number;
  cells: QuiltPlanCell[];
  settingTriangles: QuiltSettingTriangles | null;
  /** Setting triangles as drawn (on point), in quilt coordinates. */
  settingTrianglePolygons: QuiltPolygon[];
  sashing: QuiltSashing | null;
  /** Sashing strips and cornerstones as drawn (straight), in quilt coordinates. */
  sashingRects: QuiltRect[];
  /** Sashing strips and cornerstones as drawn on point (turned 45°), in quilt coordinates; empty when straight. */
  sashingPolygons: QuiltPolygon[];
  alternateBlocks: QuiltAlternateBlocks | null;
  borders: QuiltPlanBorder[];
  /** Borders as drawn: per border four rectangles (left, right, top, bottom), in quilt coordinates. */
  borderRects: QuiltRect[];
  binding: QuiltBinding;
  backing: QuiltBacking;
  batting: SizeIn;
  /** The cutting list of the blocks alone, for `blockCount` blocks (the existing planner); shared between plans of one drafting, so read-only. */
  blockCuttingList: CuttingList;
  /** Per fabric, the whole quilt: blocks + setting pieces + borders + binding + backing. */
  fabrics: QuiltFabricNeed[];
  totalYards: number;
  /** Things the designer should know (e.g. a turned non-square block, a missing fabric). */
  problems: string[];
}

/** One row of the size chart. */
export interface QuiltSizeRow {
  name: string;
  columns: number;
  rows: number;
  finishedSizeIn: SizeIn;
  blockCount: number;
  fabrics: Array<{ id: string; name: string; yards: number }>;
  totalYards: number;
}

/** Options of {@link quiltPlan}. */
export interface QuiltPlanOptions {
  /** A named size of the layout (`quilt.sizes[].name`); missing means the layout's own columns and rows. */
  sizeName?: string | null;
  /** A colourway id (`colourways[].id`); missing means the document's own fabrics. */
  colourwayId?: string | null;
}

/** The CLI's `quilt --json` answer (issue 21): lengths in inches, yards as decimals. */
export interface QuiltCliJson {
  finishedSizeIn: SizeIn;
  blockCount: number;
  settingTriangles: null | { sideCutSquareIn: number; sideSquares: number; cornerCutSquareIn: number; cornerSquares: number };
  binding: { strips: number; stripWidthIn: number; lengthIn: number; yards: number };
  backing: { widthIn: number; heightIn: number; widths: number; seams: BackingSeams; yards: number };
  batting: SizeIn;
  fabrics: Array<{ id: string; name: string; yards: number }>;
}

/** Thrown by {@link quiltPlan} when the document has no quilt or names an unknown size or colourway. */
export class QuiltPlanError extends Error {
  constructor(
    message: string,
    /** The field at fault, as a JSON path (`quilt`, `sizeName`, `colourwayId`). */
    readonly field: string,
  ) {
    super(message);
    this.name = 'QuiltPlanError';
  }
}
