import type { PatternDocument, Point } from '../document/pattern-schema';
import { expandRingRepeat, flattenSectionOutline, polygonBounds, type Bounds } from '../geometry/index';

/**
 * Tolerances of the joining check, in inches and degrees. Two flattenings of the same arc stray at most
 * twice the chord tolerance (0.002 in.) from each other, well inside `TOUCH_IN`.
 */
export const JOIN_TOLERANCES = {
  /** Edge points this close to the other part's edge touch it. */
  TOUCH_IN: 0.005,
  /** Ends of stretches this close are one point. */
  SNAP_IN: 0.01,
  /** Gaps this short along one edge are bridged (chord corners of the other part). */
  GAP_IN: 0.01,
  /** A shared stretch shorter than this is a corner touching a corner, not a seam. */
  MIN_SEAM_IN: 0.05,
  /** Edges meeting at more than this angle do not run along each other. */
  PARALLEL_DEG: 30,
  /** A seam path turning by more than this is a corner to pivot round (an inset), not a curve. */
  CORNER_DEG: 30,
  /** How far along the path either side of a point its direction is taken, so chords of a curve do not count as corners. */
  TURN_LOOK_IN: 0.05,
} as const;

/** One placed copy of a section: the section itself, or a ring-repeat copy. */
export interface SectionInstance {
  /** `matchingMarks` and `expandRingRepeat` ids: the section id, `<id>_r<k+1>` for copy k. */
  id: string;
  sectionId: string;
  sectionIndex: number;
  copyIndex: number;
  ring: Point[];
  bounds: Bounds;
}

/** Every placed copy of every section, in document order. */
export function sectionInstances(doc: Pick<PatternDocument, 'sections'>): SectionInstance[] {
  const out: SectionInstance[] = [];
  doc.sections.forEach((section, sectionIndex) => {
    expandRingRepeat(section).forEach((copy, copyIndex) => {
      const ring = flattenSectionOutline(copy.geometry);
      out.push({ id: copy.id, sectionId: section.id, sectionIndex, copyIndex, ring, bounds: polygonBounds(ring) });
    });
  });
  return out;
}

/** A stretch of one instance's edge i (from ring[i] to ring[i+1]) between parameters lo and hi. */
interface EdgeInterval {
  edge: number;
  lo: number;
  hi: number;
}

/** What the contact search computed between two instances, from the first one's side. */
type PairContact = EdgeInterval[];

/**
 * The stretches of edge two sets of section copies share, found from the copies' flattened outlines
 * (caching every pair of copies it looks at). Pure apart from its cache; one per document.
 */
export class ContactFinder {
  private readonly cache = new Map<string, PairContact>();
  private adjacency?: number[][];
  private readonly memberSets = new WeakMap<readonly number[], Set<number>>();

  constructor(readonly instances: readonly SectionInstance[]) {}

  /** The copies whose bounds come within touching distance of copy `i` (found once for all, by a sweep along x). */
  neighbours(i: number): readonly number[] {
    if (!this.adjacency) {
      const t = JOIN_TOLERANCES.TOUCH_IN;
      const adjacency: number[][] = this.instances.map(() => []);
      const order = this.instances.map((_, k) => k).sort((a, b) => this.instances[a].bounds.minX - this.instances[b].bounds.minX);
      for (let x = 0; x < order.length; x++) {
        const a = order[x];
        const maxX = this.instances[a].bounds.maxX + t;
        for (let y = x + 1; y < order.length && this.instances[order[y]].bounds.minX <= maxX; y++) {
          const b = order[y];
          if (this.near(a, b)) {
            adjacency[a].push(b);
            adjacency[b].push(a);
          }
        }
      }
      this.adjacency = adjacency;
    }
    return this.adjacency[i];
  }

  /** Whether the bounds of two copies come within touching distance. */
  near(i: number, j: number): boolean {
    const a = this.instances[i].bounds;
    const b = this.instances[j].bounds;
    const t = JOIN_TOLERANCES.TOUCH_IN;
    return a.minX <= b.maxX + t && b.minX <= a.maxX + t && a.minY <= b.maxY + t && b.minY <= a.maxY + t;
  }

  /**
   * The shared stretches between the parts made of copies `a` and copies `b`, as paths along the edge of
   * the part with fewer copies (both parts' edges run together there, within TOUCH_IN).
   */
  contact(a: readonly number[], b: readonly number[]): ContactPaths {
    if (b.length < a.length) [a, b] = [b, a];
    const segments: Array<[Point, Point]> = [];
    // The larger part is often the unit grown so far, asked about again and again: keep its set.
    let inB = this.memberSets.get(b);
    if (!inB) this.memberSets.set(b, (inB = new Set(b)));
    for (const i of a) {
      const near = this.neighbours(i).filter((j) => inB.has(j));
      if (near.length === 0) continue;
      const intervals: EdgeInterval[] = [];
      for (const j of near) intervals.push(...this.pair(i, j));
      const ring = this.instances[i].ring;
      for (const { edge, lo, hi } of mergeEdgeIntervals(intervals, ring)) {
        const p = ring[edge];
        const q = ring[(edge + 1) % ring.length];
        segments.push([at(p, q, lo), at(p, q, hi)]);
      }
    }
    return chainSegments(segments);
  }

  private pair(i: number, j: number): PairContact {
    const key = `${i}|${j}`;
    let found = this.cache.get(key);
    if (!found) {
      found = edgeContacts(this.instances[i].ring, this.instances[j].ring);
      this.cache.set(key, found);
    }
    return found;
  }
}

function at(p: Point, q: Point, t: number): Point {
  return { x: p.x + (q.x - p.x) * t, y: p.y + (q.y - p.y) * t };
}

/**
 * For every edge of ring P, the parameter stretches lying within TOUCH_IN of an edge of ring Q that runs
 * along it (within PARALLEL_DEG), measured square to that edge (so a collinear continuation of Q's edge
 * past its end, or an edge meeting Q's at a corner, does not count).
 */
function edgeContacts(P: readonly Point[], Q: readonly Point[]): EdgeInterval[] {
  const tol = JOIN_TOLERANCES.TOUCH_IN;
  const cosParallel = Math.cos((JOIN_TOLERANCES.PARALLEL_DEG * Math.PI) / 180);
  const qb = polygonBounds(Q);
  const out: EdgeInterval[] = [];
  for (let e = 0; e < P.length; e++) {
    const p = P[e];
    const q = P[(e + 1) % P.length];
    if (Math.min(p.x, q.x) > qb.maxX + tol || Math.max(p.x, q.x) < qb.minX - tol || Math.min(p.y, q.y) > qb.maxY + tol || Math.max(p.y, q.y) < qb.minY - tol) continue;
    const dx = q.x - p.x;
    const dy = q.y - p.y;
    const len = Math.hypot(dx, dy);
    if (len === 0) continue;
    for (let f = 0; f < Q.length; f++) {
      const a = Q[f];
      const b = Q[(f + 1) % Q.length];
      if (Math.min(a.x, b.x) > Math.max(p.x, q.x) + tol || Math.max(a.x, b.x) < Math.min(p.x, q.x) - tol) continue;
      if (Math.min(a.y, b.y) > Math.max(p.y, q.y) + tol || Math.max(a.y, b.y) < Math.min(p.y, q.y) - tol) continue;
      const ex = b.x - a.x;
      const ey = b.y - a.y;
      const elen = Math.hypot(ex, ey);
      if (elen === 0) continue;
      const ux = ex / elen;
      const uy = ey / elen;
      if (Math.abs((dx * ux + dy * uy) / len) < cosParallel) continue;
      // P's edge point p + t(q − p) in Q-edge coordinates: along s(t) = s0 + t·ds, across n(t) = n0 + t·dn.
      const s0 = (p.x - a.x) * ux + (p.y - a.y) * uy;
      const ds = dx * ux + dy * uy;
      const n0 = -(p.x - a.x) * uy + (p.y - a.y) * ux;
      const dn = -dx * uy + dy * ux;
      let lo = 0;
      let hi = 1;
      [lo, hi] = clip(lo, hi, s0, ds, 0, elen);
      [lo, hi] = clip(lo, hi, n0, dn, -tol, tol);
      if (hi > lo) out.push({ edge: e, lo, hi });
    }
  }
  return out;
}

/** Narrows [lo, hi] to the t where v0 + t·dv lies in [min, max]. */
function clip(lo: number, hi: number, v0: number, dv: number, min: number, max: number): [number, number] {
  if (Math.abs(dv) < 1e-15) return v0 >= min && v0 <= max ? [lo, hi] : [1, 0];
  let t1 = (min - v0) / dv;
  let t2 = (max - v0) / dv;
  if (t1 > t2) [t1, t2] = [t2, t1];
  return [Math.max(lo, t1), Math.min(hi, t2)];
}

/** Intervals on the same edge merged where they overlap or leave a gap shorter than GAP_IN; ends within GAP_IN of a corner reach it. */
function mergeEdgeIntervals(intervals: EdgeInterval[], ring: readonly Point[]): EdgeInterval[] {
  const byEdge = new Map<number, EdgeInterval[]>();
  for (const iv of intervals) {
    const list = byEdge.get(iv.edge);
    if (list) list.push(iv);
    else byEdge.set(iv.edge, [iv]);
  }
  const out: EdgeInterval[] = [];
  for (const [edge, list] of [...byEdge.entries()].sort((x, y) => x[0] - y[0])) {
    const p = ring[edge];
    const q = ring[(edge + 1) % ring.length];
    const len = Math.hypot(q.x - p.x, q.y - p.y);
    const gap = JOIN_TOLERANCES.GAP_IN / len;
    list.sort((x, y) => x.lo - y.lo);
    let cur = { ...list[0] };
    for (const iv of list.slice(1)) {
      if (iv.lo <= cur.hi + gap) cur.hi = Math.max(cur.hi, iv.hi);
      else {
        out.push(cur);
        cur = { ...iv };
      }
    }
    out.push(cur);
  }
  for (const iv of out) {
    const p = ring[iv.edge];
    const q = ring[(iv.edge + 1) % ring.length];
    const gap = JOIN_TOLERANCES.GAP_IN / Math.hypot(q.x - p.x, q.y - p.y);
    if (iv.lo < gap) iv.lo = 0;
    if (iv.hi > 1 - gap) iv.hi = 1;
  }
  return out;
}

/** The shared edge between two parts, chained into paths, with what stands in the way of one seam. */
export interface ContactPaths {
  /** Ordered polylines; a closed one repeats its first point at the end. */
  paths: Point[][];
  lengthIn: number;
  /** Whether the paths make one seam sewn without pivoting: one path with no corner and no branch. */
  continuous: boolean;
  /** Where the seam would have to pivot or stops and starts again (when not continuous and touching). */
  pivot?: Point;
}

/** Chains edge pieces into paths: ends within SNAP_IN meet; pieces forming less than MIN_SEAM_IN in all are corner contacts and dropped. */
export function chainSegments(segments: ReadonlyArray<readonly [Point, Point]>): ContactPaths {
  const snap = JOIN_TOLERANCES.SNAP_IN;
  const nodes: Point[] = [];
  const grid = new Map<string, number[]>();
  const cell = (v: number) => Math.floor(v / snap);
  const nodeOf = (p: Point): number => {
    const cx = cell(p.x);
    const cy = cell(p.y);
    for (let ix = cx - 1; ix <= cx + 1; ix++) {
      for (let iy = cy - 1; iy <= cy + 1; iy++) {
        for (const k of grid.get(`${ix},${iy}`) ?? []) if (Math.hypot(nodes[k].x - p.x, nodes[k].y - p.y) <= snap) return k;
      }
    }
    nodes.push({ x: p.x, y: p.y });
    const key = `${cx},${cy}`;
    const list = grid.get(key);
    if (list) list.push(nodes.length - 1);
    else grid.set(key, [nodes.length - 1]);
    return nodes.length - 1;
  };
  const edges: Array<[number, number]> = [];
  const seen = new Set<string>();
  for (const [p, q] of segments) {
    const u = nodeOf(p);
    const v = nodeOf(q);
    if (u === v) continue;
    const key = u < v ? `${u}|${v}` : `${v}|${u}`;
    if (seen.has(key)) continue;
    seen.add(key);
    edges.push([u, v]);
  }
  const adjacency = new Map<number, number[]>();
  edges.forEach(([u, v], k) => {
    for (const n of [u, v]) {
      const list = adjacency.get(n);
      if (list) list.push(k);
      else adjacency.set(n, [k]);
    }
  });
  const edgeLength = (k: number) => Math.hypot(nodes[edges[k][0]].x - nodes[edges[k][1]].x, nodes[edges[k][0]].y - nodes[edges[k][1]].y);

  // Components by edges.
  const component = new Int32Array(edges.length).fill(-1);
  const components: number[][] = [];
  for (let k = 0; k < edges.length; k++) {
    if (component[k] >= 0) continue;
    const id = components.length;
    const members: number[] = [];
    const stack = [k];
    component[k] = id;
    while (stack.length) {
      const e = stack.pop()!;
      members.push(e);
      for (const n of edges[e]) for (const f of adjacency.get(n)!) if (component[f] < 0) { component[f] = id; stack.push(f); }
    }
    components.push(members);
  }

  const paths: Point[][] = [];
  let lengthIn = 0;
  let branch: Point | undefined;
  for (const members of components) {
    const length = members.reduce((s, k) => s + edgeLength(k), 0);
    if (length < JOIN_TOLERANCES.MIN_SEAM_IN) continue;
    lengthIn += length;
    const memberSet = new Set(members);
    const degree = (n: number) => adjacency.get(n)!.filter((k) => memberSet.has(k)).length;
    const nodeIds = [...new Set(members.flatMap((k) => edges[k]))];
    const fork = nodeIds.find((n) => degree(n) > 2);
    if (fork !== undefined && !branch) branch = nodes[fork];
    paths.push(walk(members, memberSet, nodeIds, degree));
  }

  function walk(members: number[], memberSet: Set<number>, nodeIds: number[], degree: (n: number) => number): Point[] {
    const start = nodeIds.find((n) => degree(n) === 1) ?? edges[members[0]][0];
    const used = new Set<number>();
    const out = [nodes[start]];
    let at = start;
    for (;;) {
      const next = adjacency.get(at)!.find((k) => memberSet.has(k) && !used.has(k));
      if (next === undefined) break;
      used.add(next);
      at = edges[next][0] === at ? edges[next][1] : edges[next][0];
      out.push(nodes[at]);
    }
    return out;
  }

  if (paths.length === 0) return { paths, lengthIn: 0, continuous: false };
  if (branch) return { paths, lengthIn, continuous: false, pivot: branch };
  if (paths.length > 1) return { paths, lengthIn, continuous: false, pivot: nearestEnds(paths[0], paths[1]) };
  const corner = findCorner(paths[0]);
  if (corner) return { paths, lengthIn, continuous: false, pivot: corner };
  return { paths, lengthIn, continuous: true };
}

/** The end of path `a` nearest to path `b`'s ends: where one seam stops and the other would start. */
function nearestEnds(a: Point[], b: Point[]): Point {
  let best = a[0];
  let bestD = Infinity;
  for (const p of [a[0], a[a.length - 1]]) {
    for (const q of [b[0], b[b.length - 1]]) {
      const d = Math.hypot(p.x - q.x, p.y - q.y);
      if (d < bestD) {
        bestD = d;
        best = p;
      }
    }
  }
  return best;
}

/** The first point where the path turns by more than CORNER_DEG, looking TURN_LOOK_IN either way. */
function findCorner(path: Point[]): Point | undefined {
  const closed = path.length > 3 && path[0] === path[path.length - 1];
  const pts = closed ? path.slice(0, -1) : path;
  const n = pts.length;
  const look = JOIN_TOLERANCES.TURN_LOOK_IN;
  const cosCorner = Math.cos((JOIN_TOLERANCES.CORNER_DEG * Math.PI) / 180);
  const step = (i: number, dir: 1 | -1): Point | undefined => {
    let d = 0;
    let k = i;
    for (let count = 0; count < n; count++) {
      const next = k + dir;
      if (!closed && (next < 0 || next >= n)) return count === 0 ? undefined : pts[k];
      k = (next + n) % n;
      d += Math.hypot(pts[k].x - pts[(k - dir + n) % n].x, pts[k].y - pts[(k - dir + n) % n].y);
      if (d >= look) return pts[k];
    }
    return pts[k];
  };
  for (let i = closed ? 0 : 1; i < (closed ? n : n - 1); i++) {
    const before = step(i, -1);
    const after = step(i, 1);
    if (!before || !after) continue;
    const ax = pts[i].x - before.x;
    const ay = pts[i].y - before.y;
    const bx = after.x - pts[i].x;
    const by = after.y - pts[i].y;
    const cos = (ax * bx + ay * by) / (Math.hypot(ax, ay) * Math.hypot(bx, by));
    if (cos < cosCorner) return pts[i];
  }
  return undefined;
}

/** Whether the paths stray from straight lines by more than `toleranceIn` (a closed path is always curved). */
export function isCurved(paths: readonly Point[][], toleranceIn = 0.01): boolean {
  return paths.some((path) => {
    if (path.length > 3 && path[0] === path[path.length - 1]) return true;
    const a = path[0];
    const b = path[path.length - 1];
    const len = Math.hypot(b.x - a.x, b.y - a.y);
    if (len === 0) return true;
    return path.some((p) => Math.abs((p.x - a.x) * (b.y - a.y) - (p.y - a.y) * (b.x - a.x)) / len > toleranceIn);
  });
}
