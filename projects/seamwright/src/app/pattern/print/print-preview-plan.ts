import {
  buildPrintTemplates, layoutTemplates, printOptionsSchema,
  type PatternDocument, type PrintLayout, type PrintOptionsInput, type PrintTemplate,
} from '@seamwright/piecing';

/**
 * What the print page asks the planner for. Plain data only: it crosses to the Web Worker by
 * structured clone (no Maps, no class instances, no functions).
 */
export interface PreviewRequest {
  /** Increases with every request; an answer whose id is not the latest one asked for is stale. */
  id: number;
  document: PatternDocument;
  options: PrintOptionsInput;
  /** Pressings per freezer-paper template, as typed on the form (may differ from the document's). */
  pressingsPerTemplate: number;
  /** How many sheets the preview draws: only their templates' lines travel back. */
  sheetsShown: number;
}

/** The lines of one template the sheet preview draws. */
export type PreviewTemplate = Pick<PrintTemplate, 'id' | 'sewingLine' | 'cuttingLine' | 'seams'>;

/** The planner's answer: the layout and the templates of the sheets shown, or why it failed. */
export type PreviewResult =
  | { id: number; layout: PrintLayout; templates: PreviewTemplate[] }
  | { id: number; error: string };

/**
 * Plans the print layout for the preview: the same templates and packing as the print set
 * (`buildPrintTemplates` then `layoutTemplates`, as `planPrintLayout` does), each template built once.
 * Runs in the print-preview Web Worker, and on the page only where workers are unavailable.
 */
export function planPreview(request: PreviewRequest): PreviewResult {
  try {
    const document = { ...request.document, pressingsPerTemplate: request.pressingsPerTemplate };
    const options = printOptionsSchema.parse(request.options);
    const templates = buildPrintTemplates(document, options);
    const layout = layoutTemplates(templates, options);
    const shown = new Set(layout.sheets.slice(0, request.sheetsShown).flatMap((s) => s.placements.map((p) => p.templateId)));
    return {
      id: request.id,
      layout,
      templates: templates
        .filter((t) => shown.has(t.id))
        .map((t) => ({ id: t.id, sewingLine: t.sewingLine, cuttingLine: t.cuttingLine, seams: t.seams })),
    };
  } catch (err) {
    return { id: request.id, error: err instanceof Error ? err.message : String(err) };
  }
}
