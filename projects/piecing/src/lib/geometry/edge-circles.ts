import type { Point, Section, StraightGeometry } from '../document/pattern-schema';
import { SEAM_REACH_TOLERANCE_IN } from '../tolerance';
import { sectionEdges, sweepRadToBulge } from './curved-edge';
import { expandRingRepeat } from './ring-repeat';
import { distance, formatPoint, pointOnCircle } from './vector';

/** A circle in the drawing, in inches. */
export interface Circle {
  centre: Point;
  radiusIn: number;
}

/** A circle some section's edge runs along, and the first section copy found on it. */
export interface SectionCircle extends Circle {
  /** The section whose edge lies on the circle. */
  sectionId: string;
  /** The placed copy: the section id for the drawn one, `<id>_r<k+1>` for ring-repeat copy k. */
  instanceId: string;
  /** Which edge: an arc section's `outer` or `inner` arc, a wedge's arc (`outer`), or a curved edge of a straight section. */
  edge: 'outer' | 'inner' | 'curved-edge';
}

// Circles whose centres and radii agree within this are the same circle (inches).
const SAME_CIRCLE_IN = 1e-6;

/**
 * Every circle the sections' curved edges run along: the arcs of arc and wedge sections and the curved
 * edges of straight sections, for every ring-repeat copy, each circle once (the first section copy on
 * it, in document order). The drafting board looks here for the circle a new edge should follow.
 */
export function circlesOfSections(document: { sections: readonly Section[] }): SectionCircle[] {
  const out: SectionCircle[] = [];
  const add = (c: SectionCircle) => {
    if (!out.some((o) => Math.abs(o.radiusIn - c.radiusIn) <= SAME_CIRCLE_IN && distance(o.centre, c.centre) <= SAME_CIRCLE_IN)) out.push(c);
  };
  for (const section of document.sections) {
    for (const copy of expandRingRepeat(section)) {
      const g = copy.geometry;
      const at = { sectionId: section.id, instanceId: copy.id };
      if (g.kind === 'arc') {
        add({ centre: g.centre, radiusIn: g.outerRadiusIn, edge: 'outer', ...at });
        add({ centre: g.centre, radiusIn: g.innerRadiusIn, edge: 'inner', ...at });
      } else if (g.kind === 'wedge') {
        add({ centre: g.centre, radiusIn: g.radiusIn, edge: 'outer', ...at });
      } else {
        for (const e of sectionEdges(g)) if (e.arc) add({ centre: e.arc.centre, radiusIn: e.arc.radiusIn, edge: 'curved-edge', ...at });
      }
    }
  }
  return out;
}

/** How far `p` lies from the circle, in inches. */
export function distanceToCircle(p: Point, circle: Circle): number {
  return Math.abs(distance(p, circle.centre) - circle.radiusIn);
}

/**
 * The circles both ends `a` and `b` lie on, within `toleranceIn` (default: the seam reach tolerance), the
 * closest fit first (the larger of the two ends' distances from the circle).
 */
export function circlesThrough<C extends Circle>(circles: readonly C[], a: Point, b: Point, toleranceIn = SEAM_REACH_TOLERANCE_IN): C[] {
  return circles
    .map((c) => ({ c, off: Math.max(distanceToCircle(a, c), distanceToCircle(b, c)) }))
    .filter((x) => x.off <= toleranceIn)
    .sort((x, y) => x.off - y.off)
    .map((x) => x.c);
}

/** A straight edge whose two ends lie on a circle: a candidate for {@link fitEdgeToCircle}. */
export interface EdgeOnCircle<C extends Circle = Circle> {
  edgeIndex: number;
  /** The circle that fits the ends best. */
  circle: C;
}

/**
 * The straight edges of a straight section whose two ends both lie on one of `circles` (within
 * `toleranceIn`), with the best-fitting circle: where a corner drawn against a ring could follow it.
 * Curved edges are left out (they already follow a circle).
 */
export function edgesOnCircles<C extends Circle>(geometry: StraightGeometry, circles: readonly C[], toleranceIn = SEAM_REACH_TOLERANCE_IN): Array<EdgeOnCircle<C>> {
  const out: Array<EdgeOnCircle<C>> = [];
  for (const edge of sectionEdges(geometry)) {
    if (edge.bulge !== 0 || distance(edge.from, edge.to) <= toleranceIn) continue;
    const [best] = circlesThrough(circles, edge.from, edge.to, toleranceIn);
    if (best) out.push({ edgeIndex: edge.index, circle: best });
  }
  return out;
}

/** The outcome of {@link fitEdgeToCircle}. */
export type FitEdgeResult =
  | { ok: true; geometry: StraightGeometry }
  | { ok: false; message: string; /** How far the farther end lies from the circle, in inches (0 for other problems). */ offByIn: number };

/** Settings for {@link fitEdgeToCircle}. */
export interface FitEdgeOptions {
  /** How far an end may lie from the circle, in inches (default: the seam reach tolerance, 0.01 in.). */
  toleranceIn?: number;
}

/**
 * Makes edge `edgeIndex` of a straight section follow `circle`: both ends are moved onto the circle (along
 * the line from its centre: by at most `toleranceIn`) and the edge gets the bulge of the shorter arc
 * between them, so it lies on the circle exactly. Ends farther off than the tolerance give an error that
 * says how far off they are. Ends on opposite sides of the circle get the half circle turning from +x
 * towards +y (bulge 1); negate it for the other half. Returns a new geometry; the input is untouched.
 */
export function fitEdgeToCircle(geometry: StraightGeometry, edgeIndex: number, circle: Circle, options: FitEdgeOptions = {}): FitEdgeResult {
  const toleranceIn = options.toleranceIn ?? SEAM_REACH_TOLERANCE_IN;
  const n = geometry.vertices.length;
  if (!Number.isInteger(edgeIndex) || edgeIndex < 0 || edgeIndex >= n) {
    return { ok: false, offByIn: 0, message: `there is no edge ${edgeIndex}: the outline has edges 0 to ${n - 1}` };
  }
  if (!(circle.radiusIn > 0) || !Number.isFinite(circle.radiusIn)) {
    return { ok: false, offByIn: 0, message: `a circle needs a positive radius, got ${circle.radiusIn}` };
  }
  const j = (edgeIndex + 1) % n;
  const a = geometry.vertices[edgeIndex];
  const b = geometry.vertices[j];
  const offA = distanceToCircle(a, circle);
  const offB = distanceToCircle(b, circle);
  const offByIn = Math.max(offA, offB);
  const where = `the circle of radius ${round(circle.radiusIn)} in. about ${formatPoint(circle.centre)}`;
  if (offByIn > toleranceIn) {
    const [p, off] = offA >= offB ? [a, offA] : [b, offB];
    return { ok: false, offByIn, message: `edge ${edgeIndex} does not end on ${where}: its end ${formatPoint(p)} is ${round(off)} in. off (at most ${round(toleranceIn)} in. is allowed)` };
  }
  const angleA = Math.atan2(a.y - circle.centre.y, a.x - circle.centre.x);
  const angleB = Math.atan2(b.y - circle.centre.y, b.x - circle.centre.x);
  const onA = pointOnCircle(circle.centre, circle.radiusIn, angleA);
  const onB = pointOnCircle(circle.centre, circle.radiusIn, angleB);
  if (distance(onA, onB) <= toleranceIn) {
    return { ok: false, offByIn: 0, message: `edge ${edgeIndex} is too short to follow ${where}: its ends ${formatPoint(a)} and ${formatPoint(b)} meet on it` };
  }
  // The shorter way round, in (−π, π]: a curved edge is at most a half circle.
  let sweepRad = angleB - angleA;
  while (sweepRad <= -Math.PI) sweepRad += 2 * Math.PI;
  while (sweepRad > Math.PI) sweepRad -= 2 * Math.PI;
  const vertices = geometry.vertices.map((v, i) => (i === edgeIndex ? onA : i === j ? onB : { x: v.x, y: v.y }));
  const bulges = geometry.bulges && geometry.bulges.length === n ? geometry.bulges.slice() : new Array<number>(n).fill(0);
  bulges[edgeIndex] = Math.max(-1, Math.min(1, sweepRadToBulge(sweepRad)));
  return { ok: true, geometry: { kind: 'straight', vertices, bulges } };
}

function round(v: number): number {
  return Math.round(v * 1000) / 1000;
}
