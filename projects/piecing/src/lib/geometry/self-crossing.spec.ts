import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Point } from '../document/pattern-schema';
import { foldsBackAt } from './fold-back';
import { segmentIntersection } from './segment';
import { seededRandom } from '../../../../../tests/support/random';
import { parsePatternDocument } from '../document/parse-pattern';
import { MAX_CROSSING_COMPARISONS } from '../document/validate-geometry';
import { checkSelfCrossing, findSelfCrossing } from './self-crossing';
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

  it('property: random polygons of many edges give the same first crossing as comparing every pair', () => {
    // Rings of 20–400 vertices: star-like ones (sorted angles, random radii: usually simple) and random
    // walks (usually crossing), on a 0.01 in. grid so touching and collinear edges happen too.
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 2 ** 31 - 1 }), fc.integer({ min: 20, max: 400 }), fc.boolean(), (seed, n, starLike) => {
        const rnd = seededRandom(seed);
        const snap = (v: number) => Math.round(v * 100) / 100;
        const ring: Point[] = starLike
          ? Array.from({ length: n }, (_, i) => (i + rnd() * 0.9) * (2 * Math.PI) / n)
              .map((t) => ({ r: 1 + rnd() * 9, t }))
              .map(({ r, t }) => ({ x: snap(r * Math.cos(t)), y: snap(r * Math.sin(t)) }))
          : Array.from({ length: n }, () => ({ x: snap(rnd() * 10), y: snap(rnd() * 10) }));
        expect(findSelfCrossing(ring)).toEqual(bruteForce(ring));
      }),
      { numRuns: 300 },
    );
  });

  it('compares few pairs on a 2,000-edge circle and stops a spiky star at the budget', () => {
    const circle = Array.from({ length: 2000 }, (_, i) => ({ x: 15 * Math.cos((2 * Math.PI * i) / 2000), y: 15 * Math.sin((2 * Math.PI * i) / 2000) }));
    const check = checkSelfCrossing(circle);
    expect(check).toMatchObject({ crossing: null, complete: true });
    // Comparing every pair would be 2,000 × 1,997 / 2 ≈ 2 million comparisons.
    expect(check.comparisons).toBeLessThan(10_000);
    const star = Array.from({ length: 2000 }, (_, i) => {
      const r = i % 2 ? 15 : 0.5;
      const t = (2 * Math.PI * i) / 2000;
      return { x: r * Math.cos(t), y: r * Math.sin(t) };
    });
    const unbounded = checkSelfCrossing(star);
    expect(unbounded).toMatchObject({ crossing: null, complete: true });
    expect(unbounded.comparisons).toBeGreaterThan(MAX_CROSSING_COMPARISONS);
    const bounded = checkSelfCrossing(star, { maxComparisons: 1000 });
    expect(bounded.complete).toBe(false);
    expect(bounded.comparisons).toBeLessThan(1000 + 2000);
  });

  it('a document of spiky stars is refused as too intricate once their checks together pass the budget', () => {
    // One 1,200-vertex star fits the document's budget (about 170,000 comparisons), two do not.
    const star = (cx: number) =>
      Array.from({ length: 1200 }, (_, i) => {
        const r = i % 2 ? 15 : 0.5;
        const t = (2 * Math.PI * i) / 1200;
        return { x: Math.round((cx + r * Math.cos(t)) * 1000) / 1000, y: Math.round((50 + r * Math.sin(t)) * 1000) / 1000 };
      });
    const result = parsePatternDocument({
      formatVersion: 2,
      title: 'Stars',
      canvas: { widthIn: 100, heightIn: 100 },
      sections: [0, 1].map((k) => ({ id: `s${k}`, label: 'AB'.charAt(k), geometry: { kind: 'straight', vertices: star(20 + 40 * k) } })),
    });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues).toEqual([{ path: 'sections.1.geometry.vertices', message: expect.stringMatching(/too intricate to check/) }]);
  });
});
