import type { Point } from '../document/pattern-schema';
import { GEOMETRY_EPSILON_IN } from '../tolerance';
import { cross, distance, lerp, subtract } from './vector';

/** How two segments meet. `tA`/`tB` are the positions along each segment, 0 at its start, 1 at its end. */
export type SegmentIntersection =
  | { kind: 'none' }
  | { kind: 'point'; point: Point; tA: number; tB: number }
  | { kind: 'overlap'; from: Point; to: Point };

/**
 * Intersection of the closed segments a1–a2 and b1–b2. Parallel segments closer than `toleranceIn` that
 * share a stretch are reported as an overlap (a single shared end point as a point).
 */
export function segmentIntersection(
  a1: Point,
  a2: Point,
  b1: Point,
  b2: Point,
  toleranceIn = GEOMETRY_EPSILON_IN,
): SegmentIntersection {
  const r = subtract(a2, a1);
  const s = subtract(b2, b1);
  const denom = cross(r, s);
  const qp = subtract(b1, a1);
  const lengthA = Math.hypot(r.x, r.y);
  const lengthB = Math.hypot(s.x, s.y);
  // Relative to the lengths, so the test does not depend on the scale of the drawing.
  if (Math.abs(denom) <= 1e-12 * Math.max(1, lengthA * lengthB)) {
    // Parallel: collinear only if b1 lies on the line of a.
    const offLine = lengthA === 0 ? distance(a1, b1) : Math.abs(cross(qp, r)) / lengthA;
    if (offLine > toleranceIn) return { kind: 'none' };
    if (lengthA === 0) {
      if (lengthB === 0) return distance(a1, b1) <= toleranceIn ? { kind: 'point', point: a1, tA: 0, tB: 0 } : { kind: 'none' };
      return { kind: 'none' };
    }
    const rr = lengthA * lengthA;
    const t0 = (qp.x * r.x + qp.y * r.y) / rr;
    const t1 = t0 + (s.x * r.x + s.y * r.y) / rr;
    const lo = Math.max(0, Math.min(t0, t1));
    const hi = Math.min(1, Math.max(t0, t1));
    const tol = toleranceIn / lengthA;
    if (hi < lo - tol) return { kind: 'none' };
    if (hi - lo <= tol) {
      const t = (lo + hi) / 2;
      const point = lerp(a1, a2, t);
      const tB = lengthB === 0 ? 0 : ((point.x - b1.x) * s.x + (point.y - b1.y) * s.y) / (lengthB * lengthB);
      return { kind: 'point', point, tA: t, tB };
    }
    return { kind: 'overlap', from: lerp(a1, a2, lo), to: lerp(a1, a2, hi) };
  }
  const tA = cross(qp, s) / denom;
  const tB = cross(qp, r) / denom;
  const tolA = lengthA === 0 ? 0 : toleranceIn / lengthA;
  const tolB = lengthB === 0 ? 0 : toleranceIn / lengthB;
  if (tA < -tolA || tA > 1 + tolA || tB < -tolB || tB > 1 + tolB) return { kind: 'none' };
  const tAc = Math.max(0, Math.min(1, tA));
  return { kind: 'point', point: lerp(a1, a2, tAc), tA: tAc, tB: Math.max(0, Math.min(1, tB)) };
}
