import { fmtIn } from '../format-inches';
import { sheetCountStatement } from '../draw-cover';
import type { PrintLayout } from '../layout-types';
import { SheetFlow } from '../sheet-flow';
import type { SheetFrame } from '../sheet-frame';
import type { BookletContext } from './booklet-context';
import type { CopyPlan } from '../../fabrication/index';
import { drawShape, fitDiagram, lighten } from './diagram';
import { sectionCopyOutlines, type FinishedBlockSize } from './finished-size';
import { patternNotes } from './draw-notes-and-cautions';
import { yardsText } from './draw-fabric-requirements';
import { unsewableStatement } from './unsewable-sections';
import type { PieceTemplate } from '../piece-templates/build-piece-templates';
import { fillStripSetPatch } from './diagram';
import { fabricColour } from './booklet-context';
import { bookletQuilt, drawSizeChart, quiltCoverLine, quiltSizeText } from './quilt-booklet';

/** A line of the cover's contents: what, and on which sheets. */
export interface ContentsEntry {
  title: string;
  firstSheet: number;
  lastSheet: number;
}

/** Everything the cover needs beyond the document. */
export interface CoverFacts {
  finished: FinishedBlockSize | null;
  layout: PrintLayout;
  copies: CopyPlan;
  pieceTemplates: readonly PieceTemplate[];
  contents: readonly ContentsEntry[];
}

const CM_PER_IN = 2.54; // 1 in. = 25.4 mm exactly

/** "26 × 26 in. (66 × 66 cm)" */
export function finishedSizeText(size: FinishedBlockSize): string {
  const cm = (v: number) => String(Math.round(v * CM_PER_IN * 10) / 10);
  return `${fmtIn(round3(size.widthIn))} × ${fmtIn(round3(size.heightIn))} in. (${cm(size.widthIn)} × ${cm(size.heightIn)} cm)`;
}

function round3(v: number): number {
  return Math.round(v * 1000) / 1000;
}

/**
 * The booklet cover: title, the finished size of the block (its sections' bounding box, not the drawing
 * area) beside a picture of it, the fabrics with what to buy, the designer's notes, sections not
 * sewable as numbered, the template copies with the rule they follow, and the contents. What does not
 * fit on the cover continues on the sheets `continueOn` hands out (added at the end of the print set).
 */
export function drawBookletCover(ctx: BookletContext, frame: SheetFrame, facts: CoverFacts, continueOn: () => SheetFrame): void {
  const { pen, document } = ctx;
  const right = { x: frame.testBlock.x + frame.testBlock.width + 0.3, y: frame.content.y };
  pen.text(document.title, { x: right.x, y: right.y + 0.34 }, { sizePt: 20, bold: true });
  pen.text('Foundation-paper-piecing pattern · print set', { x: right.x, y: right.y + 0.6 }, { sizePt: 11 });
  // A print set for the whole quilt (docs/quilt-layout.md) gives the quilt's finished size, the block's below.
  const quilt = bookletQuilt(ctx);
  if (quilt) {
    pen.text(`Finished quilt: ${quiltSizeText(quilt.plan.finishedSizeIn)}`, { x: right.x, y: right.y + 0.9 }, { sizePt: 12, bold: true });
  } else if (facts.finished) {
    pen.text(`Finished size: ${finishedSizeText(facts.finished)}`, { x: right.x, y: right.y + 0.9 }, { sizePt: 12, bold: true });
  }

  // The block as seen from the front, top right.
  const picture = { x: frame.content.x + frame.content.width - 2.6, y: frame.content.y + 1.15, width: 2.6, height: 2.6 };
  drawBlockPicture(ctx, picture);

  // What does not fit on the cover runs on onto the continuation sheets (nothing is left out).
  let onCover = true;
  const flow = new SheetFlow(pen, () => {
    onCover = false;
    return continueOn();
  }, frame);
  const narrow = frame.content.width - 2.8;
  const besidePicture = () => onCover && flow.y < picture.y + picture.height + 0.1;
  const para = (text: string, sizePt: number, bold = false) => {
    const lines = pen.wrap(text, besidePicture() ? narrow : flow.width, sizePt, bold);
    const lineIn = (sizePt * 1.3) / 72;
    for (const line of lines) {
      const y = flow.block(lineIn).y;
      pen.text(line, { x: flow.left, y: y + lineIn * 0.8 }, { sizePt, bold });
    }
    flow.gap(0.05);
  };
  const heading = (text: string) => {
    flow.gap(0.06);
    para(text, 11, true);
  };

  if (quilt) para(quiltCoverLine(quilt.plan), 9, true);
  para(
    `${document.blockCount === 1 ? 'One block' : `${document.blockCount} blocks`}, ${document.sections.length} section${document.sections.length === 1 ? '' : 's'}, ` +
      `${fmtIn(document.seamAllowanceIn)} in. seam allowance. Templates: ${sheetCountStatement(facts.layout)}.`,
    9,
  );
  heading(quilt ? 'Fabrics for the whole quilt' : 'Fabrics');
  const buy = quilt
    ? quilt.plan.fabrics.filter((f) => f.yards > 0).map((f) => ({ name: f.name, colour: f.colour, eighths: Math.round(f.yards * 8) }))
    : ctx.cuttingList.fabrics.map((f) => ({ name: f.name, colour: f.colour, eighths: f.yardageEighths }));
  for (const f of buy) {
    const at = flow.block(0.2);
    pen.rect({ x: at.x, y: at.y + 0.03, width: 0.3, height: 0.14 }, { widthPt: 0.4 }, f.colour);
    pen.text(`${f.name} — buy ${yardsText(f.eighths)} yd`, { x: at.x + 0.4, y: at.y + 0.15 }, { sizePt: 9 });
  }
  const notes = patternNotes(ctx);
  if (notes) {
    heading("Designer's notes");
    for (const p of notes.split(/\n\s*\n/).filter((x) => x.trim())) para(p.replace(/\s*\n\s*/g, ' '), 9);
  }
  if (ctx.unsewable.size > 0) {
    heading('Not sewable as numbered — printed anyway');
    para(unsewableStatement([...ctx.unsewable.values()]), 9, true);
  }
  // Below the picture from here on.
  if (besidePicture()) flow.gap(picture.y + picture.height + 0.1 - flow.y);
  if (quilt && quilt.chart.length > 0) {
    heading('Sizes (yards of each fabric)');
    drawSizeChart(flow, quilt.chart, quilt.plan.sizeName);
  }
  heading('Template copies');
  para(facts.copies.rule, 8);
  {
    const freezer = ctx.options.foundation === 'freezer-paper';
    flow.table(
      [
        { header: 'Section', widthIn: 0.8 },
        { header: 'Patches (k)', widthIn: 1.0, align: 'right' },
        { header: 'Sections to sew', widthIn: 1.3, align: 'right' },
        { header: 'Sections per freezer print', widthIn: 2.0, align: 'right' },
        { header: freezer ? 'Prints (this set)' : 'Paper prints (this set)', widthIn: flow.width - 5.1, align: 'right' },
      ],
      facts.copies.sections.map((s) => [
        s.label,
        String(s.patches),
        String(s.templatesNeeded),
        String(s.sectionsPerTemplate),
        freezer ? `${s.printedCopies} freezer paper` : `${s.templatesNeeded} paper (${s.printedCopies} on freezer paper)`,
      ]),
      8,
    );
  }
  if (facts.pieceTemplates.length > 0) {
    para(
      'Piece templates: ' + facts.pieceTemplates.map((t) => `${t.patchLabel} cuts ${t.pieces} ${t.pieces === 1 ? 'piece' : 'pieces'}: ${t.copies} ${t.copies === 1 ? 'print' : 'prints'}`).join('; ') + '.',
      8.5,
    );
  }
  heading('Contents');
  flow.table(
    [
      { header: 'Part', widthIn: 3.4 },
      { header: 'Sheets', widthIn: 0.9, align: 'right' },
    ],
    facts.contents.map((entry) => [entry.title, entry.firstSheet === entry.lastSheet ? `${entry.firstSheet}` : `${entry.firstSheet}–${entry.lastSheet}`]),
    8.5,
  );
}

/** The whole block from the front: every copy of every section with its patches in their fabrics. */
function drawBlockPicture(ctx: BookletContext, box: { x: number; y: number; width: number; height: number }): void {
  // The picture fills a box set aside for it: a measuring pass (which draws nothing) has nothing to learn from it.
  if (ctx.pen.measuringOnly) return;
  const all = ctx.document.sections.flatMap((s) => sectionCopyOutlines(s).flat());
  if (all.length === 0) return;
  const fit = fitDiagram(all, box, false, 0.02);
  for (const section of ctx.document.sections) {
    const patches = ctx.patches.get(section.id) ?? [];
    const count = section.ringRepeat?.count ?? 1;
    for (let i = 0; i < count; i++) {
      const turn = section.ringRepeat ? (2 * Math.PI * i) / count : 0;
      const c = section.ringRepeat?.centre ?? { x: 0, y: 0 };
      const rot = (p: { x: number; y: number }) => {
        const dx = p.x - c.x;
        const dy = p.y - c.y;
        return { x: c.x + dx * Math.cos(turn) - dy * Math.sin(turn), y: c.y + dx * Math.sin(turn) + dy * Math.cos(turn) };
      };
      const turned = { scale: fit.scale, map: (p: { x: number; y: number }) => fit.map(rot(p)) };
      for (const p of patches) {
        const ring = p.polygon.map(turned.map);
        if (p.stripSet) fillStripSetPatch(ctx.pen, turned, p.polygon, p.stripSet, (id) => lighten(fabricColour(ctx, id), 0.1), '#cccccc');
        else ctx.pen.fillPolygon(ring, lighten(fabricColour(ctx, p.fabricId), 0.1));
        drawShape(ctx.pen, ring, null, { widthPt: 0.3, colour: '#333333' });
      }
    }
  }
  ctx.pen.text('The block from the front', { x: box.x + box.width / 2, y: box.y + box.height + 0.15 }, { sizePt: 7.5, align: 'center' });
}
