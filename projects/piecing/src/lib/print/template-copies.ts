import type { PatternDocument } from '../document/index';
import type { PatchDeriver } from '../geometry/index';
import { planCopies } from '../fabrication/index';
import type { PrintOptions } from './print-options';

/**
 * How many prints of each section's template the set holds, from the copies plan (docs/design-notes.md#copies):
 * on paper foundations one per use (templates needed), on freezer paper the printed copies; or one
 * each when the caller asks for single copies. Keyed by section id. `derive` gives a section's patches when
 * the caller has them already.
 */
export function planTemplateCopies(
  document: PatternDocument,
  options: Pick<PrintOptions, 'foundation' | 'copies'>,
  derive?: PatchDeriver,
): Map<string, number> {
  const plan = planCopies(document, document.pressingsPerTemplate, derive);
  return new Map(
    plan.sections.map((s) => [
      s.sectionId,
      options.copies === 'single' ? 1 : options.foundation === 'freezer-paper' ? s.printedCopies : s.templatesNeeded,
    ]),
  );
}
