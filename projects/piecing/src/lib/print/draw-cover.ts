import type { PatternDocument } from '../document/index';
import { PRINT_CAUTIONS } from './cautions';
import { fmtIn } from './format-inches';
import { drawArrow, TEMPLATE_STYLES } from './draw-template';
import { CENTRE_LINE_STYLE } from './piece-templates/draw-piece-templates';
import type { PrintLayout } from './layout-types';
import { PAPER_SIZES } from './paper';
import type { PdfPen, StrokeStyle } from './pdf-pen';
import type { PrintOptions } from './print-options';
import { SheetFlow } from './sheet-flow';
import type { SheetFrame } from './sheet-frame';

/** What the cover says about the sheet count: "N sheets (at least M by area)". */
export function sheetCountStatement(layout: Pick<PrintLayout, 'templateSheetCount' | 'lowerBoundSheets'>): string {
  const n = layout.templateSheetCount;
  const m = layout.lowerBoundSheets;
  return `${n} ${n === 1 ? 'sheet' : 'sheets'} (at least ${m} by area)`;
}

/**
 * The cover sheet: title, the sheet count against its lower bound, the settings, how to print and
 * join tiles, a legend of the lines, where each section is, and the cautions. Drawn last, when the
 * page count is known; what does not fit continues on the sheets `continueOn` hands out.
 */
export function drawCover(
  pen: PdfPen,
  frame: SheetFrame,
  document: PatternDocument,
  options: PrintOptions,
  layout: PrintLayout,
  pageCount: number,
  continueOn: () => SheetFrame,
): void {
  const right = { x: frame.testBlock.x + frame.testBlock.width + 0.3, y: frame.content.y };
  pen.text(document.title, { x: right.x, y: right.y + 0.32 }, { sizePt: 20, bold: true });
  pen.text('How to print', { x: right.x, y: right.y + 0.58 }, { sizePt: 12 });
  pen.text(`Templates: ${sheetCountStatement(layout)}`, { x: right.x, y: right.y + 0.9 }, { sizePt: 12, bold: true });

  // What does not fit on this sheet runs on onto the continuation sheets (nothing is left out).
  const flow = new SheetFlow(pen, continueOn, frame);
  const firstTemplate = layout.sheets[0]?.pageNumber ?? pageCount + 1;
  const lastTemplate = firstTemplate + layout.templateSheetCount - 1;
  const after = pageCount - lastTemplate;
  flow.paragraph(
    `${pageCount} sheets in all: the cover, this sheet, the booklet (sheets 3–${firstTemplate - 1}: cutting, piecing, trimming, joining, notes and cautions), ` +
      `${layout.templateSheetCount} template ${layout.templateSheetCount === 1 ? 'sheet' : 'sheets'} (${layout.templateSheetCount === 1 ? `sheet ${firstTemplate}` : `sheets ${firstTemplate}–${lastTemplate}`})` +
      (after > 0 ? ` and ${after} ${after === 1 ? 'sheet' : 'sheets'} of piece templates.` : '.') +
      ` The area of all templates needs at least ${layout.lowerBoundSheets} ${layout.lowerBoundSheets === 1 ? 'sheet' : 'sheets'}.`,
  );
  flow.paragraph(
    `Paper: ${PAPER_SIZES[options.paper].displayName}, margins ${fmtIn(options.marginIn)} in. · ` +
      (options.mirrored
        ? 'Templates are mirror images: the printed side is the back of the block.'
        : 'Templates are printed as seen from the front of the block (not mirrored).') +
      ` · Foundation: ${options.foundation === 'paper' ? 'paper (one print per use)' : `freezer paper (one print per ${document.pressingsPerTemplate} pressings)`}.`,
  );

  flow.heading('Before you cut', 11);
  flow.paragraph('1. Print at 100 % / actual size (turn off "fit to page" and any scaling).', 9);
  flow.paragraph('2. Measure the 1 in. and the 2 cm test square on every sheet before cutting any fabric. If either is off, fix the printer settings and print again.', 9);
  flow.paragraph(
    `3. Tiled templates: tiles overlap by ${fmtIn(options.tileOverlapIn)} in. Trim one tile along the dashed "edge of …" line, lay it over its neighbour so the circled-cross alignment marks sit on top of each other, and tape. The map in the sheet header shows how the tiles join and which sheet each is on.`,
    9,
  );

  flow.heading('Lines on the templates', 11);
  const legend: Array<[string, StrokeStyle]> = [
    ['Sewing line (section outline and seams): sew on it', TEMPLATE_STYLES.sewing],
    ['Cutting line: seam allowance included', TEMPLATE_STYLES.cutting],
    ['Guide line: where a strip-set seam must land', TEMPLATE_STYLES.guide],
    ['Matching mark: line it up with the neighbouring section', TEMPLATE_STYLES.matching],
    ['Centre line (piece templates): the middle of a stripe lands here', CENTRE_LINE_STYLE],
  ];
  for (const [label, style] of legend) {
    const at = flow.block(0.2);
    pen.segments([{ a: { x: at.x, y: at.y + 0.1 }, b: { x: at.x + 0.6, y: at.y + 0.1 } }], style);
    pen.text(label, { x: at.x + 0.75, y: at.y + 0.13 }, { sizePt: 8.5 });
  }
  const arrowAt = flow.block(0.22);
  drawArrow(pen, { x: arrowAt.x + 0.3, y: arrowAt.y + 0.1 }, { x: 1, y: 0 }, 0.3);
  pen.text('Arrow inside each template, above its section and copy: which way it faces (towards the top of the block or the centre)', { x: arrowAt.x + 0.75, y: arrowAt.y + 0.13 }, { sizePt: 8.5 });

  flow.heading('Where each section is', 11);
  const rows = layout.templates.map((t) => [
    t.sectionLabel,
    String(t.copies),
    t.tileGrid ? `${t.tilesPerCopy} (${t.tileGrid.rows} × ${t.tileGrid.columns} grid)` : '1',
    pageList(t.pageNumbers),
  ]);
  flow.table(
    [
      { header: 'Section', widthIn: 0.8 },
      { header: 'Prints', widthIn: 0.7, align: 'right' },
      { header: 'Tiles per print', widthIn: 1.6 },
      { header: 'Sheets', widthIn: flow.width - 3.1 },
    ],
    rows,
  );

  flow.heading('Cautions', 11);
  for (const caution of PRINT_CAUTIONS) flow.paragraph(`• ${caution}`, 8.5);
}

/** "2, 3, 5–9" */
function pageList(pages: readonly number[]): string {
  const sorted = [...new Set(pages)].sort((a, b) => a - b);
  const parts: string[] = [];
  for (let i = 0; i < sorted.length; ) {
    let j = i;
    while (j + 1 < sorted.length && sorted[j + 1] === sorted[j] + 1) j++;
    parts.push(j > i + 1 ? `${sorted[i]}–${sorted[j]}` : j === i + 1 ? `${sorted[i]}, ${sorted[j]}` : String(sorted[i]));
    i = j + 1;
  }
  return parts.join(', ');
}
