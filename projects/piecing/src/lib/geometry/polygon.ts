import type { Point } from '../document/pattern-schema';
import { GEOMETRY_EPSILON_IN } from '../tolerance';
import { distanceToSegment } from './vector';

/** Axis-aligned bounds of a point set, in inches. */
export interface Bounds {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

/**
 * Signed area by the shoelace formula, in square inches. Positive when the ring turns from +x towards +y
 * (clockwise on screen, where y points down; counter-clockwise in a y-up drawing). The ring is closed
 * implicitly.
 */
export function signedArea(ring: readonly Point[]): number {
  let twice = 0;
  for (let i = 0, n = ring.length; i < n; i++) {
    const a = ring[i];
    const b = ring[(i + 1) % n];
    twice += a.x * b.y - b.x * a.y;
  }
  return twice / 2;
}

/** Area of a simple polygon, in square inches (never negative). */
export function polygonArea(ring: readonly Point[]): number {
  return Math.abs(signedArea(ring));
}

/** Perimeter of the closed ring, in inches. */
export function polygonPerimeter(ring: readonly Point[]): number {
  let total = 0;
  for (let i = 0, n = ring.length; i < n; i++) {
    const a = ring[i];
    const b = ring[(i + 1) % n];
    total += Math.hypot(b.x - a.x, b.y - a.y);
  }
  return total;
}

/**
 * Area centroid of a simple polygon. For a ring with no area (all points on a line) it falls back to the
 * mean of the vertices.
 */
export function polygonCentroid(ring: readonly Point[]): Point {
  const n = ring.length;
  if (n === 0) return { x: Number.NaN, y: Number.NaN };
  // Shift to the first vertex to keep the products small and accurate far from the origin.
  const ox = ring[0].x;
  const oy = ring[0].y;
  let twiceArea = 0;
  let cx = 0;
  let cy = 0;
  for (let i = 0; i < n; i++) {
    const ax = ring[i].x - ox;
    const ay = ring[i].y - oy;
    const bx = ring[(i + 1) % n].x - ox;
    const by = ring[(i + 1) % n].y - oy;
    const c = ax * by - bx * ay;
    twiceArea += c;
    cx += (ax + bx) * c;
    cy += (ay + by) * c;
  }
  if (Math.abs(twiceArea) < 1e-12) {
    const sum = ring.reduce((s, p) => ({ x: s.x + p.x, y: s.y + p.y }), { x: 0, y: 0 });
    return { x: sum.x / n, y: sum.y / n };
  }
  return { x: ox + cx / (3 * twiceArea), y: oy + cy / (3 * twiceArea) };
}

/** Axis-aligned bounds of the points. */
export function polygonBounds(points: readonly Point[]): Bounds {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const p of points) {
    if (p.x < minX) minX = p.x;
    if (p.y < minY) minY = p.y;
    if (p.x > maxX) maxX = p.x;
    if (p.y > maxY) maxY = p.y;
  }
  return { minX, minY, maxX, maxY };
}

/** Where a point lies relative to a polygon. */
export type PointLocation = 'inside' | 'outside' | 'boundary';

/**
 * Locates `p` against the ring: on the boundary when within `toleranceIn` of an edge, otherwise inside or
 * outside by the even–odd crossing rule.
 */
export function locatePoint(p: Point, ring: readonly Point[], toleranceIn = GEOMETRY_EPSILON_IN): PointLocation {
  const n = ring.length;
  let inside = false;
  for (let i = 0, j = n - 1; i < n; j = i++) {
    const a = ring[j];
    const b = ring[i];
    if (distanceToSegment(p, a, b) <= toleranceIn) return 'boundary';
    if (a.y > p.y !== b.y > p.y) {
      const xAt = a.x + ((p.y - a.y) * (b.x - a.x)) / (b.y - a.y);
      if (p.x < xAt) inside = !inside;
    }
  }
  return inside ? 'inside' : 'outside';
}

/** Whether `p` lies inside the ring or on its boundary (within `toleranceIn`). */
export function pointInPolygon(p: Point, ring: readonly Point[], toleranceIn = GEOMETRY_EPSILON_IN): boolean {
  return locatePoint(p, ring, toleranceIn) !== 'outside';
}

/**
 * The ring wound so its signed area is positive (turning from +x towards +y: clockwise on screen,
 * where y points down). Returns a new array; a ring already wound that way comes back as a copy.
 */
export function withPositiveWinding(ring: readonly Point[]): Point[] {
  const copy = ring.map((p) => ({ x: p.x, y: p.y }));
  return signedArea(ring) < 0 ? copy.reverse() : copy;
}
