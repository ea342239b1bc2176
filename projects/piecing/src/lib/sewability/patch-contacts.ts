import type { Point } from '../document/pattern-schema';
import { GEOMETRY_EPSILON_IN, SEAM_REACH_TOLERANCE_IN } from '../tolerance';

/** A line through one or more collinear edges of a patch. */
interface PatchLine {
  origin: Point;
  /** Unit direction. */
  ux: number;
  uy: number;
  /** Intervals (along the line, from origin) covered by the patch's own edges on this line. */
  own: Array<[number, number]>;
  /** Which side of the line the patch itself lies on: −1, +1, or 2 for both. */
  ownSide: number;
  /** Per other patch: its side of the line (−1, +1, 0 when only on it, 2 for both). */
  sides: Int8Array;
  /** Per other patch: merged intervals of this line shared with that patch's boundary. */
  shared: Array<Array<[number, number]>>;
}

/** What one patch shares with every other patch: the precomputation behind the sewability check. */
export interface PatchContacts {
  lines: PatchLine[];
  /** Indices of the lines that share a stretch with patch j, per j. */
  linesTouching: number[][];
}

/** Precomputes, for every patch, its edge lines, what each other patch shares along them and on which side it lies. */
export function computeContacts(polygons: readonly Point[][], toleranceIn = GEOMETRY_EPSILON_IN, minSeamLengthIn = SEAM_REACH_TOLERANCE_IN): PatchContacts[] {
  return polygons.map((ring, k) => contactsOf(ring, k, polygons, toleranceIn, minSeamLengthIn));
}

function sideOf(ring: readonly Point[], line: { origin: Point; ux: number; uy: number }, toleranceIn: number): number {
  let pos = false;
  let neg = false;
  for (const p of ring) {
    const d = -line.uy * (p.x - line.origin.x) + line.ux * (p.y - line.origin.y);
    if (d > toleranceIn) pos = true;
    else if (d < -toleranceIn) neg = true;
  }
  return pos && neg ? 2 : pos ? 1 : neg ? -1 : 0;
}

/** Intervals of collinear edges of `ring` on the line. */
function intervalsOn(ring: readonly Point[], line: { origin: Point; ux: number; uy: number }, toleranceIn: number): Array<[number, number]> {
  const out: Array<[number, number]> = [];
  const n = ring.length;
  for (let i = 0; i < n; i++) {
    const p = ring[i];
    const q = ring[(i + 1) % n];
    const dp = -line.uy * (p.x - line.origin.x) + line.ux * (p.y - line.origin.y);
    const dq = -line.uy * (q.x - line.origin.x) + line.ux * (q.y - line.origin.y);
    if (Math.abs(dp) > toleranceIn || Math.abs(dq) > toleranceIn) continue;
    const tp = line.ux * (p.x - line.origin.x) + line.uy * (p.y - line.origin.y);
    const tq = line.ux * (q.x - line.origin.x) + line.uy * (q.y - line.origin.y);
    out.push(tp < tq ? [tp, tq] : [tq, tp]);
  }
  return mergeIntervals(out, toleranceIn);
}

/** Sorts and merges intervals that overlap or touch within `gapIn`. */
export function mergeIntervals(intervals: ReadonlyArray<readonly [number, number]>, gapIn: number): Array<[number, number]> {
  const sorted = intervals.map(([a, b]) => [a, b] as [number, number]).sort((x, y) => x[0] - y[0]);
  const out: Array<[number, number]> = [];
  for (const iv of sorted) {
    const last = out[out.length - 1];
    if (last && iv[0] <= last[1] + gapIn) last[1] = Math.max(last[1], iv[1]);
    else out.push(iv);
  }
  return out;
}

function intersectIntervals(a: ReadonlyArray<[number, number]>, b: ReadonlyArray<[number, number]>, minLength: number): Array<[number, number]> {
  const out: Array<[number, number]> = [];
  for (const [a0, a1] of a) {
    for (const [b0, b1] of b) {
      const lo = Math.max(a0, b0);
      const hi = Math.min(a1, b1);
      if (hi - lo >= minLength) out.push([lo, hi]);
    }
  }
  return out;
}

function contactsOf(ring: readonly Point[], k: number, polygons: readonly Point[][], toleranceIn: number, minSeamLengthIn: number): PatchContacts {
  const lines: PatchLine[] = [];
  const n = ring.length;
  for (let i = 0; i < n; i++) {
    const p = ring[i];
    const q = ring[(i + 1) % n];
    const length = Math.hypot(q.x - p.x, q.y - p.y);
    if (length <= toleranceIn) continue;
    const ux = (q.x - p.x) / length;
    const uy = (q.y - p.y) / length;
    // Collinear edges of one patch share a line.
    if (lines.some((l) => Math.abs(-l.uy * (p.x - l.origin.x) + l.ux * (p.y - l.origin.y)) <= toleranceIn && Math.abs(-l.uy * (q.x - l.origin.x) + l.ux * (q.y - l.origin.y)) <= toleranceIn)) continue;
    const geometry = { origin: { x: p.x, y: p.y }, ux, uy };
    lines.push({
      ...geometry,
      own: intervalsOn(ring, geometry, toleranceIn),
      ownSide: sideOf(ring, geometry, toleranceIn),
      sides: new Int8Array(polygons.length),
      shared: polygons.map(() => []),
    });
  }
  const linesTouching: number[][] = polygons.map(() => []);
  polygons.forEach((other, j) => {
    if (j === k) return;
    lines.forEach((line, li) => {
      line.sides[j] = sideOf(other, line, toleranceIn);
      const shared = intersectIntervals(line.own, intervalsOn(other, line, toleranceIn), minSeamLengthIn);
      if (shared.length > 0) {
        line.shared[j] = mergeIntervals(shared, toleranceIn);
        linesTouching[j].push(li);
      }
    });
  });
  return { lines, linesTouching };
}

/** The result of asking whether patch k can be sewn onto a set of earlier patches. */
export type AddCheck =
  | { ok: true; line: number; from: number; to: number }
  | { ok: false; reason: 'no-shared-seam' | 'not-one-straight-seam' | 'earlier-patches-both-sides' | 'patch-crosses-seam-line'; culprit?: number };

/**
 * Whether patch `k` can be sewn onto the union of the patches marked in `earlier` (design.md §5.3): it
 * meets them along one straight stretch, they all lie on one side of that line, and it on the other.
 */
export function canAdd(contacts: PatchContacts, earlier: ArrayLike<number>, count: number, gapIn: number): AddCheck {
  let lineIndex = -1;
  for (let j = 0; j < count; j++) {
    if (!earlier[j]) continue;
    for (const li of contacts.linesTouching[j]) {
      if (lineIndex < 0) lineIndex = li;
      else if (li !== lineIndex) return { ok: false, reason: 'not-one-straight-seam', culprit: j };
    }
  }
  if (lineIndex < 0) return { ok: false, reason: 'no-shared-seam' };
  const line = contacts.lines[lineIndex];
  const pieces: Array<[number, number]> = [];
  let side = 0;
  for (let j = 0; j < count; j++) {
    if (!earlier[j]) continue;
    const s = line.sides[j];
    if (s === 2 || (s !== 0 && side !== 0 && s !== side)) return { ok: false, reason: 'earlier-patches-both-sides', culprit: j };
    if (s !== 0) side = s;
    pieces.push(...line.shared[j]);
  }
  const merged = mergeIntervals(pieces, gapIn);
  if (merged.length > 1) return { ok: false, reason: 'not-one-straight-seam' };
  if (line.ownSide === 2) return { ok: false, reason: 'patch-crosses-seam-line' };
  return { ok: true, line: lineIndex, from: merged[0][0], to: merged[0][1] };
}

/** The point at position `t` along line `lineIndex` of the contacts. */
export function pointOnLine(contacts: PatchContacts, lineIndex: number, t: number): Point {
  const l = contacts.lines[lineIndex];
  return { x: l.origin.x + l.ux * t, y: l.origin.y + l.uy * t };
}
