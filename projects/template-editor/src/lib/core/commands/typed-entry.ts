import { sectionGeometrySchema, type PatternDocument, type Point, type SectionGeometry } from '@seamwright/piecing';
import type { SectionAnalysis } from '../analysis/section-analysis';
import { snapToEdges } from '../snapping/snapping';
import { followRingEdges } from './ring-edges';
import { SEAM_END_CATCH_IN } from './seam-commands';
import { addSeam, addSection, findSection } from './section-commands';

/*
 * Drawing without a pointer: a section from typed values, a seam from its two typed ends. They land
 * where the drawing tools put them: the same checks and the same commands (addSection, addSeam).
 */

/** What typed values make: the changed document and the new section's id, or the problem in words. */
export type TypedEntryResult = { ok: true; document: PatternDocument; sectionId: string } | { ok: false; message: string };

/**
 * Adds a section from typed values. The geometry must pass the document schema (the first issue is
 * reported as `path: message`). A straight outline follows the rings its corners sit on when
 * `followRings` is on, as the straight tool's does with Snap to points.
 */
export function addSectionByValues(document: PatternDocument, geometry: SectionGeometry, analysis: SectionAnalysis, followRings: boolean): TypedEntryResult {
  const parsed = sectionGeometrySchema.safeParse(geometry);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    return { ok: false, message: `${issue.path.join('.') || geometry.kind}: ${issue.message}` };
  }
  const g = parsed.data.kind === 'straight' && followRings ? followRingEdges(document, parsed.data) : parsed.data;
  try {
    analysis.patches({ id: 'check', label: 'check', geometry: g, seams: [], patches: [] });
  } catch (e) {
    return { ok: false, message: e instanceof Error ? e.message : 'these values make no section' };
  }
  return { ok: true, ...addSection(document, g, analysis) };
}

/**
 * Adds a seam from its two typed ends to a section. An end within 1/16 in. of a patch edge goes exactly
 * onto it (as a typed seam end does); a seam that splits no patch is refused, as the split tool refuses it.
 */
export function addSeamByValues(document: PatternDocument, sectionId: string, a: Point, b: Point, analysis: SectionAnalysis): TypedEntryResult {
  const s = findSection(document, sectionId);
  if (!s) return { ok: false, message: 'select a section first' };
  let rings: Point[][] = [];
  try {
    rings = analysis.patches(s).map((p) => p.polygon);
  } catch {
    rings = [];
  }
  const onEdge = (p: Point) => snapToEdges(p, rings, SEAM_END_CATCH_IN) ?? { x: p.x, y: p.y };
  const next = addSeam(document, sectionId, onEdge(a), onEdge(b), analysis);
  const after = findSection(next, sectionId);
  if (!after || analysis.patches(after).length <= rings.length) {
    return { ok: false, message: 'that seam splits no patch: start and end it on patch edges, right across the patch' };
  }
  return { ok: true, document: next, sectionId };
}
