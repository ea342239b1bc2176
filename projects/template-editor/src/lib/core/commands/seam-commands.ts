import type { PatternDocument, Point } from '@seamwright/piecing';
import type { SectionAnalysis } from '../analysis/section-analysis';
import { snapToEdges } from '../snapping/snapping';
import { syncAssignments } from './patch-assignments';
import { findSection, replaceSection } from './section-commands';

/** How near a typed seam end must be to a patch edge to be put exactly on it, in inches. */
export const SEAM_END_CATCH_IN = 1 / 16;

/**
 * Moves one end of a seam to a typed point. Within {@link SEAM_END_CATCH_IN} of an edge of the patches
 * the seam splits (the outline cut by the seams before it), the end goes exactly onto that edge, so
 * the seam reaches it; numbers, fabrics and strip sets follow the patches.
 */
export function setSeamEnd(
  document: PatternDocument,
  sectionId: string,
  seamId: string,
  end: 'a' | 'b',
  point: Point,
  analysis: SectionAnalysis,
): PatternDocument {
  const s = findSection(document, sectionId);
  const k = s ? s.seams.findIndex((m) => m.id === seamId) : -1;
  if (!s || k < 0) return document;
  let rings: Point[][] = [];
  try {
    rings = analysis.derive({ ...s, seams: s.seams.slice(0, k), patches: [] }).map((p) => p.polygon);
  } catch {
    rings = [];
  }
  const onEdge = snapToEdges(point, rings, SEAM_END_CATCH_IN);
  const at = onEdge ?? { x: point.x, y: point.y };
  const seams = s.seams.slice();
  seams[k] = { ...seams[k], [end]: at };
  const next = { ...s, seams };
  return replaceSection(document, sectionId, () => ({ ...next, patches: syncAssignments(analysis, s, next) }));
}
