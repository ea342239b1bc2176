import { cleanRing } from '../geometry/clean-ring';
import { polygonArea } from '../geometry/polygon';
import { findSelfCrossing } from '../geometry/self-crossing';
import { formatPoint } from '../geometry/vector';
import { GEOMETRY_EPSILON_IN, MIN_PATCH_AREA_SQ_IN } from '../tolerance';
// pattern-schema.ts imports this module too; MAX_SIZE_IN is read only inside functions, so the cycle is harmless.
import { MAX_SIZE_IN, type Section } from './pattern-schema';

/** A geometry problem in a document: a path (as in zod issues) and a message. */
export interface GeometryIssue {
  path: Array<string | number>;
  message: string;
}

/**
 * Checks what the field-by-field schema cannot: that straight outlines have an area and do not cross or
 * touch themselves (the message gives the coordinates), and that seams have a length. Arc and wedge
 * outlines are simple by construction once their radii and sweep are valid.
 */
export function validateSectionGeometry(section: Pick<Section, 'geometry' | 'seams'>, sectionIndex: number): GeometryIssue[] {
  const issues: GeometryIssue[] = [];
  const base: Array<string | number> = ['sections', sectionIndex];
  if (section.geometry.kind === 'straight') {
    const ring = cleanRing(section.geometry.vertices);
    const path = [...base, 'geometry', 'vertices'];
    // Crossing first: a bow tie's two lobes cancel out and would look like "no area".
    const crossing = ring.length >= 4 ? findSelfCrossing(ring) : null;
    if (crossing) {
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

/** {@link validateSectionGeometry} for every section of a document. */
export function validatePatternGeometry(doc: { sections: ReadonlyArray<Pick<Section, 'geometry' | 'seams'>> }): GeometryIssue[] {
  return doc.sections.flatMap((s, i) => validateSectionGeometry(s, i));
}
