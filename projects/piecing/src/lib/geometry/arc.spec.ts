import { describe, expect, it } from 'vitest';
import { CHORD_TOLERANCE_IN } from '../tolerance';
import { arcLength, arcSegmentCount, flattenArc, GeometryInputError, sagitta } from './arc';
import { distance } from './vector';

describe('arc flattening', () => {
  it('follows n = ceil(θ / (2·acos(1 − ε/r))) (docs/design-notes.md#arc-flattening)', () => {
    // r = 8 in., a 45° arc, ε = 0.002 in.: 2·acos(1 − 0.00025) = 0.0447232… rad, θ = 0.785398… → 17.56 → 18.
    expect(arcSegmentCount(8, Math.PI / 4)).toBe(18);
    expect(arcSegmentCount(8, Math.PI / 4, CHORD_TOLERANCE_IN)).toBe(Math.ceil((Math.PI / 4) / (2 * Math.acos(1 - 0.002 / 8))));
    // A larger tolerance needs fewer chords; a full circle at least 3.
    expect(arcSegmentCount(8, Math.PI / 4, 0.02)).toBeLessThan(18);
    expect(arcSegmentCount(1, 2 * Math.PI, 5)).toBe(3);
  });

  it('keeps every chord within the tolerance: sagitta r(1 − cos(φ/2)) (CRC Standard Mathematical Tables)', () => {
    for (const radiusIn of [0.5, 5, 8, 11, 150]) {
      for (const sweepDeg of [10, 45, 90, 180, 360]) {
        const sweepRad = (sweepDeg * Math.PI) / 180;
        const n = arcSegmentCount(radiusIn, sweepRad);
        expect(sagitta(radiusIn, sweepRad / n)).toBeLessThanOrEqual(CHORD_TOLERANCE_IN + 1e-15);
        // One chord fewer would stray beyond it (so n is the least).
        if (n > 1) expect(sagitta(radiusIn, sweepRad / (n - 1))).toBeGreaterThan(CHORD_TOLERANCE_IN);
      }
    }
  });

  it('boundary: a tolerance just at or above the sagitta of 4 chords gives 4, just below gives 5', () => {
    const exact = sagitta(6, Math.PI / 8); // 90° arc in 4 chords of 22.5°
    expect(arcSegmentCount(6, Math.PI / 2, exact * (1 + 1e-9))).toBe(4);
    expect(arcSegmentCount(6, Math.PI / 2, exact * (1 - 1e-6))).toBe(5);
  });

  it('puts the points on the circle, from the start angle through the sweep', () => {
    const centre = { x: 12, y: 12 };
    const points = flattenArc(centre, 5, 0, Math.PI / 2);
    for (const p of points) expect(distance(p, centre)).toBeCloseTo(5, 12);
    expect(points[0]).toEqual({ x: 17, y: 12 });
    // 90° from +x towards +y is straight down on screen (y grows downward).
    expect(points[points.length - 1].x).toBeCloseTo(12, 12);
    expect(points[points.length - 1].y).toBeCloseTo(17, 12);
  });

  it('chord lengths add up to just under the arc length rθ (CRC Standard Mathematical Tables)', () => {
    const points = flattenArc({ x: 0, y: 0 }, 8, 0, Math.PI / 4);
    let total = 0;
    for (let i = 1; i < points.length; i++) total += distance(points[i - 1], points[i]);
    const exact = arcLength(8, Math.PI / 4); // 2π in. = 6.2832 in.
    expect(exact).toBeCloseTo(2 * Math.PI, 12);
    expect(total).toBeLessThan(exact);
    expect(exact - total).toBeLessThan(1e-3);
  });

  it('rejects a tolerance or radius it cannot use, with a validation error', () => {
    expect(() => arcSegmentCount(5, 1, 0)).toThrow(GeometryInputError);
    expect(() => arcSegmentCount(Number.NaN, 1)).toThrow(/radius/);
    expect(() => arcSegmentCount(5, -1)).toThrow(/sweep/);
    // A tiny tolerance is capped rather than allowed to run away.
    expect(arcSegmentCount(200, 2 * Math.PI, 1e-15)).toBe(100_000);
  });
});
