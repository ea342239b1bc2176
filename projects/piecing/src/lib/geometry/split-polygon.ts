import type { Point } from '../document/pattern-schema';
import { GEOMETRY_EPSILON_IN } from '../tolerance';
import { cleanRing } from './clean-ring';
import { locatePoint } from './polygon';

/** A point where a line meets a ring's boundary: at vertex `index`, or on edge `index` (vertex index → index + 1). */
export interface BoundaryHit {
  /** Position along the line, in inches from the line's start point. */
  t: number;
  point: Point;
  on: 'vertex' | 'edge';
  index: number;
}

/** A stretch of the line that runs through the inside of the ring, between two boundary hits. */
export interface Chord {
  from: BoundaryHit;
  to: BoundaryHit;
}

/**
 * The chords along which the infinite line through `a` and `b` runs through the inside of `ring`, ordered
 * along the line from `a` towards `b`. Stretches along an edge are not chords. `t` is measured from `a`.
 */
export function lineChords(ring: readonly Point[], a: Point, b: Point, toleranceIn = GEOMETRY_EPSILON_IN): Chord[] {
  const length = Math.hypot(b.x - a.x, b.y - a.y);
  if (!(length > 0) || ring.length < 3) return [];
  const ux = (b.x - a.x) / length;
  const uy = (b.y - a.y) / length;
  const n = ring.length;
  const side = ring.map((v) => -uy * (v.x - a.x) + ux * (v.y - a.y));
  const sign = side.map((d) => (Math.abs(d) <= toleranceIn ? 0 : d > 0 ? 1 : -1));
  const along = (p: Point) => ux * (p.x - a.x) + uy * (p.y - a.y);
  const hits: BoundaryHit[] = [];
  for (let k = 0; k < n; k++) {
    if (sign[k] === 0) hits.push({ t: along(ring[k]), point: { x: ring[k].x, y: ring[k].y }, on: 'vertex', index: k });
    const k2 = (k + 1) % n;
    if (sign[k] * sign[k2] === -1) {
      const lambda = side[k] / (side[k] - side[k2]);
      const point = { x: ring[k].x + (ring[k2].x - ring[k].x) * lambda, y: ring[k].y + (ring[k2].y - ring[k].y) * lambda };
      hits.push({ t: along(point), point, on: 'edge', index: k });
    }
  }
  hits.sort((h1, h2) => h1.t - h2.t);
  const chords: Chord[] = [];
  for (let i = 0; i + 1 < hits.length; i++) {
    const from = hits[i];
    const to = hits[i + 1];
    if (to.t - from.t <= toleranceIn) continue;
    const tm = (from.t + to.t) / 2;
    if (locatePoint({ x: a.x + ux * tm, y: a.y + uy * tm }, ring, toleranceIn) === 'inside') chords.push({ from, to });
  }
  return chords;
}

/**
 * Splits a simple ring along one of its chords into the two rings on either side: the first runs from
 * the chord's `from` point forward along the ring to its `to` point, the second from `to` onward back to
 * `from`. Both are cleaned. The input ring is untouched.
 */
export function splitRingAtChord(ring: readonly Point[], chord: Chord): [Point[], Point[]] {
  type Node = { point: Point; mark?: 'from' | 'to' };
  const nodes: Node[] = [];
  const edgeHits = [chord.from, chord.to].filter((h) => h.on === 'edge');
  for (let k = 0; k < ring.length; k++) {
    const mark = [chord.from, chord.to].find((h) => h.on === 'vertex' && h.index === k);
    nodes.push({ point: ring[k], mark: mark ? (mark === chord.from ? 'from' : 'to') : undefined });
    const onEdge = edgeHits
      .filter((h) => h.index === k)
      .map((h) => ({ h, d: Math.hypot(h.point.x - ring[k].x, h.point.y - ring[k].y) }))
      .sort((x, y) => x.d - y.d);
    for (const { h } of onEdge) nodes.push({ point: h.point, mark: h === chord.from ? 'from' : 'to' });
  }
  const iFrom = nodes.findIndex((nd) => nd.mark === 'from');
  const iTo = nodes.findIndex((nd) => nd.mark === 'to');
  const walk = (start: number, end: number): Point[] => {
    const out: Point[] = [];
    for (let i = start; ; i = (i + 1) % nodes.length) {
      out.push({ x: nodes[i].point.x, y: nodes[i].point.y });
      if (i === end) break;
    }
    return out;
  };
  return [cleanRing(walk(iFrom, iTo)), cleanRing(walk(iTo, iFrom))];
}
