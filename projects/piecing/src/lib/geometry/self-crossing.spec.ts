import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Point } from '../document/pattern-schema';
import { foldsBackAt } from './fold-back';
import { segmentIntersection } from './segment';
import { findSelfCrossing } from './self-crossing';
import { distance } from './vector';

/** Every pair of non-adjacent edges in order (i, then j): what findSelfCrossing must agree with. */
function bruteForce(ring: readonly Point[], tol = 1e-7) {
  const n = ring.length;
  if (n < 4) return null;
  for (let i = 0; i < n; i++) {
    for (let j = i + 2; j < n; j++) {
      if (i === 0 && j === n - 1) continue;
      const hit = segmentIntersection(ring[i], ring[(i + 1) % n], ring[j], ring[(j + 1) % n], tol);
      if (hit.kind === 'point') return { edgeA: i, edgeB: j, point: hit.point };
      if (hit.kind === 'overlap') return { edgeA: i, edgeB: j, point: hit.from };
    }
  }
  for (let i = 0; i < n; i++) {
    const prev = ring[(i - 1 + n) % n];
    const next = ring[(i + 1) % n];
    if (foldsBackAt(prev, ring[i], next, tol)) return { edgeA: (i - 1 + n) % n, edgeB: i, point: distance(prev, ring[i]) < distance(ring[i], next) ? prev : next };
  }
  return null;
}

describe('findSelfCrossing', () => {
  it('names the bow tie crossing and passes a square', () => {
    expect(findSelfCrossing([{ x: 0, y: 0 }, { x: 4, y: 4 }, { x: 4, y: 0 }, { x: 0, y: 4 }])).toEqual({ edgeA: 0, edgeB: 2, point: { x: 2, y: 2 } });
    expect(findSelfCrossing([{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 4 }, { x: 0, y: 4 }])).toBeNull();
  });

  it('property: the sweep finds the same first crossing as comparing every pair', () => {
    // Points on a small grid, so rings touch, overlap and cross each other often.
    const point = fc.record({ x: fc.integer({ min: 0, max: 6 }), y: fc.integer({ min: 0, max: 6 }) });
    fc.assert(
      fc.property(fc.array(point, { minLength: 3, maxLength: 14 }), (ring) => {
        expect(findSelfCrossing(ring)).toEqual(bruteForce(ring));
      }),
      { numRuns: 2000 },
    );
  });
});
