import type { Point } from '../document/pattern-schema';
import { CHORD_TOLERANCE_IN } from '../tolerance';
import { pointOnCircle } from './vector';

/** Most chords a single arc is ever flattened into, whatever the tolerance asked for. */
export const MAX_ARC_SEGMENTS = 100_000;

/** Thrown when a geometry function gets a parameter it cannot work with (a tolerance ≤ 0, NaN …). */
export class GeometryInputError extends RangeError {
  constructor(message: string) {
    super(message);
    this.name = 'GeometryInputError';
  }
}

/**
 * Number of equal chords needed so that an arc of `radiusIn` sweeping `sweepRad` strays from its chords
 * by at most `toleranceIn` (the sagitta r(1 − cos(φ/2)) of each chord's angle φ):
 * n = ceil(θ / (2·acos(1 − ε/r))) (docs/design-notes.md#arc-flattening). At least one chord, and at least three for a full
 * circle; at most {@link MAX_ARC_SEGMENTS}.
 */
export function arcSegmentCount(radiusIn: number, sweepRad: number, toleranceIn = CHORD_TOLERANCE_IN): number {
  if (!(toleranceIn > 0) || !Number.isFinite(toleranceIn)) throw new GeometryInputError(`chord tolerance must be a positive number of inches, got ${toleranceIn}`);
  if (!(radiusIn > 0) || !Number.isFinite(radiusIn)) throw new GeometryInputError(`radius must be a positive number of inches, got ${radiusIn}`);
  if (!(sweepRad > 0) || !Number.isFinite(sweepRad)) throw new GeometryInputError(`sweep must be a positive angle, got ${sweepRad}`);
  const minimum = sweepRad >= 2 * Math.PI - 1e-12 ? 3 : 1;
  if (toleranceIn >= radiusIn) return minimum;
  const maxChordAngle = 2 * Math.acos(1 - toleranceIn / radiusIn);
  // A hair below the exact ratio keeps n stable when θ is an exact multiple of the chord angle.
  const n = Math.ceil(sweepRad / maxChordAngle - 1e-9);
  return Math.min(MAX_ARC_SEGMENTS, Math.max(minimum, n));
}

/**
 * Points along an arc from `startRad` through `sweepRad` (document angles, +x towards +y), first and last
 * included: n + 1 points on the circle for n chords. A negative sweep walks the other way.
 */
export function flattenArc(centre: Point, radiusIn: number, startRad: number, sweepRad: number, toleranceIn = CHORD_TOLERANCE_IN): Point[] {
  const n = arcSegmentCount(radiusIn, Math.abs(sweepRad), toleranceIn);
  const points: Point[] = [];
  for (let i = 0; i <= n; i++) points.push(pointOnCircle(centre, radiusIn, startRad + (sweepRad * i) / n));
  return points;
}

/** Arc length rθ, in inches. */
export function arcLength(radiusIn: number, sweepRad: number): number {
  return radiusIn * sweepRad;
}

/** Sagitta r(1 − cos(θ/2)) of the chord across an arc of `sweepRad`: its largest distance from the arc. */
export function sagitta(radiusIn: number, sweepRad: number): number {
  return radiusIn * (1 - Math.cos(sweepRad / 2));
}
