import { describe, expect, it } from 'vitest';
import { snapAngleDeg, snapDirectionDeg, snapSweepDeg } from './angle-snap';

describe('angle snapping', () => {
  it('snaps to 7.5° steps when no ring division is near', () => {
    expect(snapAngleDeg(247.380135)).toBe(247.5);
    expect(snapAngleDeg(3.7)).toBe(0);
    expect(snapAngleDeg(3.8)).toBe(7.5);
    expect(snapAngleDeg(-11)).toBe(-7.5);
  });

  it('prefers a division of the ring repeat (360/N) within the catch angle', () => {
    // 7 copies: 51.428571…° apart; 52.0° is nearer 52.5 (7.5° step) but within 2° of 360/7.
    expect(snapAngleDeg(52, [7])).toBeCloseTo(360 / 7, 12);
    expect(snapAngleDeg(154.5, [7])).toBeCloseTo((3 * 360) / 7, 12);
    // Too far from every division: the fixed step.
    expect(snapAngleDeg(70, [7])).toBe(67.5);
    // Two rings: the nearer division wins (360/5 = 72 against 360/7 · 1 = 51.43).
    expect(snapAngleDeg(71, [5, 7])).toBe(72);
  });

  it('gives directions in [0, 360) and sweeps in (0, 360]', () => {
    expect(snapDirectionDeg(358.9)).toBe(0);
    expect(snapDirectionDeg(-7.4)).toBe(352.5);
    expect(snapSweepDeg(1.2)).toBe(7.5);
    expect(snapSweepDeg(1.2, [16])).toBe(7.5);
    expect(snapSweepDeg(1.2, [100])).toBeCloseTo(3.6, 12);
    expect(snapSweepDeg(359.9)).toBe(360);
    expect(snapSweepDeg(44.2, [8])).toBe(45);
  });
});
