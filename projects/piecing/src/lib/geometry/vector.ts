import type { Point } from '../document/pattern-schema';

/** Degrees to radians. */
export function degToRad(angleDeg: number): number {
  return (angleDeg * Math.PI) / 180;
}

/** Radians to degrees. */
export function radToDeg(angleRad: number): number {
  return (angleRad * 180) / Math.PI;
}

/** a − b. */
export function subtract(a: Point, b: Point): Point {
  return { x: a.x - b.x, y: a.y - b.y };
}

/** a + b. */
export function add(a: Point, b: Point): Point {
  return { x: a.x + b.x, y: a.y + b.y };
}

/** Dot product. */
export function dot(a: Point, b: Point): number {
  return a.x * b.x + a.y * b.y;
}

/** z component of the cross product a × b. */
export function cross(a: Point, b: Point): number {
  return a.x * b.y - a.y * b.x;
}

/** Distance between two points, in inches. */
export function distance(a: Point, b: Point): number {
  return Math.hypot(a.x - b.x, a.y - b.y);
}

/** The point a + t (b − a). */
export function lerp(a: Point, b: Point, t: number): Point {
  return { x: a.x + (b.x - a.x) * t, y: a.y + (b.y - a.y) * t };
}

/**
 * Rotates `p` about `centre` by `angleRad`, in the document's sense: positive angles turn from +x towards
 * +y (clockwise on screen, where y points down).
 */
export function rotatePoint(p: Point, centre: Point, angleRad: number): Point {
  const c = Math.cos(angleRad);
  const s = Math.sin(angleRad);
  const dx = p.x - centre.x;
  const dy = p.y - centre.y;
  return { x: centre.x + dx * c - dy * s, y: centre.y + dx * s + dy * c };
}

/** The point at `radiusIn` from `centre` in direction `angleRad` (document angles: +x towards +y). */
export function pointOnCircle(centre: Point, radiusIn: number, angleRad: number): Point {
  return { x: centre.x + radiusIn * Math.cos(angleRad), y: centre.y + radiusIn * Math.sin(angleRad) };
}

/** Distance from `p` to the segment a–b, in inches. */
export function distanceToSegment(p: Point, a: Point, b: Point): number {
  const abx = b.x - a.x;
  const aby = b.y - a.y;
  const lengthSq = abx * abx + aby * aby;
  if (lengthSq === 0) return distance(p, a);
  const t = Math.max(0, Math.min(1, ((p.x - a.x) * abx + (p.y - a.y) * aby) / lengthSq));
  return Math.hypot(p.x - (a.x + t * abx), p.y - (a.y + t * aby));
}

/** Formats a point for messages, e.g. `(2.5, 3.125)`, to three decimals at most. */
export function formatPoint(p: Point): string {
  const f = (v: number) => String(Math.round(v * 1000) / 1000);
  return `(${f(p.x)}, ${f(p.y)})`;
}
