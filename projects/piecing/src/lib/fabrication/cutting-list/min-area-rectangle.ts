import type { Point } from '../../document/pattern-schema';
import { cross, radToDeg, subtract } from '../../geometry/index';

/** A rectangle at any angle, in inches. */
export interface OrientedRectangle {
  /** Corners in order (the ring of the rectangle). */
  corners: Point[];
  /** Length of the side along `angleDeg`, and of the side across it. */
  alongIn: number;
  acrossIn: number;
  /** Direction of the first side, degrees from +x towards +y, in [0, 180). */
  angleDeg: number;
  areaSqIn: number;
}

/**
 * Convex hull by Andrew's monotone chain: the hull vertices wound with positive signed area (from +x
 * towards +y), collinear points dropped. Fewer than three points come back as they are (deduplicated).
 */
export function convexHull(points: readonly Point[]): Point[] {
  const sorted = [...points].sort((a, b) => a.x - b.x || a.y - b.y);
  const unique: Point[] = [];
  for (const p of sorted) {
    const last = unique[unique.length - 1];
    if (!last || last.x !== p.x || last.y !== p.y) unique.push({ x: p.x, y: p.y });
  }
  if (unique.length < 3) return unique;
  const turn = (o: Point, a: Point, b: Point) => cross(subtract(a, o), subtract(b, o));
  const lower: Point[] = [];
  for (const p of unique) {
    while (lower.length >= 2 && turn(lower[lower.length - 2], lower[lower.length - 1], p) <= 0) lower.pop();
    lower.push(p);
  }
  const upper: Point[] = [];
  for (let i = unique.length - 1; i >= 0; i--) {
    const p = unique[i];
    while (upper.length >= 2 && turn(upper[upper.length - 2], upper[upper.length - 1], p) <= 0) upper.pop();
    upper.push(p);
  }
  lower.pop();
  upper.pop();
  return [...lower, ...upper];
}

/**
 * The minimum-area rectangle enclosing the points, by rotating calipers over their convex hull: one side
 * of the best rectangle lies along a hull edge (Freeman & Shapira, 1975), so each edge is tried with
 * three calipers (farthest along the edge, farthest from it, farthest back) that only ever move forward.
 * O(n log n) for the hull, O(h) for the calipers.
 */
export function minAreaRectangle(points: readonly Point[]): OrientedRectangle {
  const hull = convexHull(points);
  const h = hull.length;
  if (h === 0) throw new RangeError('no points to enclose');
  if (h < 3) {
    const a = hull[0];
    const b = hull[h - 1];
    const length = Math.hypot(b.x - a.x, b.y - a.y);
    const angle = length > 0 ? Math.atan2(b.y - a.y, b.x - a.x) : 0;
    return { corners: [a, b, b, a].map((p) => ({ ...p })), alongIn: length, acrossIn: 0, angleDeg: normalise180(radToDeg(angle)), areaSqIn: 0 };
  }
  const at = (k: number) => hull[k % h];
  let best: { area: number; i: number; e: Point; lo: number; hi: number; height: number } | undefined;
  let r = 1;
  let t = 1;
  let l = 1;
  for (let i = 0; i < h; i++) {
    const p0 = at(i);
    const p1 = at(i + 1);
    const len = Math.hypot(p1.x - p0.x, p1.y - p0.y);
    const e = { x: (p1.x - p0.x) / len, y: (p1.y - p0.y) / len };
    const nrm = { x: -e.y, y: e.x }; // into the hull, for its positive winding
    const along = (p: Point) => (p.x - p0.x) * e.x + (p.y - p0.y) * e.y;
    const up = (p: Point) => (p.x - p0.x) * nrm.x + (p.y - p0.y) * nrm.y;
    if (r < i + 1) r = i + 1;
    for (let guard = 0; guard < h && along(at(r + 1)) > along(at(r)); guard++) r++;
    if (t < r) t = r;
    for (let guard = 0; guard < h && up(at(t + 1)) > up(at(t)); guard++) t++;
    if (l < t) l = t;
    for (let guard = 0; guard < h && along(at(l + 1)) < along(at(l)); guard++) l++;
    const hi = along(at(r));
    const lo = along(at(l));
    const height = up(at(t));
    const area = (hi - lo) * height;
    if (!best || area < best.area) best = { area, i, e, lo, hi, height };
  }
  const { i, e, lo, hi, height, area } = best!;
  const p0 = at(i);
  const nrm = { x: -e.y, y: e.x };
  const corner = (s: number, u: number) => ({ x: p0.x + e.x * s + nrm.x * u, y: p0.y + e.y * s + nrm.y * u });
  return {
    corners: [corner(lo, 0), corner(hi, 0), corner(hi, height), corner(lo, height)],
    alongIn: hi - lo,
    acrossIn: height,
    angleDeg: normalise180(radToDeg(Math.atan2(e.y, e.x))),
    areaSqIn: area,
  };
}

function normalise180(angleDeg: number): number {
  const a = angleDeg % 180;
  return a < 0 ? a + 180 : a;
}
