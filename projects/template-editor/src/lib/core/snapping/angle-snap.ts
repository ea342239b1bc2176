import { normaliseAngleDeg } from '@seamwright/piecing';

/** The fixed step angles snap to, in degrees (a common drafting step: 360/48). */
export const ANGLE_SNAP_STEP_DEG = 7.5;

/** How near (degrees) an angle must come to a ring division for that division to win over the fixed step. */
export const ANGLE_DIVISION_CATCH_DEG = 2;

/**
 * Snaps an angle or a sweep (degrees) to the divisions of the ring repeats in play (multiples of 360/N
 * for each N in `divisions`) when it comes within `catchDeg` of one, otherwise to the nearest multiple
 * of {@link ANGLE_SNAP_STEP_DEG}. The nearest division wins when several are near.
 */
export function snapAngleDeg(angleDeg: number, divisions: readonly number[] = [], catchDeg = ANGLE_DIVISION_CATCH_DEG): number {
  let best: number | null = null;
  let bestOff = catchDeg;
  for (const n of divisions) {
    if (!(n >= 2)) continue;
    const step = 360 / n;
    const k = Math.round(angleDeg / step);
    const candidate = k * step;
    const off = Math.abs(candidate - angleDeg);
    if (off <= bestOff) {
      bestOff = off;
      best = candidate;
    }
  }
  if (best !== null) return best;
  return Math.round(angleDeg / ANGLE_SNAP_STEP_DEG) * ANGLE_SNAP_STEP_DEG;
}

/** Snaps a direction (degrees) and gives it in [0, 360). */
export function snapDirectionDeg(angleDeg: number, divisions: readonly number[] = [], catchDeg = ANGLE_DIVISION_CATCH_DEG): number {
  return normaliseAngleDeg(snapAngleDeg(angleDeg, divisions, catchDeg));
}

/** Snaps a sweep (degrees): never to nothing — a sweep that would snap to 0° keeps the smallest step. */
export function snapSweepDeg(sweepDeg: number, divisions: readonly number[] = [], catchDeg = ANGLE_DIVISION_CATCH_DEG): number {
  const s = snapAngleDeg(sweepDeg, divisions, catchDeg);
  if (s <= 0) return Math.min(ANGLE_SNAP_STEP_DEG, ...divisions.filter((n) => n >= 2).map((n) => 360 / n));
  return Math.min(360, s);
}
