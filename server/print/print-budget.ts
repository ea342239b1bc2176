/**
 * The size budget of a print set (docs/api.md, "Print sets"): a set whose foundation templates need
 * more than {@link MAX_PRINT_SHEETS} sheets is refused with 422 before anything renders.
 *
 * The estimate is the area bound M = ceil(total template area / printable area of a sheet): no
 * layout can use fewer sheets, so the refusal never turns away a set that would fit, and it costs only
 * the templates' outlines (a fraction of a second), not the packing (seconds for a hundred sections).
 * A set that passes on area but whose packed layout still comes to more sheets stops in its worker
 * once the layout is known, before its sheets are drawn, and ends "failed" with the reason.
 */
import { buildPrintTemplates, PAPER_SIZES, type PatternDocument, type PrintOptions } from '@seamwright/piecing';

/** Most template sheets one print set may have (a 200 in. block of a hundred sections takes about 200). */
export const MAX_PRINT_SHEETS = 500;

/**
 * The sheets a set's templates need at the least (the area bound M), without packing them; null when
 * the stored document cannot be read (a damaged row: its render then fails with the reason).
 */
export function estimateTemplateSheets(document: PatternDocument, options: PrintOptions): number | null {
  let templates;
  try {
    templates = buildPrintTemplates(document, options);
  } catch {
    return null;
  }
  const areaSqIn = templates.reduce((sum, t) => sum + t.areaSqIn * Math.max(0, t.copies), 0);
  // The printable area inside the margins, as the layout counts it (its lowerBoundSheets).
  const paper = PAPER_SIZES[options.paper];
  const printableSqIn = Math.max(1e-9, (paper.widthIn - 2 * options.marginIn) * (paper.heightIn - 2 * options.marginIn));
  return Math.max(0, Math.ceil(areaSqIn / printableSqIn - 1e-9));
}
