import type { Point, RoughCut } from '../../document/pattern-schema';
import { PolygonOffsetter } from '../seam-allowance/clipper-offset';
import { convexHull, minAreaRectangle } from './min-area-rectangle';
import { OFFSET_GRID_NOISE_IN, roundCutSizeIn } from './patch-rough-cut';

// Directions tried besides the hull's edges, degrees apart; and slack for float noise, inches.
const SWEEP_STEP_DEG = 0.25;
const FIT_SLACK_IN = OFFSET_GRID_NOISE_IN;

/** Whether a piece the designer set covers a patch with its seam allowance, and how. */
export interface RoughCutFit {
  /** Whether the w × l piece covers the patch grown by the seam allowance in some turn. */
  covers: boolean;
  /** A direction (degrees from +x towards +y, [0, 180)) of the piece's first side in which it covers the patch (else the best-fitting one). */
  angleDeg: number;
  /** The smallest rectangle around the patch with its allowance, rounded up to ⅛ in. (shorter, longer side): what a piece needs at least. */
  neededWidthIn: number;
  neededLengthIn: number;
}

/**
 * Whether a rough-cut piece of `roughCut.widthIn` × `roughCut.lengthIn` covers the patch plus its seam
 * allowance (the patch offset outward by the allowance, mitred as for cutting lines) in any turn: the
 * outline fits inside the rectangle when, for some direction θ, its extent along θ is at most one side and
 * its extent square to θ at most the other. The directions tried are every edge of the outline's convex
 * hull (where the minimum-area rectangle lies) and a sweep every 0.25°; a fit narrower than that sweep
 * may be missed, which errs on the side of warning.
 */
export function fitRoughCut(polygon: readonly Point[], roughCut: RoughCut, allowanceIn = 0.25, offsetter = new PolygonOffsetter()): RoughCutFit {
  const grown = offsetter.offsetPolygon(polygon, allowanceIn, 'mitre');
  const hull = convexHull(grown.length > 0 ? grown : polygon);
  const best = minAreaRectangle(hull);
  const short = Math.min(roughCut.widthIn, roughCut.lengthIn) + FIT_SLACK_IN;
  const long = Math.max(roughCut.widthIn, roughCut.lengthIn) + FIT_SLACK_IN;
  const angles = [best.angleDeg];
  for (let i = 0; i < hull.length; i++) {
    const a = hull[i];
    const b = hull[(i + 1) % hull.length];
    angles.push((Math.atan2(b.y - a.y, b.x - a.x) * 180) / Math.PI);
  }
  for (let d = 0; d < 180; d += SWEEP_STEP_DEG) angles.push(d);
  let fallback = { angleDeg: best.angleDeg, excess: Infinity };
  for (const deg of angles) {
    const t = (deg * Math.PI) / 180;
    const c = Math.cos(t);
    const s = Math.sin(t);
    let minU = Infinity;
    let maxU = -Infinity;
    let minV = Infinity;
    let maxV = -Infinity;
    for (const p of hull) {
      const u = p.x * c + p.y * s;
      const v = -p.x * s + p.y * c;
      if (u < minU) minU = u;
      if (u > maxU) maxU = u;
      if (v < minV) minV = v;
      if (v > maxV) maxV = v;
    }
    const along = maxU - minU;
    const across = maxV - minV;
    // The piece's first side lies along θ: either its short side (then the long one across) or its long side.
    const shortAlong = Math.max(along - short, across - long);
    const longAlong = Math.max(along - long, across - short);
    const excess = Math.min(shortAlong, longAlong);
    if (excess <= 0) return { covers: true, angleDeg: normalise180(deg), neededWidthIn: neededOf(best).w, neededLengthIn: neededOf(best).l };
    if (excess < fallback.excess) fallback = { angleDeg: deg, excess };
  }
  return { covers: false, angleDeg: normalise180(fallback.angleDeg), neededWidthIn: neededOf(best).w, neededLengthIn: neededOf(best).l };
}

function neededOf(rect: { alongIn: number; acrossIn: number }): { w: number; l: number } {
  const a = roundCutSizeIn(rect.alongIn);
  const b = roundCutSizeIn(rect.acrossIn);
  return { w: Math.min(a, b), l: Math.max(a, b) };
}

function normalise180(angleDeg: number): number {
  const a = angleDeg % 180;
  const r = a < 0 ? a + 180 : a;
  return Math.round(r * 1e6) / 1e6;
}
