import { cleanRing } from '../geometry/clean-ring';
import { bulgeOf, distanceToEdge, flattenStraightEdges, hasCurvedEdges, sectionEdges, straightSectionSignedArea, type SectionEdge } from '../geometry/curved-edge';
import { polygonArea } from '../geometry/polygon';
import { checkSelfCrossing, type SelfCrossing } from '../geometry/self-crossing';
import { distance, formatPoint } from '../geometry/vector';
import { GEOMETRY_EPSILON_IN, MIN_PATCH_AREA_SQ_IN } from '../tolerance';
// pattern-schema.ts imports this module too; MAX_SIZE_IN is read only inside functions, so the cycle is harmless.
import { MAX_SIZE_IN, type Point, type Section, type StraightGeometry } from './pattern-schema';

/**
 * Exact edge-pair comparisons the self-crossing checks of one document may make. Outlines need few (a
 * 2,000-edge circle none beyond its neighbours' boxes, a flattened curved outline a few thousand); a
 * star whose hundreds of long spikes share the middle needs hundreds of thousands. The budget keeps the
 * check of a whole document to tens of milliseconds (bench/save-validation.bench.ts).
 */
export const MAX_CROSSING_COMPARISONS = 200_000;

/** What is left of a document's {@link MAX_CROSSING_COMPARISONS}, shared by its sections' checks. */
export interface CrossingBudget {
  comparisonsLeft: number;
}

/** A geometry problem in a document: a path (as in zod issues) and a message. */
export interface GeometryIssue {
  path: Array<string | number>;
  message: string;
}

/**
 * Checks what the field-by-field schema cannot: that straight outlines have an area and do not cross or
 * touch themselves (the message gives the coordinates), that curved edges have two distinct ends and stay
 * within the size limit, and that seams have a length. Arc and wedge outlines are simple by construction
 * once their radii and sweep are valid.
 */
export function validateSectionGeometry(
  section: Pick<Section, 'geometry' | 'seams'>,
  sectionIndex: number,
  budget: CrossingBudget = { comparisonsLeft: MAX_CROSSING_COMPARISONS },
): GeometryIssue[] {
  const issues: GeometryIssue[] = [];
  const base: Array<string | number> = ['sections', sectionIndex];
  if (section.geometry.kind === 'straight' && section.geometry.bulges && hasCurvedEdges(section.geometry)) {
    issues.push(...validateCurvedOutline(section.geometry, [...base, 'geometry'], budget));
  } else if (section.geometry.kind === 'straight') {
    const ring = cleanRing(section.geometry.vertices);
    const path = [...base, 'geometry', 'vertices'];
    // Crossing first: a bow tie's two lobes cancel out and would look like "no area".
    const check = crossingWithin(ring, budget);
    const crossing = check === 'too-intricate' ? null : check;
    if (check === 'too-intricate') {
      issues.push({ path, message: TOO_INTRICATE });
    } else if (crossing) {
      const n = ring.length;
      const edge = (i: number) => `${formatPoint(ring[i])}–${formatPoint(ring[(i + 1) % n])}`;
      issues.push({
        path,
        message: `outline crosses itself at ${formatPoint(crossing.point)}: edge ${edge(crossing.edgeA)} meets edge ${edge(crossing.edgeB)}`,
      });
    } else if (ring.length < 3 || polygonArea(ring) < MIN_PATCH_AREA_SQ_IN) {
      issues.push({ path, message: 'outline has no area: its vertices lie on one line or repeat' });
    }
  }
  if (section.geometry.kind !== 'straight') {
    // A circle may sit anywhere, but no part of it may reach past the size limit.
    const g = section.geometry;
    const radiusIn = g.kind === 'arc' ? g.outerRadiusIn : g.radiusIn;
    const reach = Math.max(Math.abs(g.centre.x) + radiusIn, Math.abs(g.centre.y) + radiusIn);
    if (reach > MAX_SIZE_IN) {
      issues.push({
        path: [...base, 'geometry', g.kind === 'arc' ? 'outerRadiusIn' : 'radiusIn'],
        message: `a circle of radius ${radiusIn} in. about ${formatPoint(g.centre)} reaches ${Math.round(reach * 1000) / 1000} in. from the origin, beyond the ±${MAX_SIZE_IN} in. limit`,
      });
    }
  }
  (section.seams ?? []).forEach((seam, j) => {
    if (Math.hypot(seam.b.x - seam.a.x, seam.b.y - seam.a.y) <= GEOMETRY_EPSILON_IN) {
      issues.push({ path: [...base, 'seams', j], message: `seam "${seam.id}" has no length: both ends at ${formatPoint(seam.a)}` });
    }
  });
  return issues;
}

/**
 * A straight outline with curved edges: each curved edge joins two distinct points, no point of the
 * curves reaches past the size limit, and the outline (curves flattened) neither crosses itself nor
 * lacks area. A crossing is reported with its point and the document edges that meet there.
 */
function validateCurvedOutline(geometry: StraightGeometry, path: Array<string | number>, budget: CrossingBudget): GeometryIssue[] {
  // The edge objects (exact arcs) are made only for a message; the checks run on the vertices.
  const { vertices } = geometry;
  const n = vertices.length;
  const issues: GeometryIssue[] = [];
  for (let i = 0; i < n; i++) {
    if (bulgeOf(geometry, i) !== 0 && !(distance(vertices[i], vertices[(i + 1) % n]) > GEOMETRY_EPSILON_IN)) {
      issues.push({ path: [...path, 'bulges', i], message: `edge ${i} has no length (both ends at ${formatPoint(vertices[i])}), so it cannot curve` });
    }
  }
  if (issues.length > 0) return issues;
  const points = flattenStraightEdges(geometry);
  const far = points.find((p) => Math.abs(p.x) > MAX_SIZE_IN || Math.abs(p.y) > MAX_SIZE_IN);
  if (far) {
    const edge = nearestEdge(sectionEdges(geometry), far);
    return [{ path: [...path, 'bulges', edge.index], message: `${describeEdge(edge)} reaches ${formatPoint(far)}, beyond the ±${MAX_SIZE_IN} in. limit` }];
  }
  const ring = cleanRing(points);
  const check = crossingWithin(ring, budget);
  if (check === 'too-intricate') return [{ path: [...path, 'vertices'], message: TOO_INTRICATE }];
  const crossing = check;
  if (crossing) {
    const edges = sectionEdges(geometry);
    const m = ring.length;
    const chordMid = (i: number) => ({ x: (ring[i].x + ring[(i + 1) % m].x) / 2, y: (ring[i].y + ring[(i + 1) % m].y) / 2 });
    const a = nearestEdge(edges, chordMid(crossing.edgeA));
    const b = nearestEdge(edges, chordMid(crossing.edgeB));
    const meets = a.index === b.index ? 'meets itself' : `meets ${describeEdge(b)}`;
    return [{ path: [...path, 'vertices'], message: `outline crosses itself at ${formatPoint(crossing.point)}: ${describeEdge(a)} ${meets}` }];
  }
  if (ring.length < 3 || Math.abs(straightSectionSignedArea(geometry)) < MIN_PATCH_AREA_SQ_IN || polygonArea(ring) < MIN_PATCH_AREA_SQ_IN) {
    return [{ path: [...path, 'vertices'], message: 'outline has no area: its vertices and curves enclose nothing' }];
  }
  return [];
}

const TOO_INTRICATE =
  'outline is too intricate to check for crossings (many long edges share one region, like a star of hundreds of spikes): simplify it or split it into sections';

/** The ring's first self-crossing, spending the document's comparison budget; 'too-intricate' when it runs out. */
function crossingWithin(ring: Point[], budget: CrossingBudget): SelfCrossing | null | 'too-intricate' {
  if (ring.length < 4) return null;
  const check = checkSelfCrossing(ring, { maxComparisons: budget.comparisonsLeft });
  budget.comparisonsLeft -= check.comparisons;
  return check.complete ? check.crossing : 'too-intricate';
}

function nearestEdge(edges: readonly SectionEdge[], p: { x: number; y: number }): SectionEdge {
  let best = edges[0];
  let bestDistance = Infinity;
  for (const edge of edges) {
    const d = distanceToEdge(p, edge);
    if (d < bestDistance) {
      best = edge;
      bestDistance = d;
    }
  }
  return best;
}

function describeEdge(edge: SectionEdge): string {
  return `${edge.arc ? 'curved ' : ''}edge ${edge.index} ${formatPoint(edge.from)}–${formatPoint(edge.to)}`;
}

/** {@link validateSectionGeometry} for every section of a document. */
export function validatePatternGeometry(doc: { sections: ReadonlyArray<Pick<Section, 'geometry' | 'seams'>> }): GeometryIssue[] {
  const budget: CrossingBudget = { comparisonsLeft: MAX_CROSSING_COMPARISONS };
  return doc.sections.flatMap((s, i) => validateSectionGeometry(s, i, budget));
}
