import { CM_PER_INCH, type PatternDocument } from '@seamwright/piecing';
import { GRID_SNAP_STEP_IN, type GridSnap } from '../snapping/snapping';
import type { BoardUnit } from '../view/grid-lines';
import { findSection, moveSection } from './section-commands';

/** The four arrow keys and the direction each moves the selection (x right, y down, as the document). */
export const NUDGE_DIRECTIONS: Readonly<Record<string, { dx: number; dy: number; word: NudgeWord }>> = {
  ArrowRight: { dx: 1, dy: 0, word: 'right' },
  ArrowLeft: { dx: -1, dy: 0, word: 'left' },
  ArrowUp: { dx: 0, dy: -1, word: 'up' },
  ArrowDown: { dx: 0, dy: 1, word: 'down' },
};

/** Which way a nudge went, in words. */
export type NudgeWord = 'right' | 'left' | 'up' | 'down';

/** Step of a nudge when the grid snap is off: ⅛ in. (a quilter's smallest common ruler mark). */
const UNSNAPPED_STEP_IN = 1 / 8;

/**
 * How far one arrow press moves the selection, in inches: the snap step of the grid (⅛ in. when the
 * grid is off); with Shift, 1 in., or 1 cm when the board measures in centimetres.
 */
export function nudgeStepIn(grid: GridSnap, unit: BoardUnit, large: boolean): number {
  if (large) return unit === 'cm' ? 1 / CM_PER_INCH : 1;
  return grid === 'off' ? UNSNAPPED_STEP_IN : GRID_SNAP_STEP_IN[grid];
}

/**
 * Moves a whole section by `stepIn` in the direction of an arrow key (the same move a drag makes:
 * outline, seams and patch anchors together). Unknown keys or sections leave the document as it is.
 */
export function nudgeSection(document: PatternDocument, sectionId: string, key: string, stepIn: number): PatternDocument {
  const dir = NUDGE_DIRECTIONS[key];
  if (!dir || !findSection(document, sectionId) || !(stepIn > 0)) return document;
  return moveSection(document, sectionId, dir.dx * stepIn, dir.dy * stepIn);
}
