import type { Point } from '../document/index';
import { convexHull } from '../fabrication/cutting-list/min-area-rectangle';
import { polygonBounds } from '../geometry/index';
import { applyAffine, rotation } from './affine';
import type { RectIn } from './paper';

/*
 * Small helpers the sheet layout needs and the shared geometry does not offer: the turn that gives a
 * template its smallest bounding box, and the extent of a template inside one tile.
 */

/** Axis-aligned bounding box of points, as a rectangle. */
export function boundingRect(points: readonly Point[]): RectIn {
  const b = polygonBounds(points);
  return { x: b.minX, y: b.minY, width: b.maxX - b.minX, height: b.maxY - b.minY };
}

/**
 * The turn (radians) that gives the points their smallest-area axis-aligned bounding box. The best
 * box has one side along an edge of the convex hull (Freeman & Shapira 1975), so only those turns are
 * tried. Returns 0 when no turn beats the unturned box by more than a hair, so straight-edged
 * templates drawn square stay square.
 */
export function minimumAreaTurn(points: readonly Point[]): number {
  const hull = convexHull(points);
  const unturned = boundingRect(hull);
  let bestArea = unturned.width * unturned.height;
  let bestTurn = 0;
  for (let i = 0; i < hull.length; i++) {
    const a = hull[i];
    const b = hull[(i + 1) % hull.length];
    const edgeAngle = Math.atan2(b.y - a.y, b.x - a.x);
    // Turning by −edgeAngle lays the edge along +x.
    const turn = normaliseTurn(-edgeAngle);
    const box = boundingRect(turnPoints(hull, turn));
    const area = box.width * box.height;
    if (area < bestArea * (1 - 1e-9)) {
      bestArea = area;
      bestTurn = turn;
    }
  }
  return bestTurn;
}

/** Brings a turn into [0, π/2): a box turned by a quarter turn is the same box. */
function normaliseTurn(angle: number): number {
  const quarter = Math.PI / 2;
  let t = angle % quarter;
  if (t < 0) t += quarter;
  if (quarter - t < 1e-12) t = 0;
  return t;
}

function turnPoints(points: readonly Point[], angle: number): Point[] {
  const turn = rotation(angle);
  return points.map((p) => applyAffine(turn, p));
}

/**
 * Bounding box of the part of a closed ring inside a rectangle (Sutherland–Hodgman clipping against
 * the rectangle's four sides; exact for the box even when the ring is not convex), or null when the
 * ring does not reach into the rectangle.
 */
export function clippedBounds(ring: readonly Point[], rect: RectIn): RectIn | null {
  const poly = clipRingToRect(ring, rect);
  if (poly.length < 3) return null;
  const box = boundingRect(poly);
  return box.width > 1e-6 && box.height > 1e-6 ? box : null;
}

/**
 * The part of a closed ring inside a rectangle, as one ring (Sutherland–Hodgman; where the ring
 * leaves and re-enters, the result runs along the rectangle's side, so it covers at least that part).
 */
export function clipRingToRect(ring: readonly Point[], rect: RectIn): Point[] {
  const x0 = rect.x;
  const y0 = rect.y;
  const x1 = rect.x + rect.width;
  const y1 = rect.y + rect.height;
  let poly: Point[] = [...ring];
  const sides: Array<[(p: Point) => boolean, (p: Point, q: Point) => Point]> = [
    [(p) => p.x >= x0, (p, q) => at(p, q, (x0 - p.x) / (q.x - p.x))],
    [(p) => p.x <= x1, (p, q) => at(p, q, (x1 - p.x) / (q.x - p.x))],
    [(p) => p.y >= y0, (p, q) => at(p, q, (y0 - p.y) / (q.y - p.y))],
    [(p) => p.y <= y1, (p, q) => at(p, q, (y1 - p.y) / (q.y - p.y))],
  ];
  for (const [inside, cut] of sides) {
    if (poly.length === 0) return [];
    const out: Point[] = [];
    for (let i = 0; i < poly.length; i++) {
      const cur = poly[i];
      const prev = poly[(i + poly.length - 1) % poly.length];
      const curIn = inside(cur);
      const prevIn = inside(prev);
      if (curIn) {
        if (!prevIn) out.push(cut(prev, cur));
        out.push(cur);
      } else if (prevIn) {
        out.push(cut(prev, cur));
      }
    }
    poly = out;
  }
  return poly;
}

function at(p: Point, q: Point, t: number): Point {
  return { x: p.x + (q.x - p.x) * t, y: p.y + (q.y - p.y) * t };
}

/**
 * Whether `p` lies strictly inside the closed ring by the even–odd crossing rule, with no boundary
 * tolerance. The sheet packing probes it for thousands of raster cells, so unlike the shared
 * `pointInPolygon` it does not measure the distance to every edge as well.
 */
export function insideRing(p: Point, ring: readonly Point[]): boolean {
  let odd = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const a = ring[i];
    const b = ring[j];
    if (a.y > p.y !== b.y > p.y && p.x < ((b.x - a.x) * (p.y - a.y)) / (b.y - a.y) + a.x) odd = !odd;
  }
  return odd;
}

/** Squared distance from `p` to the segment a–b, square inches (no square root, for comparisons). */
export function pointSegmentDistanceSq(p: Point, a: Point, b: Point): number {
  const vx = b.x - a.x;
  const vy = b.y - a.y;
  const len2 = vx * vx + vy * vy;
  const t = len2 > 0 ? Math.max(0, Math.min(1, ((p.x - a.x) * vx + (p.y - a.y) * vy) / len2)) : 0;
  const dx = a.x + vx * t - p.x;
  const dy = a.y + vy * t - p.y;
  return dx * dx + dy * dy;
}

/** Distance from `p` to the nearest edge of the closed ring, inches. */
export function distanceToRing(p: Point, ring: readonly Point[]): number {
  let best = Infinity;
  for (let i = 0; i < ring.length; i++) {
    const d = pointSegmentDistanceSq(p, ring[i], ring[(i + 1) % ring.length]);
    if (d < best) best = d;
  }
  return Math.sqrt(best);
}
