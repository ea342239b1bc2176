import type { Point } from '../../document/index';
import { polygonBounds } from '../../geometry/index';
import type { BookletWriter } from '../booklet/booklet-writer';
import { TEMPLATE_STYLES } from '../draw-template';
import type { PdfPen, StrokeStyle } from '../pdf-pen';
import type { PieceTemplate, PieceTemplateLine } from './build-piece-templates';

/** The centre line of a stripe that must land on a printed line: blue dash-dot. */
export const CENTRE_LINE_STYLE: StrokeStyle = { widthPt: 0.8, dashPt: [6, 2, 1.5, 2], colour: '#1d5fa6' };

const CAPTION_IN = 0.42;
const GAP_IN = 0.25;

/**
 * Piece templates at true scale, as seen from the front (they are ironed on the right side of the
 * fabric or strip set): cutting line, sewing line, the strip seams as guide lines and the centre line
 * of every middle stripe, each line named. Each section's templates start a part of their own.
 */
export function drawPieceTemplates(
  pen: PdfPen,
  writer: BookletWriter,
  templates: readonly PieceTemplate[],
  single: boolean,
  pressingsPerTemplate: number,
): void {
  const bySection = new Map<string, PieceTemplate[]>();
  for (const t of templates) bySection.set(t.sectionId, [...(bySection.get(t.sectionId) ?? []), t]);
  for (const [sectionId, list] of bySection) {
    const flow = writer.part(`Piece templates — section ${list[0].sectionLabel}`, [sectionId]);
    flow.heading(`Piece templates — section ${list[0].sectionLabel}`, 12);
    flow.paragraph(
      'True scale, as seen from the front. Iron each template, shiny side down, on the right side of its fabric or strip set with the strip seams ' +
        'on the blue dashed guide lines and the middle of each stripe on its dash-dot centre line; cut on the dashed cutting line. ' +
        `A piece template is pressed once per piece cut, so one print lasts ${pressingsPerTemplate} pieces: prints = ceil(pieces / ${pressingsPerTemplate}).`,
      8,
    );
    // Shelves: templates side by side while they fit across, then the next row.
    const items = list.flatMap((t) => Array.from({ length: single ? 1 : t.copies }, (_, i) => ({ t, copy: i + 1, copies: single ? 1 : t.copies })));
    let row: typeof items = [];
    let rowWidth = 0;
    const flush = () => {
      if (row.length === 0) return;
      const height = Math.max(...row.map((r) => size(r.t).h)) + CAPTION_IN;
      const top = flow.block(height + 0.15);
      let x = top.x;
      for (const r of row) {
        drawOne(pen, r.t, { x, y: top.y }, r.copy, r.copies);
        x += Math.max(size(r.t).w, 2.6) + GAP_IN;
      }
      row = [];
      rowWidth = 0;
    };
    for (const item of items) {
      const { w: tw, h: th } = size(item.t);
      if (tw > flow.width || th + CAPTION_IN + 0.15 > flow.sheetRoom) {
        // True scale matters more than fitting: say so rather than shrink it.
        if (item.copy === 1) {
          flow.paragraph(
            `Piece template ${item.t.patchLabel} (${tw.toFixed(2)} × ${th.toFixed(2)} in.) is larger than this paper: print the set on larger paper for it, or trace it from the foundation template.`,
            9,
            true,
          );
        }
        continue;
      }
      const w = Math.max(tw, 2.6) + GAP_IN;
      if (rowWidth + w > flow.width + GAP_IN && row.length > 0) flush();
      row.push(item);
      rowWidth += w;
    }
    flush();
  }
}

function size(t: PieceTemplate): { w: number; h: number } {
  const b = polygonBounds(t.cuttingLine);
  return { w: b.maxX - b.minX, h: b.maxY - b.minY };
}

function drawOne(pen: PdfPen, t: PieceTemplate, at: Point, copy: number, copies: number): void {
  const b = polygonBounds(t.cuttingLine);
  const map = (p: Point): Point => ({ x: at.x + (p.x - b.minX), y: at.y + CAPTION_IN + (p.y - b.minY) });
  pen.text(`Piece template ${t.patchLabel}${copies > 1 ? ` · print ${copy} of ${copies}` : ''}`, { x: at.x, y: at.y + 0.14 }, { sizePt: 8.5, bold: true });
  pen.text(`${t.material} · cuts ${t.pieces} ${t.pieces === 1 ? 'piece' : 'pieces'}`, { x: at.x, y: at.y + 0.3 }, { sizePt: 7.5 });
  pen.polyline(t.cuttingLine.map(map), true, TEMPLATE_STYLES.cutting);
  pen.polyline(t.sewingLine.map(map), true, TEMPLATE_STYLES.sewing);
  pen.segments(t.guideLines.map((l) => ({ a: map(l.a), b: map(l.b) })), TEMPLATE_STYLES.guide);
  pen.segments(t.centreLines.map((l) => ({ a: map(l.a), b: map(l.b) })), CENTRE_LINE_STYLE);
  for (const line of [...t.guideLines, ...t.centreLines]) labelLine(pen, line, map);
}

/** Writes a line's name along it, beside its middle, reading upward or left to right. */
function labelLine(pen: PdfPen, line: PieceTemplateLine, map: (p: Point) => Point): void {
  let a = map(line.a);
  let b = map(line.b);
  if (b.x < a.x - 1e-9 || (Math.abs(b.x - a.x) < 1e-9 && b.y > a.y)) [a, b] = [b, a];
  const len = Math.hypot(b.x - a.x, b.y - a.y);
  if (len < 0.8) return;
  const angleDeg = (Math.atan2(-(b.y - a.y), b.x - a.x) * 180) / Math.PI;
  const ux = (b.x - a.x) / len;
  const uy = (b.y - a.y) / len;
  // Just left of the line as it reads (above it on the sheet), starting a quarter of the way along.
  const start = { x: a.x + ux * len * 0.12 + uy * 0.05, y: a.y + uy * len * 0.12 - ux * 0.05 };
  pen.text(line.label, start, { sizePt: 7, colour: '#1d5fa6', angleDeg });
}
