import type { Point } from '../document/pattern-schema';
import { GEOMETRY_EPSILON_IN } from '../tolerance';
import { foldsBackAt } from './fold-back';
import { segmentIntersection } from './segment';
import { distance } from './vector';

/** Where an outline crosses or touches itself: edge i runs from vertex i to vertex i + 1. */
export interface SelfCrossing {
  edgeA: number;
  edgeB: number;
  point: Point;
}

/**
 * Finds the first place where two non-adjacent edges of the closed ring meet (cross, touch or overlap),
 * or null when the ring is simple. O(n²) with a bounding-box shortcut; outlines have at most a few
 * thousand vertices.
 */
export function findSelfCrossing(ring: readonly Point[], toleranceIn = GEOMETRY_EPSILON_IN): SelfCrossing | null {
  const n = ring.length;
  if (n < 4) return null;
  for (let i = 0; i < n; i++) {
    const a1 = ring[i];
    const a2 = ring[(i + 1) % n];
    const aMinX = Math.min(a1.x, a2.x) - toleranceIn;
    const aMaxX = Math.max(a1.x, a2.x) + toleranceIn;
    const aMinY = Math.min(a1.y, a2.y) - toleranceIn;
    const aMaxY = Math.max(a1.y, a2.y) + toleranceIn;
    for (let j = i + 2; j < n; j++) {
      if (i === 0 && j === n - 1) continue; // adjacent through the closing edge
      const b1 = ring[j];
      const b2 = ring[(j + 1) % n];
      if (Math.max(b1.x, b2.x) < aMinX || Math.min(b1.x, b2.x) > aMaxX) continue;
      if (Math.max(b1.y, b2.y) < aMinY || Math.min(b1.y, b2.y) > aMaxY) continue;
      const hit = segmentIntersection(a1, a2, b1, b2, toleranceIn);
      if (hit.kind === 'point') return { edgeA: i, edgeB: j, point: hit.point };
      if (hit.kind === 'overlap') return { edgeA: i, edgeB: j, point: hit.from };
    }
  }
  // Adjacent edges that fold back over each other also make a ring non-simple.
  for (let i = 0; i < n; i++) {
    const prev = ring[(i - 1 + n) % n];
    const p = ring[i];
    const next = ring[(i + 1) % n];
    if (foldsBackAt(prev, p, next, toleranceIn)) {
      return { edgeA: (i - 1 + n) % n, edgeB: i, point: distance(prev, p) < distance(p, next) ? prev : next };
    }
  }
  return null;
}
