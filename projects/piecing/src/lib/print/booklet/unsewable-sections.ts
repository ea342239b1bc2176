import type { PatternDocument } from '../../document/index';
import { checkSewability, type SewabilityVerdict } from '../../sewability/index';

/** A section whose patches cannot be sewn in their numbered order, and why. */
export interface UnsewableSection {
  sectionId: string;
  label: string;
  /** The sewability check's reason, naming the first patch that fails. */
  reason: string;
}

/**
 * The sections of a document that are not sewable as numbered (docs/design-notes.md#sewability): the
 * order checked is the patch numbers, 1, 2, 3 …, as the templates print them. `verdictOf` hands back a
 * verdict worked out already (the print set checks each section once).
 */
export function findUnsewableSections(
  document: Pick<PatternDocument, 'sections'>,
  verdictOf: (section: PatternDocument['sections'][number]) => SewabilityVerdict = (section) => checkSewability(section),
): UnsewableSection[] {
  const out: UnsewableSection[] = [];
  for (const section of document.sections) {
    const verdict = verdictOf(section);
    if (!verdict.sewable) {
      out.push({ sectionId: section.id, label: section.label, reason: verdict.failure?.message ?? 'its patches cannot be sewn in their numbered order' });
    }
  }
  return out;
}

/** One sentence per unsewable section: "Section B is not sewable as numbered: …". */
export function unsewableStatement(sections: readonly UnsewableSection[]): string {
  return sections.map((s) => `Section ${s.label} is not sewable as numbered: ${s.reason}.`).join(' ');
}

/**
 * Thrown by `renderPrintSet` when a section is not sewable as numbered and the caller did not ask to
 * print anyway (`printUnsewable`). Its message carries the reasons, ready for a person to read.
 */
export class UnsewablePatternError extends Error {
  override readonly name = 'UnsewablePatternError';

  constructor(readonly sections: readonly UnsewableSection[]) {
    super(
      `${unsewableStatement(sections)} Renumber or split ${sections.length === 1 ? 'the section' : 'these sections'} on the drafting board, ` +
        'or print anyway (the pages of such a section say it is not sewable as numbered).',
    );
  }
}
