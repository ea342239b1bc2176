import type { Point } from '../document/index';

/**
 * A 2-D affine map p ↦ (a·x + c·y + e, b·x + d·y + f), the same six numbers as a PDF `cm` matrix.
 * Used to place a template on a sheet: mirror, turn, then move.
 */
export interface Affine {
  a: number;
  b: number;
  c: number;
  d: number;
  e: number;
  f: number;
}

export const IDENTITY: Affine = { a: 1, b: 0, c: 0, d: 1, e: 0, f: 0 };

/** Applies the map to a point. */
export function applyAffine(m: Affine, p: Point): Point {
  return { x: m.a * p.x + m.c * p.y + m.e, y: m.b * p.x + m.d * p.y + m.f };
}

/** Applies the map to a direction (no translation). */
export function applyLinear(m: Affine, v: Point): Point {
  return { x: m.a * v.x + m.c * v.y, y: m.b * v.x + m.d * v.y };
}

/** The map that applies `first`, then `second`. */
export function compose(second: Affine, first: Affine): Affine {
  return {
    a: second.a * first.a + second.c * first.b,
    b: second.b * first.a + second.d * first.b,
    c: second.a * first.c + second.c * first.d,
    d: second.b * first.c + second.d * first.d,
    e: second.a * first.e + second.c * first.f + second.e,
    f: second.b * first.e + second.d * first.f + second.f,
  };
}

/** Mirror image across the vertical axis x = 0. */
export const MIRROR_X: Affine = { a: -1, b: 0, c: 0, d: 1, e: 0, f: 0 };

/** Turn by an angle (radians, from +x toward +y, i.e. clockwise on a y-down sheet). */
export function rotation(angleRad: number): Affine {
  const cos = Math.cos(angleRad);
  const sin = Math.sin(angleRad);
  return { a: cos, b: sin, c: -sin, d: cos, e: 0, f: 0 };
}

export function translation(dx: number, dy: number): Affine {
  return { a: 1, b: 0, c: 0, d: 1, e: dx, f: dy };
}

/** Whether the map turns the plane over (a mirror image). */
export function isMirroring(m: Affine): boolean {
  return m.a * m.d - m.b * m.c < 0;
}
