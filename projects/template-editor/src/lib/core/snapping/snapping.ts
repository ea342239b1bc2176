import Flatbush from 'flatbush';
import { CM_PER_INCH, distance, pointOnCircle, degToRad, type PatternDocument, type Point, type Section } from '@seamwright/piecing';

/** Grid snap settings offered on the board. */
export type GridSnap = 'off' | 'eighth-in' | 'quarter-in' | 'half-in' | 'half-cm';

/** Step of each grid snap, in inches. */
export const GRID_SNAP_STEP_IN: Record<Exclude<GridSnap, 'off'>, number> = {
  'eighth-in': 1 / 8,
  'quarter-in': 1 / 4,
  'half-in': 1 / 2,
  'half-cm': 0.5 / CM_PER_INCH,
};

/** What a snapped point landed on. */
export type SnapKind = 'vertex' | 'seam-end' | 'centre' | 'edge' | 'grid' | 'none';

/** A point the pointer may snap to. */
export interface SnapTarget {
  point: Point;
  kind: 'vertex' | 'seam-end' | 'centre';
  sectionId: string;
}

/** The outcome of snapping one pointer position. */
export interface SnapResult {
  point: Point;
  kind: SnapKind;
  sectionId?: string;
}

/** How to snap. */
export interface SnapOptions {
  grid: GridSnap;
  /** Whether to snap to vertices, seam ends and circle centres. */
  toPoints: boolean;
  /** Catch radius for point and edge snapping, in inches (a few screen pixels at the current zoom). */
  radiusIn: number;
}

/** Rounds `p` to the grid step (no change with snapping off). */
export function snapToGrid(p: Point, grid: GridSnap): Point {
  if (grid === 'off') return { x: p.x, y: p.y };
  const step = GRID_SNAP_STEP_IN[grid];
  return { x: Math.round(p.x / step) * step, y: Math.round(p.y / step) * step };
}

/** The points of the document one can snap to: outline vertices, arc corners, seam ends and circle centres. */
export function collectSnapTargets(document: PatternDocument, excludeSectionId?: string, cache?: WeakMap<Section, SnapTarget[]>): SnapTarget[] {
  const out: SnapTarget[] = [];
  for (const s of document.sections) {
    if (s.id === excludeSectionId) continue;
    let own = cache?.get(s);
    if (!own) {
      own = sectionSnapTargets(s);
      cache?.set(s, own);
    }
    for (const t of own) out.push(t);
  }
  return out;
}

/** The snap targets of one section. */
export function sectionSnapTargets(s: Section): SnapTarget[] {
  const out: SnapTarget[] = [];
  {
    const g = s.geometry;
    if (g.kind === 'straight') {
      for (const v of g.vertices) out.push({ point: v, kind: 'vertex', sectionId: s.id });
    } else {
      out.push({ point: g.centre, kind: 'centre', sectionId: s.id });
      const a0 = degToRad(g.startAngleDeg);
      const a1 = degToRad(g.startAngleDeg + g.sweepDeg);
      const radii = g.kind === 'arc' ? [g.innerRadiusIn, g.outerRadiusIn] : [g.radiusIn];
      for (const r of radii) for (const a of [a0, a1]) out.push({ point: pointOnCircle(g.centre, r, a), kind: 'vertex', sectionId: s.id });
      if (g.kind === 'wedge') out.push({ point: g.centre, kind: 'vertex', sectionId: s.id });
    }
    for (const m of s.seams) {
      out.push({ point: m.a, kind: 'seam-end', sectionId: s.id });
      out.push({ point: m.b, kind: 'seam-end', sectionId: s.id });
    }
    if (s.ringRepeat) out.push({ point: s.ringRepeat.centre, kind: 'centre', sectionId: s.id });
  }
  return out;
}

/** The nearest point on segment a–b to p. */
function nearestOnSegment(p: Point, a: Point, b: Point): Point {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const len2 = dx * dx + dy * dy;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p.x - a.x) * dx + (p.y - a.y) * dy) / len2));
  return { x: a.x + dx * t, y: a.y + dy * t };
}

/** The nearest point on any of the rings' edges within `radiusIn`, or null. */
export function snapToEdges(p: Point, rings: ReadonlyArray<readonly Point[]>, radiusIn: number): Point | null {
  let best: Point | null = null;
  let bestD = radiusIn;
  for (const ring of rings) {
    for (let i = 0, n = ring.length; i < n; i++) {
      const q = nearestOnSegment(p, ring[i], ring[(i + 1) % n]);
      const d = distance(q, p);
      if (d <= bestD) {
        bestD = d;
        best = q;
      }
    }
  }
  return best;
}

/** The nearest target within `radiusIn` of `p` (of equally near ones, the last in list order), or null. */
function nearestTarget(p: Point, targets: readonly SnapTarget[], radiusIn: number): SnapTarget | null {
  let best: SnapTarget | null = null;
  let bestD = radiusIn;
  for (const t of targets) {
    const d = distance(t.point, p);
    if (d <= bestD) {
      bestD = d;
      best = t;
    }
  }
  return best;
}

/**
 * Snap targets in a spatial index (a packed R-tree over their points), for documents with thousands of
 * them: a query looks only at the targets in the catch radius's square, and picks the same target a
 * scan of the whole list would.
 */
export class SnapTargetIndex {
  private readonly index: Flatbush | null;

  constructor(readonly targets: readonly SnapTarget[]) {
    if (targets.length === 0) {
      this.index = null;
      return;
    }
    this.index = new Flatbush(targets.length);
    for (const t of targets) this.index.add(t.point.x, t.point.y, t.point.x, t.point.y);
    this.index.finish();
  }

  /** The nearest target within `radiusIn` of `p` (of equally near ones, the last in list order), or null. */
  nearest(p: Point, radiusIn: number): SnapTarget | null {
    if (!this.index) return null;
    const ids = this.index.search(p.x - radiusIn, p.y - radiusIn, p.x + radiusIn, p.y + radiusIn);
    // Back in list order, so ties go to the same target as in a scan of the list.
    ids.sort((a, b) => a - b);
    let best: SnapTarget | null = null;
    let bestD = radiusIn;
    for (const i of ids) {
      const t = this.targets[i];
      const d = distance(t.point, p);
      if (d <= bestD) {
        bestD = d;
        best = t;
      }
    }
    return best;
  }
}

/**
 * Snaps a pointer position: to the nearest point target within the radius first (vertices, seam ends,
 * circle centres), then to the given edges, then to the grid. The targets may come as a list or as a
 * {@link SnapTargetIndex}; both give the same result.
 */
export function snapPoint(p: Point, targets: readonly SnapTarget[] | SnapTargetIndex, options: SnapOptions, edges: ReadonlyArray<readonly Point[]> = []): SnapResult {
  if (options.toPoints) {
    const best = targets instanceof SnapTargetIndex ? targets.nearest(p, options.radiusIn) : nearestTarget(p, targets, options.radiusIn);
    if (best) return { point: { x: best.point.x, y: best.point.y }, kind: best.kind, sectionId: best.sectionId };
  }
  if (edges.length > 0) {
    const e = snapToEdges(p, edges, options.radiusIn);
    if (e) return { point: e, kind: 'edge' };
  }
  if (options.grid !== 'off') return { point: snapToGrid(p, options.grid), kind: 'grid' };
  return { point: { x: p.x, y: p.y }, kind: 'none' };
}
