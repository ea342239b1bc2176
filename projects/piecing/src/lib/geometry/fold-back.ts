import type { Point } from '../document/pattern-schema';

/*
 * Shared by cleanRing (which drops such tips) and findSelfCrossing (which reports them); not part of
 * the library's public API.
 */

/**
 * Whether the path prev → p → next turns back on itself at `p`: both edges have length, they point in
 * opposite directions, and they lie within `toleranceIn` of one line (a zero-width spike).
 */
export function foldsBackAt(prev: Point, p: Point, next: Point, toleranceIn: number): boolean {
  const ax = p.x - prev.x;
  const ay = p.y - prev.y;
  const bx = next.x - p.x;
  const by = next.y - p.y;
  const la = Math.hypot(ax, ay);
  const lb = Math.hypot(bx, by);
  if (la === 0 || lb === 0) return false;
  return Math.abs(ax * by - ay * bx) / Math.max(la, lb) <= toleranceIn && ax * bx + ay * by < 0;
}
