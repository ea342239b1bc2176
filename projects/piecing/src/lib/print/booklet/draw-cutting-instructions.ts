import type { CuttingListFabric, CuttingListStripSet } from '../../fabrication/index';
import { stripSetDisplayName } from '../../fabrication/index';
import { fmtIn } from '../format-inches';
import { drawArrow } from '../draw-template';
import type { SheetFlow } from '../sheet-flow';
import type { BookletContext } from './booklet-context';
import type { BookletWriter } from './booklet-writer';
import { DIAGRAM_STYLES, lighten } from './diagram';

/** Whether a colour is darker than another (relative luminance, ITU-R BT.709 weights). */
export function darkerOf(a: string, b: string): 'a' | 'b' {
  const lum = (hex: string) => {
    const v = parseInt(hex.slice(1), 16);
    return 0.2126 * ((v >> 16) & 255) + 0.7152 * ((v >> 8) & 255) + 0.0722 * (v & 255);
  };
  return lum(a) <= lum(b) ? 'a' : 'b';
}

/** The strip-set pressing rule the booklet states (common practice). */
export const STRIP_SET_PRESSING = 'Press each strip seam toward the darker strip unless the designer says otherwise.';

/**
 * Cutting instructions: per fabric, the strips across the WOF and their sub-cuts with a diagram of one
 * strip; then each strip set, drawn with the sewing direction of each seam (alternating, so the set
 * stays straight), the guide lines its seams land on, the centre line of its middle stripe and the
 * sub-cuts.
 */
export function drawCuttingInstructions(ctx: BookletContext, writer: BookletWriter): void {
  const list = ctx.cuttingList;
  const flow = writer.part('Cutting instructions', [], { sameSheet: true });
  flow.heading('Cutting instructions');
  flow.paragraph(
    `Rough-cut sizes include the ${fmtIn(list.seamAllowanceIn)} in. seam allowance and a ${fmtIn(list.piecingMarginIn)} in. piecing margin, rounded up to ⅛ in. ` +
      'Cut strips across the width of fabric (WOF), selvage to selvage, then cross-cut them. Diagrams are not to scale.',
    8.5,
  );
  for (const fabric of list.fabrics) drawFabricCuts(ctx, flow, fabric);
  if (list.stripSets.length > 0) {
    flow.heading('Strip sets', 12);
    flow.paragraph(
      'Sew the strips together along their long edges with a ¼ in. seam. Sew each seam in the opposite direction to the one before (arrows), ' +
        `so the set stays straight instead of bowing. ${STRIP_SET_PRESSING} Then sub-cut the set across its strips. ` +
        'The seams of the set (blue dashes) must land on the guide lines printed on the templates; the centre line (blue dash-dot) of a middle stripe lands on its printed centre line.',
      8.5,
    );
    for (const set of list.stripSets) drawStripSetDiagram(ctx, flow, set);
  }
  for (const problem of list.problems) flow.paragraph(`Check: ${problem.message}`, 8);
}

function drawFabricCuts(ctx: BookletContext, flow: SheetFlow, fabric: CuttingListFabric): void {
  const pen = ctx.pen;
  // Keep a fabric's name with its first cut and diagram.
  flow.room(1.0);
  const head = flow.block(0.3);
  pen.rect({ x: head.x, y: head.y + 0.08, width: 0.3, height: 0.16 }, { widthPt: 0.4 }, fabric.colour);
  pen.text(`${fabric.name} — usable WOF ${fmtIn(fabric.usableWofIn)} in.`, { x: head.x + 0.4, y: head.y + 0.21 }, { sizePt: 10.5, bold: true });
  for (const g of fabric.pieces) {
    const shape = Math.abs(g.widthIn - g.lengthIn) < 1e-9 ? `${fmtIn(g.widthIn)} in. square${g.count === 1 ? '' : 's'}` : `${fmtIn(g.widthIn)} × ${fmtIn(g.lengthIn)} in. rectangle${g.count === 1 ? '' : 's'}`;
    const patches = `for ${[...new Set(g.patchLabels)].join(', ')}`;
    if (g.stripWidthIn === null || g.pieceLengthIn === null || g.piecesPerStrip === null) {
      flow.paragraph(`• Cut ${g.count} ${shape} along the length of the fabric (${fmtIn(g.lengthwiseIn)} in.), ${patches}.`, 8.5);
      continue;
    }
    flow.paragraph(
      `• Cut ${g.stripCount} strip${g.stripCount === 1 ? '' : 's'} ${fmtIn(g.stripWidthIn)} in. × WOF; cross-cut ${g.count} ${shape} ` +
        `(${g.piecesPerStrip} per strip), ${patches}.`,
      8.5,
    );
    drawStripDiagram(ctx, flow, fabric, g.stripWidthIn, g.pieceLengthIn, Math.min(g.piecesPerStrip, g.count));
  }
  for (const st of fabric.stripSetStrips) {
    const set = ctx.cuttingList.stripSets.find((s) => s.stripSetId === st.stripSetId);
    const name = set ? stripSetDisplayName(set.name, set.patchLabels) : 'its strip set';
    flow.paragraph(
      `• Cut ${st.stripCount} strip${st.stripCount === 1 ? '' : 's'} ${fmtIn(st.cutWidthIn)} in. × WOF for ${name} (strip ${st.stripIndex + 1}, finishes ${fmtIn(st.finishedWidthIn)} in.).`,
      8.5,
    );
  }
  flow.gap(0.08);
}

/** One WOF strip with its cross-cuts marked (not to scale across; along, to the WOF). */
function drawStripDiagram(ctx: BookletContext, flow: SheetFlow, fabric: CuttingListFabric, widthIn: number, pieceIn: number, pieces: number): void {
  const pen = ctx.pen;
  const lengthDraw = Math.min(5.2, flow.width - 1.6);
  const scale = lengthDraw / fabric.usableWofIn;
  const h = Math.min(0.45, Math.max(0.16, widthIn * scale));
  const top = flow.block(h + 0.3);
  const x0 = top.x + 0.2;
  const y0 = top.y + 0.04;
  pen.rect({ x: x0, y: y0, width: lengthDraw, height: h }, DIAGRAM_STYLES.outline, lighten(fabric.colour, 0.45));
  const cuts = [];
  for (let k = 1; k <= pieces; k++) {
    const x = x0 + k * pieceIn * scale;
    if (x > x0 + lengthDraw - 1e-6) break;
    cuts.push({ a: { x, y: y0 - 0.03 }, b: { x, y: y0 + h + 0.03 } });
  }
  pen.segments(cuts, { widthPt: 0.6, dashPt: [2, 1.5], colour: '#000000' });
  pen.text(`${fmtIn(widthIn)} in.`, { x: x0 - 0.04, y: y0 + h / 2 }, { sizePt: 7, align: 'right', baseline: 'middle' });
  pen.text(`one strip, ${fmtIn(fabric.usableWofIn)} in. (WOF) — cut every ${fmtIn(pieceIn)} in.`, { x: x0, y: y0 + h + 0.17 }, { sizePt: 7 });
}

/** A strip set: strips stacked, sewing direction per seam, guide lines, centre line, sub-cuts. */
function drawStripSetDiagram(ctx: BookletContext, flow: SheetFlow, set: CuttingListStripSet): void {
  const pen = ctx.pen;
  const name = stripSetDisplayName(set.name, set.patchLabels);
  const sewn = set.sewnWidthIn;
  const scale = Math.min(0.22, 1.5 / sewn);
  // Cut strips overlap by two allowances at each seam once sewn: draw the finished widths, raw edges outside.
  const allowance = ctx.cuttingList.seamAllowanceIn;
  const drawH = sewn * scale;
  const lengthDraw = Math.min(4.6, flow.width - 2.6);
  const seamLines = set.strips.length - 1;
  const textLines = 3 + seamLines;
  const top = flow.block(Math.max(drawH + 0.55, 0.3 + textLines * 0.16) + 0.1);
  pen.text(`${name} — for ${[...new Set(set.patchLabels)].join(', ')}`, { x: top.x, y: top.y + 0.15 }, { sizePt: 9.5, bold: true });
  const x0 = top.x + 0.2;
  const y0 = top.y + 0.3;
  let y = y0;
  const seamYs: number[] = [];
  set.strips.forEach((strip, i) => {
    const fin = strip.finishedWidthIn * scale;
    const outerTop = i === 0 ? allowance * scale : 0;
    const outerBottom = i === set.strips.length - 1 ? allowance * scale : 0;
    const h = fin + outerTop + outerBottom;
    pen.rect({ x: x0, y, width: lengthDraw, height: h }, DIAGRAM_STYLES.outline, lighten(ctx.fabrics.get(strip.fabricId)?.colour ?? '#cccccc', 0.5));
    const fabricName = ctx.fabrics.get(strip.fabricId)?.name ?? 'fabric';
    pen.text(`${i + 1}. ${fabricName}, cut ${fmtIn(strip.cutWidthIn)} in.`, { x: x0 + 0.06, y: y + h / 2 }, { sizePt: 7, baseline: 'middle' });
    y += h;
    if (i < set.strips.length - 1) seamYs.push(y);
  });
  // Seams: guide style, with the sewing direction alternating seam to seam.
  pen.segments(seamYs.map((sy) => ({ a: { x: x0, y: sy }, b: { x: x0 + lengthDraw, y: sy } })), DIAGRAM_STYLES.guide);
  seamYs.forEach((sy, k) => {
    const d = k % 2 === 0 ? { x: 1, y: 0 } : { x: -1, y: 0 };
    drawArrow(pen, { x: x0 + lengthDraw * 0.72, y: sy }, d, 0.4);
  });
  // Centre line of every middle stripe (a strip with a seam on both sides).
  let acc = y0 + allowance * scale;
  const centres: number[] = [];
  set.strips.forEach((strip, i) => {
    if (i > 0 && i < set.strips.length - 1) centres.push(acc + (strip.finishedWidthIn * scale) / 2);
    acc += strip.finishedWidthIn * scale;
  });
  pen.segments(centres.map((cy) => ({ a: { x: x0 + lengthDraw * 0.45, y: cy }, b: { x: x0 + lengthDraw, y: cy } })), DIAGRAM_STYLES.centre);
  // Sub-cuts from the left end.
  const subScale = lengthDraw / Math.max(set.subCutLengthIn * 4, 1);
  const cuts = [1, 2, 3].map((k) => x0 + k * set.subCutLengthIn * subScale);
  pen.segments(cuts.map((x) => ({ a: { x, y: y0 - 0.05 }, b: { x, y: y + 0.05 } })), { widthPt: 0.6, dashPt: [2, 1.5], colour: '#000000' });
  pen.text(`sub-cut every ${fmtIn(set.subCutLengthIn)} in.`, { x: x0, y: y + 0.17 }, { sizePt: 7 });

  // Words beside the diagram.
  const tx = x0 + lengthDraw + 0.2;
  let ty = y0 + 0.1;
  const line = (text: string, bold = false) => {
    pen.text(text, { x: tx, y: ty }, { sizePt: 7.5, bold });
    ty += 0.16;
  };
  line(`Sewn width ${fmtIn(set.sewnWidthIn)} in.; sew ${set.setCount} set${set.setCount === 1 ? '' : 's'}`, true);
  line(`${set.subCutCount} sub-cuts of ${fmtIn(set.subCutLengthIn)} in. (${set.subCutsPerSet} per set)`);
  set.strips.slice(1).forEach((strip, k) => {
    const before = set.strips[k];
    const [a, b] = [ctx.fabrics.get(before.fabricId), ctx.fabrics.get(strip.fabricId)];
    const toward = a && b ? (darkerOf(a.colour, b.colour) === 'a' ? a.name : b.name) : 'the darker strip';
    line(`Seam ${k + 1}: sew ${k % 2 === 0 ? 'left to right' : 'right to left'}; press toward ${toward}`);
  });
  line('Arrows: sewing direction; blue: guide lines');
}
