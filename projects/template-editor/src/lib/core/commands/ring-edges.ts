import {
  circlesOfSections,
  edgesOnCircles,
  expandRingRepeat,
  fitEdgeToCircle,
  flattenSectionOutline,
  locatePoint,
  type PatternDocument,
  type StraightGeometry,
} from '@seamwright/piecing';

/**
 * A straight section drawn against a ring: every straight edge whose two ends lie on the circle of an
 * arc or wedge section (or of another section's curved edge) and whose chord cuts through that section
 * becomes an exact arc of the circle ({@link fitEdgeToCircle}), so the corner meets the ring without a
 * gap or an overlap. Edges that only touch the circle from outside, or already curve, stay as they are.
 * `sectionId` leaves the section itself out of the circles looked at.
 */
export function followRingEdges(document: PatternDocument, geometry: StraightGeometry, sectionId?: string): StraightGeometry {
  const others = { sections: document.sections.filter((s) => s.id !== sectionId) };
  const circles = circlesOfSections(others);
  if (circles.length === 0) return geometry;
  let g = geometry;
  for (const { edgeIndex, circle } of edgesOnCircles(g, circles)) {
    const a = g.vertices[edgeIndex];
    const b = g.vertices[(edgeIndex + 1) % g.vertices.length];
    const mid = { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 };
    const owner = others.sections.find((s) => s.id === circle.sectionId);
    const copy = owner ? expandRingRepeat(owner).find((c) => c.id === circle.instanceId) : undefined;
    if (!copy || locatePoint(mid, flattenSectionOutline(copy.geometry)) !== 'inside') continue;
    const fitted = fitEdgeToCircle(g, edgeIndex, circle);
    if (fitted.ok) g = fitted.geometry;
  }
  return g;
}
