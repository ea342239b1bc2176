import type { PatternDocument, Seam, SeamPress } from '@seamwright/piecing';
import { findSection, replaceSection } from './section-commands';

/** The pressing a seam has when the designer sets none (usual practice on a foundation; docs/design-notes.md). */
export const DEFAULT_SEAM_PRESSING: SeamPress = 'added';

/** The pressing of a seam as the quilter is told it: the designer's choice, else toward the patch just added. */
export function seamPressingOf(seam: Pick<Seam, 'press'>): SeamPress {
  return seam.press ?? DEFAULT_SEAM_PRESSING;
}

/**
 * Sets how one patch seam is pressed. The default (toward the patch just added) is stored as no value,
 * so a document only says what the designer changed; a section or seam that is not there, or a pressing
 * the seam already has, leaves the document as it is.
 */
export function setSeamPressing(document: PatternDocument, sectionId: string, seamId: string, press: SeamPress): PatternDocument {
  const s = findSection(document, sectionId);
  const k = s ? s.seams.findIndex((m) => m.id === seamId) : -1;
  if (!s || k < 0 || !['added', 'previous', 'open'].includes(press)) return document;
  if (seamPressingOf(s.seams[k]) === press) return document;
  const { press: _old, ...rest } = s.seams[k];
  const seams = s.seams.slice();
  seams[k] = press === DEFAULT_SEAM_PRESSING ? rest : { ...rest, press };
  return replaceSection(document, sectionId, (section) => ({ ...section, seams }));
}
