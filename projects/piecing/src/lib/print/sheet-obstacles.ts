import type { PlannedSheet } from './layout-types';
import type { RectIn } from './paper';
import type { SheetFrame } from './sheet-frame';

/**
 * What text and maps drawn among a sheet's templates keep clear of: the test squares, and every
 * template's box with its caption.
 */
export function sheetObstacles(frame: SheetFrame, sheet: PlannedSheet): RectIn[] {
  return [frame.testBlock, ...sheet.placements.flatMap((p) => (p.caption ? [p.rect, p.caption.rect] : [p.rect]))];
}

/** True when the two boxes come nearer than `gap` (inches) to each other. */
export function rectsOverlap(a: RectIn, b: RectIn, gap: number): boolean {
  return a.x < b.x + b.width + gap && b.x < a.x + a.width + gap && a.y < b.y + b.height + gap && b.y < a.y + a.height + gap;
}
