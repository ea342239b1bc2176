import { degToRad, distance, normaliseAngleDeg, pointOnCircle, radToDeg, type Point, type SectionGeometry } from '@seamwright/piecing';

/** What a handle changes: a straight vertex, or a parameter of an arc or wedge. */
export type HandleKind = 'vertex' | 'centre' | 'outer' | 'inner' | 'radius' | 'start' | 'end';

/** A draggable point on a selected section. */
export interface SectionHandle {
  kind: HandleKind;
  /** Vertex index for `vertex` handles, 0 otherwise. */
  index: number;
  point: Point;
}

/** Direction (degrees, document sense) from `centre` to `p`, in [0, 360). */
export function angleTo(centre: Point, p: Point): number {
  // Rounded to 1e-9° so a point placed at a snapped angle reads back as that angle, not 44.99999999999.
  return normaliseAngleDeg(Math.round(radToDeg(Math.atan2(p.y - centre.y, p.x - centre.x)) * 1e9) / 1e9);
}

/** The sweep (degrees) from `startDeg` round to the direction from `centre` to `p`, in (0, 360]. */
export function sweepTo(centre: Point, startDeg: number, p: Point): number {
  return normaliseAngleDeg(angleTo(centre, p) - startDeg) || 360;
}

/** The handles of a section geometry. */
export function sectionHandles(g: SectionGeometry): SectionHandle[] {
  switch (g.kind) {
    case 'straight':
      return g.vertices.map((point, index) => ({ kind: 'vertex', index, point }));
    case 'arc': {
      const mid = degToRad(g.startAngleDeg + g.sweepDeg / 2);
      return [
        { kind: 'centre', index: 0, point: g.centre },
        { kind: 'outer', index: 0, point: pointOnCircle(g.centre, g.outerRadiusIn, mid) },
        { kind: 'inner', index: 0, point: pointOnCircle(g.centre, g.innerRadiusIn, mid) },
        { kind: 'start', index: 0, point: pointOnCircle(g.centre, g.outerRadiusIn, degToRad(g.startAngleDeg)) },
        { kind: 'end', index: 0, point: pointOnCircle(g.centre, g.outerRadiusIn, degToRad(g.startAngleDeg + g.sweepDeg)) },
      ];
    }
    case 'wedge': {
      const mid = degToRad(g.startAngleDeg + g.sweepDeg / 2);
      return [
        { kind: 'centre', index: 0, point: g.centre },
        { kind: 'radius', index: 0, point: pointOnCircle(g.centre, g.radiusIn, mid) },
        { kind: 'start', index: 0, point: pointOnCircle(g.centre, g.radiusIn, degToRad(g.startAngleDeg)) },
        { kind: 'end', index: 0, point: pointOnCircle(g.centre, g.radiusIn, degToRad(g.startAngleDeg + g.sweepDeg)) },
      ];
    }
  }
}

const MIN_RADIUS_IN = 1 / 16;
const MIN_SWEEP_DEG = 1;

/** The geometry with one handle moved to `p` (radii and angles keep the schema's limits). */
export function moveHandle(g: SectionGeometry, handle: Pick<SectionHandle, 'kind' | 'index'>, p: Point): SectionGeometry {
  const pt = { x: p.x, y: p.y };
  if (g.kind === 'straight') {
    if (handle.kind !== 'vertex' || handle.index < 0 || handle.index >= g.vertices.length) return g;
    const vertices = g.vertices.slice();
    vertices[handle.index] = pt;
    return { ...g, vertices };
  }
  if (handle.kind === 'centre') return { ...g, centre: pt };
  const r = distance(g.centre, pt);
  const a = angleTo(g.centre, pt);
  if (handle.kind === 'start') {
    const end = g.startAngleDeg + g.sweepDeg;
    const sweep = normaliseAngleDeg(end - a) || 360;
    return { ...g, startAngleDeg: a, sweepDeg: Math.max(MIN_SWEEP_DEG, sweep) };
  }
  if (handle.kind === 'end') {
    return { ...g, sweepDeg: Math.max(MIN_SWEEP_DEG, sweepTo(g.centre, g.startAngleDeg, pt)) };
  }
  if (g.kind === 'wedge') return handle.kind === 'radius' ? { ...g, radiusIn: Math.max(MIN_RADIUS_IN, r) } : g;
  if (handle.kind === 'outer') return { ...g, outerRadiusIn: Math.max(g.innerRadiusIn + MIN_RADIUS_IN, r) };
  if (handle.kind === 'inner') return { ...g, innerRadiusIn: Math.min(g.outerRadiusIn - MIN_RADIUS_IN, Math.max(MIN_RADIUS_IN, r)) };
  return g;
}

/** The geometry moved by (dx, dy). */
export function translateGeometry(g: SectionGeometry, dx: number, dy: number): SectionGeometry {
  if (g.kind === 'straight') return { ...g, vertices: g.vertices.map((v) => ({ x: v.x + dx, y: v.y + dy })) };
  return { ...g, centre: { x: g.centre.x + dx, y: g.centre.y + dy } };
}
