import type { Point } from '../document/index';
import { radToDeg } from '../geometry/index';
import { applyAffine, compose, rotation, translation, type Affine } from './affine';
import { boundingRect, insideRing, pointSegmentDistanceSq } from './layout-geometry';
import type { RectIn } from './paper';

/** Two copies of a template laid so they interlock: head to tail (the second turned half a turn) or stacked. */
export interface NestedPair {
  /** Map the drawing plane onto the pair's box [0, width] × [0, height], one per copy. */
  frames: [Affine, Affine];
  turnDeg: [number, number];
  width: number;
  height: number;
}

/** How far the simplified outline used for the search may stray from the real one, inches. */
const SIMPLIFY_IN = 0.02;

/**
 * Looks for an arrangement of two copies of a cutting line (already mirrored by `base` when needed),
 * head to tail or stacked the same way round, whose common box is clearly smaller than two separate
 * boxes: wedges make a parallelogram, arcs stack convex side into concave side. Turns tried: every 7.5° for arcs and
 * wedges, 0° and 90° for straight sections. For each turn and a range of sideways shifts it finds,
 * by bisection, the closest approach that keeps `gapIn` between the outlines. Returns null when
 * nesting gains less than 5 % over `singleBoxArea` × 2.
 */
export function nestPair(ring: readonly Point[], base: Affine, freeRotation: boolean, gapIn: number, clearanceIn: number, singleBoxArea: number): NestedPair | null {
  const drawn = ring.map((p) => applyAffine(base, p));
  const simple = simplifyRing(drawn, SIMPLIFY_IN);
  const searchGap = gapIn + 2 * SIMPLIFY_IN;
  const turns = freeRotation ? Array.from({ length: 24 }, (_, k) => (k * Math.PI) / 24) : [0, Math.PI / 2];
  let best: { area: number; turn: number; flip: number; dx: number; dy: number; w: number; h: number; ax: number; ay: number; bx: number; by: number } | null = null;
  for (const turn of turns) for (const flip of [Math.PI, 0]) {
    const a0 = simple.map((p) => applyAffine(rotation(turn), p));
    const b0 = simple.map((p) => applyAffine(rotation(turn + flip), p));
    const boxA = boundingRect(a0);
    const boxB = boundingRect(b0);
    const a = a0.map((p) => ({ x: p.x - boxA.x, y: p.y - boxA.y }));
    const b = b0.map((p) => ({ x: p.x - boxB.x, y: p.y - boxB.y }));
    const w = boxA.width;
    const h = boxA.height;
    const steps = 16;
    for (let i = 0; i <= steps; i++) {
      const dy = -h + (2 * h * i) / steps;
      let lo = -w;
      let hi = w + searchGap;
      if (separated(a, shift(b, lo, dy), searchGap)) hi = lo;
      else {
        for (let k = 0; k < 16; k++) {
          const mid = (lo + hi) / 2;
          if (separated(a, shift(b, mid, dy), searchGap)) hi = mid;
          else lo = mid;
        }
      }
      const dx = hi;
      const width = Math.max(w, dx + w) - Math.min(0, dx);
      const height = Math.max(h, dy + h) - Math.min(0, dy);
      const area = (width + 2 * clearanceIn) * (height + 2 * clearanceIn);
      if (!best || area < best.area - 1e-9) best = { area, turn, flip, dx, dy, w: width, h: height, ax: boxA.x, ay: boxA.y, bx: boxB.x, by: boxB.y };
    }
  }
  if (!best || best.area > 2 * singleBoxArea * 0.995) return null;
  const ox = clearanceIn - Math.min(0, best.dx);
  const oy = clearanceIn - Math.min(0, best.dy);
  const frameA = compose(translation(ox - best.ax, oy - best.ay), compose(rotation(best.turn), base));
  const frameB = compose(translation(ox + best.dx - best.bx, oy + best.dy - best.by), compose(rotation(best.turn + best.flip), base));
  // Check the real outlines keep the gap (the search used simplified ones).
  const realA = ring.map((p) => applyAffine(frameA, p));
  const realB = ring.map((p) => applyAffine(frameB, p));
  if (!separated(realA, realB, gapIn)) return null;
  const deg = (t: number) => ((radToDeg(t) % 360) + 360) % 360;
  return {
    frames: [frameA, frameB],
    turnDeg: [deg(best.turn), deg(best.turn + best.flip)],
    width: best.w + 2 * clearanceIn,
    height: best.h + 2 * clearanceIn,
  };
}

function shift(points: readonly Point[], dx: number, dy: number): Point[] {
  return points.map((p) => ({ x: p.x + dx, y: p.y + dy }));
}

/** Whether two closed rings are at least `gap` apart (no crossing, neither inside the other). */
export function separated(p: readonly Point[], q: readonly Point[], gap: number): boolean {
  return separatedAt(p, 0, 0, q, gap);
}

const sa = { x: 0, y: 0 };
const sb = { x: 0, y: 0 };

/**
 * {@link separated} for `p` moved by (dx, dy), without copying it; its bounding box (unmoved) and
 * `q`'s may be passed when known.
 */
export function separatedAt(p: readonly Point[], dx: number, dy: number, q: readonly Point[], gap: number, boxP: RectIn = boundingRect(p), boxQ: RectIn = boundingRect(q)): boolean {
  const bp = { x: boxP.x + dx, y: boxP.y + dy, width: boxP.width, height: boxP.height };
  const bq = boxQ;
  if (bp.x + bp.width + gap <= bq.x || bq.x + bq.width + gap <= bp.x || bp.y + bp.height + gap <= bq.y || bq.y + bq.height + gap <= bp.y) return true;
  const gap2 = gap * gap;
  for (let i = 0; i < p.length; i++) {
    const pa = p[i];
    const pb = p[(i + 1) % p.length];
    sa.x = pa.x + dx;
    sa.y = pa.y + dy;
    sb.x = pb.x + dx;
    sb.y = pb.y + dy;
    const a = sa;
    const b = sb;
    const ex0 = Math.min(a.x, b.x) - gap;
    const ex1 = Math.max(a.x, b.x) + gap;
    const ey0 = Math.min(a.y, b.y) - gap;
    const ey1 = Math.max(a.y, b.y) + gap;
    for (let j = 0; j < q.length; j++) {
      const c = q[j];
      const d = q[(j + 1) % q.length];
      if (Math.max(c.x, d.x) < ex0 || Math.min(c.x, d.x) > ex1 || Math.max(c.y, d.y) < ey0 || Math.min(c.y, d.y) > ey1) continue;
      if (segmentDistance2(a, b, c, d) < gap2) return false;
    }
  }
  return !insideRing({ x: p[0].x + dx, y: p[0].y + dy }, q) && !insideRing({ x: q[0].x - dx, y: q[0].y - dy }, p);
}

function segmentDistance2(a: Point, b: Point, c: Point, d: Point): number {
  if (segmentsCross(a, b, c, d)) return 0;
  return Math.min(pointSegmentDistanceSq(a, c, d), pointSegmentDistanceSq(b, c, d), pointSegmentDistanceSq(c, a, b), pointSegmentDistanceSq(d, a, b));
}

function orient(p: Point, q: Point, r: Point): number {
  return (q.x - p.x) * (r.y - p.y) - (q.y - p.y) * (r.x - p.x);
}

function segmentsCross(a: Point, b: Point, c: Point, d: Point): boolean {
  const o = orient;
  const d1 = o(c, d, a);
  const d2 = o(c, d, b);
  const d3 = o(a, b, c);
  const d4 = o(a, b, d);
  return ((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0));
}

/** Douglas–Peucker simplification of a closed ring; every dropped point lies within `tol` of the result. */
export function simplifyRing(ring: readonly Point[], tol: number): Point[] {
  if (ring.length <= 8) return [...ring];
  // Split at the two points farthest apart so both halves are open polylines.
  let far = 0;
  let farD = -1;
  for (let i = 1; i < ring.length; i++) {
    const d = (ring[i].x - ring[0].x) ** 2 + (ring[i].y - ring[0].y) ** 2;
    if (d > farD) {
      farD = d;
      far = i;
    }
  }
  const first = simplifyOpen(ring.slice(0, far + 1), tol);
  const second = simplifyOpen([...ring.slice(far), ring[0]], tol);
  return [...first.slice(0, -1), ...second.slice(0, -1)];
}

function simplifyOpen(points: readonly Point[], tol: number): Point[] {
  if (points.length <= 2) return [...points];
  const a = points[0];
  const b = points[points.length - 1];
  let index = -1;
  let maxD = -1;
  for (let i = 1; i < points.length - 1; i++) {
    const d = pointSegmentDistanceSq(points[i], a, b);
    if (d > maxD) {
      maxD = d;
      index = i;
    }
  }
  if (maxD <= tol * tol) return [a, b];
  const left = simplifyOpen(points.slice(0, index + 1), tol);
  const right = simplifyOpen(points.slice(index), tol);
  return [...left.slice(0, -1), ...right];
}
