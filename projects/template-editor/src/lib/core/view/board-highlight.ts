import type { Point } from '@seamwright/piecing';

/**
 * Something a panel asks the board to point out over the drawing (e.g. the seam of one join of the
 * joining plan): paths and points in document inches, drawn through the board's view.
 */
export interface BoardHighlight {
  /** Open polylines to draw boldly (a seam, possibly in several pieces). */
  paths: Point[][];
  /** Points to mark (matching marks on a curved seam). */
  marks: Point[];
}
