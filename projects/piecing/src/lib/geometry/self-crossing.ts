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
 * Finds the first place (the pair of edges i < j with the smallest i, then the smallest j) where two
 * non-adjacent edges of the closed ring meet (cross, touch or overlap), or null when the ring is simple.
 * Edges are swept in order of their leftmost x, so only edges whose x ranges overlap are compared: close
 * to O(n log n) for outlines, whose edges seldom share x ranges widely (flattened curves give thousands).
 */
export function findSelfCrossing(ring: readonly Point[], toleranceIn = GEOMETRY_EPSILON_IN): SelfCrossing | null {
  const n = ring.length;
  if (n < 4) return null;
  const minX = new Float64Array(n);
  const maxX = new Float64Array(n);
  const minY = new Float64Array(n);
  const maxY = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const a = ring[i];
    const b = ring[(i + 1) % n];
    minX[i] = Math.min(a.x, b.x) - toleranceIn;
    maxX[i] = Math.max(a.x, b.x) + toleranceIn;
    minY[i] = Math.min(a.y, b.y) - toleranceIn;
    maxY[i] = Math.max(a.y, b.y) + toleranceIn;
  }
  const order = Array.from({ length: n }, (_, i) => i).sort((p, q) => minX[p] - minX[q]);
  let best: SelfCrossing | null = null;
  for (let s = 0; s < n; s++) {
    const e = order[s];
    for (let t = s + 1; t < n && minX[order[t]] <= maxX[e]; t++) {
      const f = order[t];
      const i = Math.min(e, f);
      const j = Math.max(e, f);
      if (j - i < 2 || (i === 0 && j === n - 1)) continue; // the same edge or adjacent ones
      if (best && (i > best.edgeA || (i === best.edgeA && j >= best.edgeB))) continue; // cannot come first
      if (maxY[j] < minY[i] || minY[j] > maxY[i]) continue;
      const hit = segmentIntersection(ring[i], ring[(i + 1) % n], ring[j], ring[(j + 1) % n], toleranceIn);
      if (hit.kind === 'point') best = { edgeA: i, edgeB: j, point: hit.point };
      else if (hit.kind === 'overlap') best = { edgeA: i, edgeB: j, point: hit.from };
    }
  }
  if (best) return best;
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
