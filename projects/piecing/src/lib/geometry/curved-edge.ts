import type { Point, StraightGeometry } from '../document/pattern-schema';
import { CHORD_TOLERANCE_IN, GEOMETRY_EPSILON_IN } from '../tolerance';
import { flattenArc } from './arc';
import { distance, distanceToSegment } from './vector';

/**
 * The exact circular arc of a curved edge: from `startRad` about `centre` through `sweepRad` (document
 * angles, +x towards +y; a negative sweep turns the other way). It starts at the edge's first vertex
 * and ends at the next.
 */
export interface EdgeArc {
  centre: Point;
  radiusIn: number;
  startRad: number;
  sweepRad: number;
}

/** One edge of a straight section: from `from` to `to`, straight (bulge 0) or a circular arc. */
export interface SectionEdge {
  /** Edge index i: from vertex i to vertex i + 1 (the last edge back to vertex 0). */
  index: number;
  from: Point;
  to: Point;
  bulge: number;
  /** The exact arc of a curved edge; absent for a straight one. */
  arc?: EdgeArc;
}

/** Sweep of an edge with this bulge: θ = 4·atan(b), radians, signed as the bulge. */
export function bulgeToSweepRad(bulge: number): number {
  return 4 * Math.atan(bulge);
}

/** Bulge of an edge turning through `sweepRad` about its centre: b = tan(θ/4). */
export function sweepRadToBulge(sweepRad: number): number {
  return Math.tan(sweepRad / 4);
}

/**
 * The exact arc of the edge from `from` to `to` with bulge `bulge` (see the pattern schema: b = tan(θ/4),
 * positive turning from +x towards +y), or null for a straight edge (bulge 0) or an edge with no length.
 *
 * With chord c and n the unit normal (d_y, −d_x)/c of the chord direction d, the arc's middle lies at
 * M + n·(c/2)·b (M the chord's midpoint: the sagitta is c·|b|/2), its radius is c(1 + b²)/(4|b|) and its
 * centre M + n·c(b² − 1)/(4b).
 */
export function edgeArc(from: Point, to: Point, bulge: number): EdgeArc | null {
  const c = distance(from, to);
  if (bulge === 0 || !(c > GEOMETRY_EPSILON_IN)) return null;
  const nx = (to.y - from.y) / c;
  const ny = -(to.x - from.x) / c;
  const k = (c * (bulge * bulge - 1)) / (4 * bulge);
  const centre = { x: (from.x + to.x) / 2 + nx * k, y: (from.y + to.y) / 2 + ny * k };
  return {
    centre,
    radiusIn: (c * (1 + bulge * bulge)) / (4 * Math.abs(bulge)),
    startRad: Math.atan2(from.y - centre.y, from.x - centre.x),
    sweepRad: bulgeToSweepRad(bulge),
  };
}

/** The edges of a straight section, in order, with the exact arcs of curved ones. */
export function sectionEdges(geometry: Pick<StraightGeometry, 'vertices' | 'bulges'>): SectionEdge[] {
  const { vertices } = geometry;
  const n = vertices.length;
  return vertices.map((from, index) => {
    const to = vertices[(index + 1) % n];
    const bulge = bulgeOf(geometry, index);
    const arc = edgeArc(from, to, bulge);
    return arc ? { index, from, to, bulge, arc } : { index, from, to, bulge };
  });
}

/** The bulge of edge `index` (0 when the geometry has no bulges or they do not match the vertices). */
export function bulgeOf(geometry: Pick<StraightGeometry, 'vertices' | 'bulges'>, index: number): number {
  const { bulges, vertices } = geometry;
  if (!bulges || bulges.length !== vertices.length) return 0;
  return bulges[index] ?? 0;
}

/** Whether any edge of the straight geometry is curved. */
export function hasCurvedEdges(geometry: Pick<StraightGeometry, 'vertices' | 'bulges'>): boolean {
  return geometry.vertices.some((_, i) => bulgeOf(geometry, i) !== 0);
}

/**
 * The outline of a straight section as points (not cleaned, not rewound): each vertex, followed by the
 * points of its outgoing edge's arc when that edge is curved, flattened to chords within `toleranceIn`
 * like arc sections. Points on curves lie on the exact arcs.
 */
export function flattenStraightEdges(geometry: Pick<StraightGeometry, 'vertices' | 'bulges'>, toleranceIn = CHORD_TOLERANCE_IN): Point[] {
  // One pass over the vertices, with no edge objects: a save checks outlines of thousands of edges.
  const { vertices } = geometry;
  const n = vertices.length;
  const out: Point[] = [];
  for (let index = 0; index < n; index++) {
    const from = vertices[index];
    out.push({ x: from.x, y: from.y });
    const bulge = bulgeOf(geometry, index);
    if (bulge === 0) continue;
    const to = vertices[(index + 1) % n];
    const c = distance(from, to);
    if (!(c > GEOMETRY_EPSILON_IN)) continue;
    // A curve whose sagitta (c·|b|/2, see edgeArc) is clearly within the tolerance is one chord: no
    // points between (arcSegmentCount gives 1). Near the bound, flattenArc decides.
    if ((c * Math.abs(bulge)) / 2 < toleranceIn * 0.999) continue;
    const arc = edgeArc(from, to, bulge)!;
    const points = flattenArc(arc.centre, arc.radiusIn, arc.startRad, arc.sweepRad, toleranceIn);
    // The first and last points are the edge's vertices, kept exact from the document.
    for (let k = 1; k < points.length - 1; k++) out.push(points[k]);
  }
  return out;
}

/**
 * Signed area between a curved edge and its chord, in square inches: the circular segment r²(θ − sin θ)/2
 * (standard mensuration), with the sign of θ. Added to the shoelace area of the vertices (signed the
 * same way: positive when the outline turns from +x towards +y) it gives the exact signed area.
 */
export function circularSegmentSignedArea(arc: Pick<EdgeArc, 'radiusIn' | 'sweepRad'>): number {
  const t = arc.sweepRad;
  // θ − sin θ loses its digits for tiny θ: use the series θ³/6 − θ⁵/120 + θ⁷/5040 there.
  const t3 = t * t * t;
  const lens = Math.abs(t) < 1e-3 ? t3 / 6 - (t3 * t * t) / 120 + (t3 * t3 * t) / 5040 : t - Math.sin(t);
  return (arc.radiusIn * arc.radiusIn * lens) / 2;
}

/**
 * Exact signed area of a straight section with curved edges, in square inches: the shoelace area of its
 * vertices plus, for each curved edge, its circular segment. Positive when the vertices turn from +x
 * towards +y (clockwise on screen).
 */
export function straightSectionSignedArea(geometry: Pick<StraightGeometry, 'vertices' | 'bulges'>): number {
  const { vertices } = geometry;
  const n = vertices.length;
  let twice = 0;
  let segments = 0;
  for (let index = 0; index < n; index++) {
    const from = vertices[index];
    const to = vertices[(index + 1) % n];
    twice += from.x * to.y - to.x * from.y;
    const bulge = bulgeOf(geometry, index);
    if (bulge === 0) continue;
    const c = distance(from, to);
    // The arc's radius and sweep as edgeArc gives them, without its centre and start angle.
    if (c > GEOMETRY_EPSILON_IN) segments += circularSegmentSignedArea({ radiusIn: (c * (1 + bulge * bulge)) / (4 * Math.abs(bulge)), sweepRad: bulgeToSweepRad(bulge) });
  }
  return twice / 2 + segments;
}

/** Whether the angle `angleRad` lies on the arc (between its start and end, the way it turns). */
export function arcContainsAngle(arc: Pick<EdgeArc, 'startRad' | 'sweepRad'>, angleRad: number): boolean {
  const turn = 2 * Math.PI;
  let rel = (angleRad - arc.startRad) * Math.sign(arc.sweepRad);
  rel = ((rel % turn) + turn) % turn;
  return rel <= Math.abs(arc.sweepRad) + 1e-12;
}

/** Distance from `p` to an edge (its exact arc when curved), in inches. */
export function distanceToEdge(p: Point, edge: SectionEdge): number {
  if (!edge.arc) return distanceToSegment(p, edge.from, edge.to);
  const { centre, radiusIn } = edge.arc;
  const angle = Math.atan2(p.y - centre.y, p.x - centre.x);
  if (arcContainsAngle(edge.arc, angle)) return Math.abs(distance(p, centre) - radiusIn);
  return Math.min(distance(p, edge.from), distance(p, edge.to));
}
