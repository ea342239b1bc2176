import type { Point, Seam } from '../document/pattern-schema';
import { degToRad, pointOnCircle } from '../geometry/index';

/** Seam ends run this far past the outline, so every seam clearly crosses its patch (inches). */
export const SEAM_OVERSHOOT_IN = 0.05;

/** A point at `radiusIn` from `centre` at `angleDeg` (document angles: +x towards +y), rounded to 1e-6 in. */
export function polar(centre: Point, radiusIn: number, angleDeg: number): Point {
  const p = pointOnCircle(centre, radiusIn, degToRad(angleDeg));
  return { x: round6(p.x), y: round6(p.y) };
}

/** A seam from `a` to `b`, each end pushed past its point by the given overshoot (0 keeps the end exact). */
export function seam(id: string, a: Point, b: Point, overshootA = SEAM_OVERSHOOT_IN, overshootB = SEAM_OVERSHOOT_IN): Seam {
  const len = Math.hypot(b.x - a.x, b.y - a.y);
  const ux = (b.x - a.x) / len;
  const uy = (b.y - a.y) / len;
  return {
    id,
    a: { x: round6(a.x - ux * overshootA), y: round6(a.y - uy * overshootA) },
    b: { x: round6(b.x + ux * overshootB), y: round6(b.y + uy * overshootB) },
  };
}

/** Rounds to a millionth of an inch, to keep demo files readable. */
export function round6(v: number): number {
  return Math.round(v * 1e6) / 1e6;
}

/** Section letters as quilters write them: 0 → A … 25 → Z, 26 → AA … (bijective base 26). */
export function sectionLetters(index: number): string {
  let n = index + 1;
  let out = '';
  while (n > 0) {
    const r = (n - 1) % 26;
    out = String.fromCharCode(65 + r) + out;
    n = Math.floor((n - 1) / 26);
  }
  return out;
}
