import type { jsPDF } from 'jspdf';
import type { PatternDocument } from '../document/index';
import { drawAppendix } from './draw-appendix';
import { drawCover } from './draw-cover';
import { drawSheetFrame, drawTileMap, tileMapWidth } from './draw-sheet-frame';
import { drawPlacement } from './draw-template';
import { canonicalJson, pdfDateUtc, stableHash128 } from './deterministic-ids';
import type { PlannedSheet, PrintLayout } from './layout-types';
import { POINTS_PER_INCH, type SheetOrientation } from './paper';
import { embedFonts, PdfPen } from './pdf-pen';
import { layoutTemplates } from './plan-print-layout';
import { buildPrintTemplates } from './print-templates';
import { printOptionsSchema, type PrintFonts, type PrintOptions, type PrintOptionsInput } from './print-options';
import { sheetFrame, type SheetFrame } from './sheet-frame';
import type { PrintTemplate } from './template-model';

/** Options of {@link renderPrintSet}: the JSON print options plus the font bytes to embed. */
export type RenderPrintSetOptions = PrintOptionsInput & { fonts: PrintFonts };

/** A rendered print set. */
export interface PrintSetResult {
  pdf: Uint8Array;
  /** Pages in the PDF: cover, template sheets, cutting list and cautions. */
  sheetCount: number;
  /** N: sheets carrying templates. */
  templateSheetCount: number;
  /** M = ceil(total template area / printable area). */
  lowerBoundSheets: number;
  layout: PrintLayout;
}

/** Called after each step: `done` of `total` steps (one per template sheet, plus cover and appendix). */
export type PrintProgress = (done: number, total: number) => void;

/**
 * Plans the sheets of a print set without writing a PDF (for the app's sheet preview): the same
 * plan {@link renderPrintSet} follows. Pure.
 */
export function planPrintLayout(document: PatternDocument, options: PrintOptionsInput = {}): PrintLayout {
  const opts = printOptionsSchema.parse(options);
  return layoutTemplates(buildPrintTemplates(document, opts), opts);
}

/**
 * Renders the print set of a document: cover, template sheets at true scale (tiled, packed,
 * mirrored unless asked otherwise), then the cutting list, fabric key, strip-set diagrams and
 * cautions. Every sheet carries the test squares. Same document + same options → same bytes.
 * Runs in Node and in the browser; yields to the event loop between sheets.
 */
export async function renderPrintSet(
  document: PatternDocument,
  options: RenderPrintSetOptions,
  onProgress?: PrintProgress,
): Promise<PrintSetResult> {
  const { fonts, ...json } = options;
  const opts = printOptionsSchema.parse(json);
  const templates = buildPrintTemplates(document, opts);
  const layout = layoutTemplates(templates, opts);
  const byId = new Map(templates.map((t) => [t.id, t]));
  const total = layout.sheets.length + 2;
  let done = 0;
  const step = async () => {
    done++;
    onProgress?.(done, total);
    await new Promise<void>((resolve) => setTimeout(resolve, 0));
  };

  // jsPDF is loaded only when a PDF is written, so pages that import the library for geometry or
  // layout (the board, the cutting list, the sheet preview) do not carry it.
  const { jsPDF: JsPdf } = await import('jspdf');
  const coverFrame = sheetFrame(opts.paper, 'portrait', opts.marginIn);
  const doc = new JsPdf({
    unit: 'pt',
    format: [coverFrame.widthIn * POINTS_PER_INCH, coverFrame.heightIn * POINTS_PER_INCH],
    orientation: 'portrait',
    floatPrecision: 3,
    putOnlyUsedFonts: true,
    compress: true,
  });
  doc.setFileId(stableHash128(canonicalJson({ document, options: opts })));
  doc.setCreationDate(pdfDateUtc(opts.createdAt));
  doc.setProperties({ title: `${document.title} — print set`, subject: 'Foundation-paper-piecing templates', creator: 'Seamwright' });
  embedFonts(doc, fonts);
  const pen = new PdfPen(doc);

  const frames: SheetFrame[] = [coverFrame];
  const headings: Array<{ subtitle: string; sheet?: PlannedSheet }> = [];
  headings.push({ subtitle: 'Print set — read this sheet first' });

  for (const sheet of layout.sheets) {
    addSheet(doc, sheet.frame);
    frames.push(sheet.frame);
    for (const placement of sheet.placements) drawPlacement(pen, placement, byId.get(placement.templateId)!);
    headings.push({ subtitle: `Templates — sections ${sheet.sectionLabels.join(', ')}`, sheet });
    await step();
  }

  const appendixStart = doc.getNumberOfPages() + 1;
  drawAppendix(pen, document, opts, () => {
    const frame = sheetFrame(opts.paper, 'portrait', opts.marginIn);
    addSheet(doc, frame);
    frames.push(frame);
    return frame;
  });
  for (let p = appendixStart; p <= doc.getNumberOfPages(); p++) headings.push({ subtitle: 'Cutting list, fabric key, strip sets and cautions' });

  const pageCount = doc.getNumberOfPages();
  doc.setPage(1);
  drawCover(pen, coverFrame, document, opts, layout, pageCount);
  for (let p = 1; p <= pageCount; p++) {
    doc.setPage(p);
    const frame = frames[p - 1];
    drawSheetFrame(pen, frame, {
      title: document.title,
      pageNumber: p,
      pageCount,
      subtitle: headings[p - 1].subtitle,
      note: headings[p - 1].sheet ? mirrorNote(opts) : undefined,
    });
    const sheet = headings[p - 1].sheet;
    if (sheet) drawTileMaps(pen, frame, sheet, byId);
  }
  await step();

  const pdf = new Uint8Array(doc.output('arraybuffer'));
  return {
    pdf,
    sheetCount: pageCount,
    templateSheetCount: layout.templateSheetCount,
    lowerBoundSheets: layout.lowerBoundSheets,
    layout,
  };
}

function addSheet(doc: jsPDF, frame: SheetFrame): void {
  const orientation: SheetOrientation = frame.orientation;
  doc.addPage([frame.widthIn * POINTS_PER_INCH, frame.heightIn * POINTS_PER_INCH], orientation);
}

function mirrorNote(opts: PrintOptions): string {
  return opts.mirrored ? 'Mirror image (printed side = back of block)' : 'As seen from the front (not mirrored)';
}

/** Tile maps of the first tiles on a sheet, in the header between the title and the sheet number. */
function drawTileMaps(pen: PdfPen, frame: SheetFrame, sheet: PlannedSheet, byId: Map<string, PrintTemplate>): void {
  const firsts = sheet.placements.filter((p) => p.tile?.first);
  if (firsts.length === 0) return;
  const height = frame.header.height - 0.06;
  // Right of the maps: "Sheet n of N" above the mirroring note (about 2.1 in. at 7 pt).
  let right = frame.header.x + frame.header.width - 2.3;
  for (const p of firsts) {
    const label = `${byId.get(p.templateId)!.sectionLabel}${p.copies > 1 ? ` copy ${p.copy}` : ''} tiles:`;
    const width = tileMapWidth(pen, label, p.tile!, height);
    const area = { x: right - width, y: frame.header.y + 0.02, width, height };
    if (area.x < frame.header.x + frame.header.width * 0.45) break;
    drawTileMap(pen, area, label, p.tile!);
    right = area.x - 0.15;
  }
}
