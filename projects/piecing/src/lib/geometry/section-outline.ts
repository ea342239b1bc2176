import type { ArcGeometry, Point, SectionGeometry, WedgeGeometry } from '../document/pattern-schema';
import { CHORD_TOLERANCE_IN } from '../tolerance';
import { flattenArc } from './arc';
import { cleanRing } from './clean-ring';
import { flattenStraightEdges, straightSectionSignedArea } from './curved-edge';
import { withPositiveWinding } from './polygon';
import { degToRad } from './vector';

/** A flattened outline as an outer ring with holes (only a full 360° arc section has one). */
export interface SectionRings {
  outer: Point[];
  holes: Point[][];
}

/** Whether the sweep is a full turn. */
export function isFullTurn(sweepDeg: number): boolean {
  return sweepDeg >= 360 - 1e-9;
}

/**
 * The section outline as one closed ring of points (the closing point is not repeated), with arcs
 * flattened to chords within `toleranceIn`. Vertices of flattened arcs lie on the exact arcs.
 *
 * Every outline comes back with positive signed area ({@link signedArea}: turning from +x towards +y,
 * clockwise on screen), whatever the winding of the document's vertices.
 *
 * - straight: the document vertices, curved edges flattened like arcs (their points on the exact arcs),
 *   then cleaned (duplicates and collinear points dropped);
 * - arc: the outer arc from the start angle through the sweep, then the inner arc back;
 * - wedge: the centre, then the arc from the start angle through the sweep.
 *
 * Full turns: a 360° wedge is the circle alone (no centre point, since a disc has no corner there). A 360°
 * arc section (an annulus) is one "keyhole" ring: the outer circle from the start angle all the way round,
 * then straight in to the inner circle and round it the other way, so the two circles are joined by a
 * zero-width slit along the start angle. Its area and containment are right; where a tool needs a ring
 * with a hole instead, use {@link flattenSectionRings}.
 */
export function flattenSectionOutline(geometry: SectionGeometry, toleranceIn = CHORD_TOLERANCE_IN): Point[] {
  switch (geometry.kind) {
    case 'straight':
      return withPositiveWinding(cleanRing(geometry.bulges ? flattenStraightEdges(geometry, toleranceIn) : geometry.vertices));
    case 'arc':
      return flattenArcOutline(geometry, toleranceIn);
    case 'wedge':
      return flattenWedgeOutline(geometry, toleranceIn);
  }
}

/**
 * The section outline as an outer ring and holes. Only a 360° arc section has a hole (its inner circle,
 * wound the other way); every other section is its {@link flattenSectionOutline} ring with no holes.
 */
export function flattenSectionRings(geometry: SectionGeometry, toleranceIn = CHORD_TOLERANCE_IN): SectionRings {
  if (geometry.kind === 'arc' && isFullTurn(geometry.sweepDeg)) {
    const start = degToRad(geometry.startAngleDeg);
    const outer = flattenArc(geometry.centre, geometry.outerRadiusIn, start, 2 * Math.PI, toleranceIn).slice(0, -1);
    const inner = flattenArc(geometry.centre, geometry.innerRadiusIn, start, -2 * Math.PI, toleranceIn).slice(0, -1);
    return { outer, holes: [inner] };
  }
  return { outer: flattenSectionOutline(geometry, toleranceIn), holes: [] };
}

function flattenArcOutline(g: ArcGeometry, toleranceIn: number): Point[] {
  const start = degToRad(g.startAngleDeg);
  const sweep = degToRad(Math.min(360, g.sweepDeg));
  const outer = flattenArc(g.centre, g.outerRadiusIn, start, sweep, toleranceIn);
  const inner = flattenArc(g.centre, g.innerRadiusIn, start + sweep, -sweep, toleranceIn);
  // For a full turn both end points of each circle are kept: they are the two sides of the slit.
  return [...outer, ...inner];
}

function flattenWedgeOutline(g: WedgeGeometry, toleranceIn: number): Point[] {
  const start = degToRad(g.startAngleDeg);
  if (isFullTurn(g.sweepDeg)) return flattenArc(g.centre, g.radiusIn, start, 2 * Math.PI, toleranceIn).slice(0, -1);
  const arc = flattenArc(g.centre, g.radiusIn, start, degToRad(g.sweepDeg), toleranceIn);
  return [{ x: g.centre.x, y: g.centre.y }, ...arc];
}

/**
 * Exact area of the section, in square inches: the polygon area for straight sections, plus or minus the
 * circular segment r²(θ − sin θ)/2 of each curved edge (plus where it bulges out, minus where it bulges
 * in), θ(R² − r²)/2 for arc sections and θr²/2 for wedges (θ in radians).
 */
export function exactSectionArea(geometry: SectionGeometry): number {
  switch (geometry.kind) {
    case 'straight':
      // Duplicate and collinear vertices add nothing to the shoelace sum, so the raw vertices serve.
      return Math.abs(straightSectionSignedArea(geometry));
    case 'arc':
      return (degToRad(geometry.sweepDeg) * (geometry.outerRadiusIn ** 2 - geometry.innerRadiusIn ** 2)) / 2;
    case 'wedge':
      return (degToRad(geometry.sweepDeg) * geometry.radiusIn ** 2) / 2;
  }
}
