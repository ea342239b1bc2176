import type { Point, SectionKind } from '../document/index';

/**
 * What the print set draws for one template, in the pattern's drawing plane (inches, y down, as seen
 * from the front of the block). Built from the document by `buildPrintTemplates`; the layout and the
 * PDF writer know nothing else about sections.
 */
export interface PrintTemplate {
  /** Unique id of the template (the section id). */
  id: string;
  sectionId: string;
  sectionLabel: string;
  kind: SectionKind;
  /** The section outline: the outer sewing line, a closed ring. */
  sewingLine: Point[];
  /** The cutting line (sewing line plus seam allowance), a closed ring around the sewing line. */
  cuttingLine: Point[];
  /** Seams inside the section (sewing lines between patches). */
  seams: PrintSegment[];
  patches: PrintPatch[];
  /** Lines where a strip-set seam must land. */
  guideLines: PrintSegment[];
  /** Matching marks on curved edges. */
  matchingMarks: PrintMatchingMark[];
  /** Which way the orientation arrow beside the section label points. */
  orientation: PrintOrientationArrow;
  /** Whether the template may turn by any angle on the sheet (arcs and wedges), not only by 90°. */
  freeRotation: boolean;
  /** How many prints the copies plan asks for. */
  copies: number;
  /** Area inside the cutting line, square inches (one copy). */
  areaSqIn: number;
  /** Free note for the quilter. */
  note?: string;
}

/** A straight line from a to b. */
export interface PrintSegment {
  a: Point;
  b: Point;
}

/** One patch: its label (A1 …), fabric, and where the label sits. */
export interface PrintPatch {
  label: string;
  fabricName?: string;
  /** The strip set the patch is cut from, as quilters call it (its name, or "Strip set for B1"). */
  stripSetName?: string;
  polygon: Point[];
  labelAt: Point;
}

/** A short tick across a curved edge; `normal` is a unit vector across the edge. */
export interface PrintMatchingMark {
  at: Point;
  normal: Point;
  label?: string;
}

/** An arrow toward the top of the block (or toward the medallion's centre), drawn beside the section label. */
export interface PrintOrientationArrow {
  /** Unit vector the arrow points along, in the drawing plane. */
  direction: Point;
  /** What the arrow points to, e.g. "top of block" or "centre". */
  towards: string;
}
