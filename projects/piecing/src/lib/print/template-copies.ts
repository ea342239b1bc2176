import type { PatternDocument } from '../document/index';
import { planCopies } from '../fabrication/index';
import type { PrintOptions } from './print-options';

/**
 * How many prints of each section's template the set holds, from the copies plan (docs/design-notes.md#copies):
 * on paper foundations one per use (templates needed), on freezer paper the printed copies; or one
 * each when the caller asks for single copies. Keyed by section id.
 */
export function planTemplateCopies(
  document: PatternDocument,
  options: Pick<PrintOptions, 'foundation' | 'copies'>,
): Map<string, number> {
  const plan = planCopies(document);
  return new Map(
    plan.sections.map((s) => [
      s.sectionId,
      options.copies === 'single' ? 1 : options.foundation === 'freezer-paper' ? s.printedCopies : s.templatesNeeded,
    ]),
  );
}
