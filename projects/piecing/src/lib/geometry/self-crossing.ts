import Flatbush from 'flatbush';
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

/** What {@link checkSelfCrossing} found, and how much work it took. */
export interface SelfCrossingCheck {
  /** The first crossing; null when there is none, or when the check stopped before finishing. */
  crossing: SelfCrossing | null;
  /** Whether every pair that could meet was compared (false: the comparison budget ran out first). */
  complete: boolean;
  /** Pairs of edges compared exactly (pairs whose boxes meet). */
  comparisons: number;
}

/**
 * Finds the first place (the pair of edges i < j with the smallest i, then the smallest j) where two
 * non-adjacent edges of the closed ring meet (cross, touch or overlap), or null when the ring is simple.
 */
export function findSelfCrossing(ring: readonly Point[], toleranceIn = GEOMETRY_EPSILON_IN): SelfCrossing | null {
  return checkSelfCrossing(ring, { toleranceIn }).crossing;
}

/**
 * {@link findSelfCrossing} with a budget of exact comparisons. The edges' boxes (grown by the tolerance)
 * go into a static spatial index (flatbush, a packed Hilbert R-tree); each edge, in order, is compared
 * only with the later edges whose boxes meet its own, so the first edge with a hit ends the search and
 * the answer is the one comparing every pair would give. Outlines cost about n log n (a circle of 2,000
 * edges: a few thousand comparisons); only shapes whose long edges all share one region (a star of
 * hundreds of spikes) still need many, which is what the budget bounds.
 */
export function checkSelfCrossing(
  ring: readonly Point[],
  options: { toleranceIn?: number; maxComparisons?: number } = {},
): SelfCrossingCheck {
  const toleranceIn = options.toleranceIn ?? GEOMETRY_EPSILON_IN;
  const maxComparisons = options.maxComparisons ?? Infinity;
  const n = ring.length;
  if (n < 4) return { crossing: null, complete: true, comparisons: 0 };
  const index = new Flatbush(n);
  for (let i = 0; i < n; i++) {
    const a = ring[i];
    const b = ring[(i + 1) % n];
    index.add(Math.min(a.x, b.x) - toleranceIn, Math.min(a.y, b.y) - toleranceIn, Math.max(a.x, b.x) + toleranceIn, Math.max(a.y, b.y) + toleranceIn);
  }
  index.finish();
  let comparisons = 0;
  for (let i = 0; i < n - 2; i++) {
    const a = ring[i];
    const b = ring[(i + 1) % n];
    let bestJ = -1;
    let best: Point | null = null;
    index.search(
      Math.min(a.x, b.x) - toleranceIn,
      Math.min(a.y, b.y) - toleranceIn,
      Math.max(a.x, b.x) + toleranceIn,
      Math.max(a.y, b.y) + toleranceIn,
      (j) => {
        // Only later, non-adjacent edges (the last edge is adjacent to the first), and only one that
        // would come before the best so far.
        if (j < i + 2 || (i === 0 && j === n - 1) || (bestJ !== -1 && j >= bestJ)) return false;
        comparisons++;
        const hit = segmentIntersection(a, b, ring[j], ring[(j + 1) % n], toleranceIn);
        if (hit.kind === 'none') return false;
        best = hit.kind === 'point' ? hit.point : hit.from;
        bestJ = j;
        return false;
      },
    );
    if (best) return { crossing: { edgeA: i, edgeB: bestJ, point: best }, complete: true, comparisons };
    if (comparisons > maxComparisons) return { crossing: null, complete: false, comparisons };
  }
  // Adjacent edges that fold back over each other also make a ring non-simple.
  for (let i = 0; i < n; i++) {
    const prev = ring[(i - 1 + n) % n];
    const p = ring[i];
    const next = ring[(i + 1) % n];
    if (foldsBackAt(prev, p, next, toleranceIn)) {
      const crossing = { edgeA: (i - 1 + n) % n, edgeB: i, point: distance(prev, p) < distance(p, next) ? prev : next };
      return { crossing, complete: true, comparisons };
    }
  }
  return { crossing: null, complete: true, comparisons };
}
