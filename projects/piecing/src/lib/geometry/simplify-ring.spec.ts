import { describe, expect, it } from 'vitest';
import type { Point } from '../document/pattern-schema';
import { simplifyClosedRing } from './simplify-ring';

describe('simplifyClosedRing', () => {
  const circle = (n: number, r: number): Point[] => Array.from({ length: n }, (_, i) => ({ x: r * Math.cos((2 * Math.PI * i) / n), y: r * Math.sin((2 * Math.PI * i) / n) }));

  it('keeps a chord per step the sagitta allows: r (1 − cos(θ/2)) ≤ tolerance', () => {
    // A circle of radius 10 in 3600 points, to within 0.05: the sagitta r(1 − cos(θ/2)) of a chord
    // spanning θ stays under 0.05 for θ ≤ 2·acos(0.995) ≈ 0.2 rad, so at least 2π/0.2 ≈ 31 chords.
    const kept = simplifyClosedRing(circle(3600, 10), 0.05);
    expect(kept.length).toBeGreaterThanOrEqual(32);
    expect(kept.length).toBeLessThanOrEqual(64);
    // Every kept point is a point of the ring, in ring order.
    expect(kept[0]).toEqual({ x: 10, y: 0 });
  });

  it('leaves a square and a triangle whole and drops points on a straight edge', () => {
    const square = [{ x: 0, y: 0 }, { x: 2, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 4 }, { x: 0, y: 4 }];
    expect(simplifyClosedRing(square, 0.01)).toEqual([{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 4 }, { x: 0, y: 4 }]);
    const triangle = [{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 0, y: 1 }];
    expect(simplifyClosedRing(triangle, 5)).toEqual(triangle);
  });
});
