import type { Point } from '../document/pattern-schema';
import { GEOMETRY_EPSILON_IN } from '../tolerance';
import { foldsBackAt } from './fold-back';
import { distance, distanceToSegment } from './vector';

/**
 * Cleans an outline ring: drops a repeated closing point, consecutive duplicates (closer than
 * `toleranceIn`) and points that lie on the straight line between their neighbours (within
 * `toleranceIn`), including the tips of zero-width spikes. Returns a new array; the input is untouched.
 * The result may have fewer than three points when the ring has no area.
 */
export function cleanRing(ring: readonly Point[], toleranceIn = GEOMETRY_EPSILON_IN): Point[] {
  let points = ring.map((p) => ({ x: p.x, y: p.y }));
  // Drop duplicates, including the closing point that repeats the first.
  const deduped: Point[] = [];
  for (const p of points) {
    if (deduped.length === 0 || distance(deduped[deduped.length - 1], p) > toleranceIn) deduped.push(p);
  }
  while (deduped.length > 1 && distance(deduped[0], deduped[deduped.length - 1]) <= toleranceIn) deduped.pop();
  points = deduped;
  // Drop collinear points until none is left; each pass is O(n) and removes at least one point.
  let changed = true;
  while (changed && points.length >= 3) {
    changed = false;
    const kept: Point[] = [];
    const n = points.length;
    for (let i = 0; i < n; i++) {
      const prev = kept.length > 0 ? kept[kept.length - 1] : points[(i - 1 + n) % n];
      const next = points[(i + 1) % n];
      const p = points[i];
      const between = distanceToSegment(p, prev, next) <= toleranceIn;
      // A spike tip (the ring turns straight back) is also on the line through its neighbours.
      const spike = isSpikeTip(prev, p, next, toleranceIn);
      if (between || spike || distance(prev, p) <= toleranceIn) {
        changed = true;
        continue;
      }
      kept.push(p);
    }
    // The first point was judged against the last original point, which may since have gone.
    points = kept;
  }
  return points;
}

function isSpikeTip(prev: Point, p: Point, next: Point, toleranceIn: number): boolean {
  if ((prev.x === p.x && prev.y === p.y) || (next.x === p.x && next.y === p.y)) return true;
  return foldsBackAt(prev, p, next, toleranceIn);
}
