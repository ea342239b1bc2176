import type { PatternDocument } from '../document/index';
import type { PrintOptions } from './print-options';

/**
 * How many prints of each section's template the set holds (design.md §5.6): every use of a template
 * is a ring-repeat copy in every block; on paper foundations each use needs a print, a freezer-paper
 * template is reused for `pressingsPerTemplate` pressings. Keyed by section id.
 */
export function planTemplateCopies(
  document: PatternDocument,
  options: Pick<PrintOptions, 'foundation' | 'copies'>,
): Map<string, number> {
  const out = new Map<string, number>();
  for (const section of document.sections) {
    const uses = (section.ringRepeat?.count ?? 1) * document.blockCount;
    const prints =
      options.copies === 'single' ? 1
      : options.foundation === 'freezer-paper' ? Math.ceil(uses / document.pressingsPerTemplate)
      : uses;
    out.set(section.id, prints);
  }
  return out;
}
