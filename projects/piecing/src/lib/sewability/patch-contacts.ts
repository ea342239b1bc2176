import type { Point } from '../document/pattern-schema';
import { polygonBounds, type Bounds } from '../geometry/polygon';
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
  /** Per neighbouring patch: merged intervals of this line shared with that patch's boundary. */
  shared: Map<number, Array<[number, number]>>;
  /** Per patch: its side of the line, filled on first use (−1, +1, 0 when only on it, 2 for both; 3 not yet known). */
  sides: Int8Array;
}

/** What one patch shares with the others. */
export interface PatchContacts {
  lines: PatchLine[];
  /** For each neighbouring patch j (one that shares a stretch of edge), the indices of the lines it touches. */
  linesTouching: Map<number, number[]>;
}

/** The precomputation behind the sewability check: every patch's edge lines and what it shares with whom. */
export interface ContactGraph {
  rings: readonly Point[][];
  bounds: Bounds[];
  contacts: PatchContacts[];
  toleranceIn: number;
}

const UNKNOWN_SIDE = 3;

/** Precomputes, for every patch, its edge lines and the stretches of them it shares with each other patch. */
export function computeContacts(polygons: readonly Point[][], toleranceIn = GEOMETRY_EPSILON_IN, minSeamLengthIn = SEAM_REACH_TOLERANCE_IN): ContactGraph {
  const bounds = polygons.map((ring) => polygonBounds(ring));
  const contacts = polygons.map((ring, k) => contactsOf(ring, k, polygons, bounds, toleranceIn, minSeamLengthIn));
  return { rings: polygons, bounds, contacts, toleranceIn };
}

type LineGeometry = { origin: Point; ux: number; uy: number };

function sideOfPoints(ring: readonly Point[], line: LineGeometry, toleranceIn: number): number {
  let pos = false;
  let neg = false;
  for (const p of ring) {
    const d = -line.uy * (p.x - line.origin.x) + line.ux * (p.y - line.origin.y);
    if (d > toleranceIn) pos = true;
    else if (d < -toleranceIn) neg = true;
    if (pos && neg) return 2;
  }
  return pos ? 1 : neg ? -1 : 0;
}

/** Side of a box wholly off the line (−1 / +1), or null when the line passes through it or within the tolerance of it. */
function sideOfBox(b: Bounds, line: LineGeometry, toleranceIn: number): number | null {
  const nx = -line.uy;
  const ny = line.ux;
  const ox = line.origin.x;
  const oy = line.origin.y;
  const d0 = nx * (b.minX - ox) + ny * (b.minY - oy);
  const d1 = nx * (b.maxX - ox) + ny * (b.minY - oy);
  const d2 = nx * (b.maxX - ox) + ny * (b.maxY - oy);
  const d3 = nx * (b.minX - ox) + ny * (b.maxY - oy);
  if (d0 > toleranceIn && d1 > toleranceIn && d2 > toleranceIn && d3 > toleranceIn) return 1;
  if (d0 < -toleranceIn && d1 < -toleranceIn && d2 < -toleranceIn && d3 < -toleranceIn) return -1;
  return null;
}

/** Intervals of collinear edges of `ring` on the line. */
function intervalsOn(ring: readonly Point[], line: LineGeometry, toleranceIn: number): Array<[number, number]> {
  const out: Array<[number, number]> = [];
  const n = ring.length;
  for (let i = 0; i < n; i++) {
    const p = ring[i];
    const q = ring[(i + 1) % n];
    const dp = -line.uy * (p.x - line.origin.x) + line.ux * (p.y - line.origin.y);
    if (Math.abs(dp) > toleranceIn) continue;
    const dq = -line.uy * (q.x - line.origin.x) + line.ux * (q.y - line.origin.y);
    if (Math.abs(dq) > toleranceIn) continue;
    const tp = line.ux * (p.x - line.origin.x) + line.uy * (p.y - line.origin.y);
    const tq = line.ux * (q.x - line.origin.x) + line.uy * (q.y - line.origin.y);
    out.push(tp < tq ? [tp, tq] : [tq, tp]);
  }
  // Most lines hold no edge of a given ring, or one: nothing to sort or merge.
  return out.length < 2 ? out : mergeIntervals(out, toleranceIn);
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

function boxesTouch(a: Bounds, b: Bounds, tol: number): boolean {
  return a.minX <= b.maxX + tol && b.minX <= a.maxX + tol && a.minY <= b.maxY + tol && b.minY <= a.maxY + tol;
}

function contactsOf(ring: readonly Point[], k: number, polygons: readonly Point[][], bounds: Bounds[], toleranceIn: number, minSeamLengthIn: number): PatchContacts {
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
    const sides = new Int8Array(polygons.length).fill(UNKNOWN_SIDE);
    lines.push({ ...geometry, own: intervalsOn(ring, geometry, toleranceIn), ownSide: sideOfPoints(ring, geometry, toleranceIn), shared: new Map(), sides });
  }
  const linesTouching = new Map<number, number[]>();
  polygons.forEach((other, j) => {
    if (j === k || !boxesTouch(bounds[k], bounds[j], toleranceIn)) return;
    lines.forEach((line, li) => {
      // A box wholly off the line (beyond the tolerance) has no edge on it.
      if (sideOfBox(bounds[j], line, toleranceIn) !== null) return;
      const shared = intersectIntervals(line.own, intervalsOn(other, line, toleranceIn), minSeamLengthIn);
      if (shared.length === 0) return;
      line.shared.set(j, mergeIntervals(shared, toleranceIn));
      const list = linesTouching.get(j);
      if (list) list.push(li);
      else linesTouching.set(j, [li]);
    });
  });
  return { lines, linesTouching };
}

/** Side of patch j relative to line `li` of patch k, computed once and remembered. */
function sideOf(graph: ContactGraph, k: number, li: number, j: number): number {
  const line = graph.contacts[k].lines[li];
  let s = line.sides[j];
  if (s === UNKNOWN_SIDE) {
    s = sideOfBox(graph.bounds[j], line, graph.toleranceIn) ?? sideOfPoints(graph.rings[j], line, graph.toleranceIn);
    line.sides[j] = s;
  }
  return s;
}

/** The result of asking whether patch k can be sewn onto a set of earlier patches. */
export type AddCheck =
  | { ok: true; line: number; from: number; to: number }
  | { ok: false; reason: 'no-shared-seam' | 'not-one-straight-seam' | 'earlier-patches-both-sides' | 'patch-crosses-seam-line'; culprit?: number };

/**
 * Whether patch `k` can be sewn onto the union of the patches marked in `earlier` (docs/design-notes.md#sewability): it
 * meets them along one straight stretch, they all lie on one side of that line, and it on the other.
 */
export function canAdd(graph: ContactGraph, k: number, earlier: ArrayLike<number>, gapIn: number): AddCheck {
  const contacts = graph.contacts[k];
  let lineIndex = -1;
  for (const [j, lineIndices] of contacts.linesTouching) {
    if (!earlier[j]) continue;
    for (const li of lineIndices) {
      if (lineIndex < 0) lineIndex = li;
      else if (li !== lineIndex) return { ok: false, reason: 'not-one-straight-seam', culprit: j };
    }
  }
  if (lineIndex < 0) return { ok: false, reason: 'no-shared-seam' };
  const line = contacts.lines[lineIndex];
  const pieces: Array<[number, number]> = [];
  for (const [j, intervals] of line.shared) if (earlier[j]) pieces.push(...intervals);
  const merged = mergeIntervals(pieces, gapIn);
  if (merged.length > 1) return { ok: false, reason: 'not-one-straight-seam' };
  if (line.ownSide === 2) return { ok: false, reason: 'patch-crosses-seam-line' };
  let side = 0;
  for (let j = 0; j < graph.rings.length; j++) {
    if (!earlier[j]) continue;
    const s = sideOf(graph, k, lineIndex, j);
    if (s === 2 || (s !== 0 && side !== 0 && s !== side)) return { ok: false, reason: 'earlier-patches-both-sides', culprit: j };
    if (s !== 0) side = s;
  }
  return { ok: true, line: lineIndex, from: merged[0][0], to: merged[0][1] };
}

/** The point at position `t` along line `lineIndex` of patch k. */
export function pointOnLine(graph: ContactGraph, k: number, lineIndex: number, t: number): Point {
  const l = graph.contacts[k].lines[lineIndex];
  return { x: l.origin.x + l.ux * t, y: l.origin.y + l.uy * t };
}

/** Side of patch j relative to line `li` of patch k (−1, +1, 0 on it, 2 both). */
export function patchSideOfLine(graph: ContactGraph, k: number, li: number, j: number): number {
  return j === k ? graph.contacts[k].lines[li].ownSide : sideOf(graph, k, li, j);
}
