import type { PatternDocument } from '../../document/pattern-schema';

/** How many copies of one section's template the pattern needs. */
export interface SectionCopies {
  sectionId: string;
  label: string;
  /** Copies of the section in one block: its ring-repeat count, or 1. */
  perBlock: number;
  /** Times the section is sewn in the whole pattern: perBlock × block count. Paper foundations are torn
   * away after sewing, so this is also the number of paper copies to print. */
  templatesNeeded: number;
  /** Freezer-paper copies to print: ceil(templatesNeeded / pressings a template survives). */
  printedCopies: number;
}

/** Copies for the whole pattern, section by section, with totals. */
export interface CopyPlan {
  pressingsPerTemplate: number;
  blockCount: number;
  sections: SectionCopies[];
  totalTemplatesNeeded: number;
  totalPrintedCopies: number;
}

/**
 * How many of each template the pattern needs (docs/design-notes.md#copies): templates needed = ring repeats × blocks
 * per section; printed freezer-paper copies = ceil(uses / pressings per template), since one freezer-paper
 * template is pressed on, sewn and peeled off again until it stops sticking. `pressingsPerTemplate`
 * overrides the document's setting.
 */
export function planCopies(
  document: Pick<PatternDocument, 'sections' | 'blockCount' | 'pressingsPerTemplate'>,
  pressingsPerTemplate = document.pressingsPerTemplate,
): CopyPlan {
  if (!Number.isInteger(pressingsPerTemplate) || pressingsPerTemplate < 1) {
    throw new RangeError(`pressings per template must be a whole number, 1 or more, got ${pressingsPerTemplate}`);
  }
  const sections = document.sections.map((s) => {
    const perBlock = s.ringRepeat?.count ?? 1;
    const templatesNeeded = perBlock * document.blockCount;
    return { sectionId: s.id, label: s.label, perBlock, templatesNeeded, printedCopies: Math.ceil(templatesNeeded / pressingsPerTemplate) };
  });
  return {
    pressingsPerTemplate,
    blockCount: document.blockCount,
    sections,
    totalTemplatesNeeded: sections.reduce((n, s) => n + s.templatesNeeded, 0),
    totalPrintedCopies: sections.reduce((n, s) => n + s.printedCopies, 0),
  };
}
