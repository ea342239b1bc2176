import type { PatternDocument } from '../../document/index';
import type { DocumentIssue } from '../../document/parse-pattern';
import { applyColourway, quiltBlockCount, quiltPlan, quiltSizes, QuiltPlanError, type QuiltPlan, type QuiltSizeRow } from '../../quilt/index';
import { fmtIn } from '../format-inches';
import type { PrintOptions } from '../print-options';
import type { BookletContext } from './booklet-context';
import type { BookletWriter } from './booklet-writer';
import { fabricColour } from './booklet-context';
import { drawShape, fillStripSetPatch, fitDiagram, lighten } from './diagram';
import type { SheetFlow, TableCell } from '../sheet-flow';

/*
 * The quilt in the print set (design §11, docs/quilt-layout.md): with `quiltSize` the print set is for
 * the whole quilt in that size; with `colourwayId` it is in that colourway.
 */

type QuiltPrintChoice = Pick<PrintOptions, 'quiltSize' | 'colourwayId'>;

/** What is wrong with the quilt size and colourway a print set asks for (paths as under `options`). */
export function quiltPrintIssues(document: PatternDocument, opts: QuiltPrintChoice): DocumentIssue[] {
  const issues: DocumentIssue[] = [];
  try {
    applyColourway(document, opts.colourwayId);
  } catch (error) {
    if (!(error instanceof QuiltPlanError)) throw error;
    issues.push({ path: 'colourwayId', message: error.message });
  }
  if (opts.quiltSize !== undefined) {
    if (!document.quilt) issues.push({ path: 'quiltSize', message: 'the pattern has no quilt layout' });
    else {
      try {
        quiltBlockCount(document, opts.quiltSize);
      } catch (error) {
        if (!(error instanceof QuiltPlanError)) throw error;
        issues.push({ path: 'quiltSize', message: error.message });
      }
    }
  }
  return issues;
}

/**
 * The document a print set is made from: in the chosen colourway, and with a chosen quilt size its block
 * count is the quilt's pieced blocks (so copies, cutting list and yardage are for the whole quilt).
 * Throws {@link QuiltPlanError} for an unknown size or colourway.
 */
export function quiltPrintDocument(document: PatternDocument, opts: QuiltPrintChoice): PatternDocument {
  const doc = applyColourway(document, opts.colourwayId);
  if (opts.quiltSize === undefined) return doc;
  if (!doc.quilt) throw new QuiltPlanError('the pattern has no quilt layout', 'quiltSize');
  return { ...doc, blockCount: Math.max(1, quiltBlockCount(doc, opts.quiltSize)) };
}

const plans = new WeakMap<PatternDocument, { size: string; plan: QuiltPlan; chart: QuiltSizeRow[] }>();

/** The quilt plan of a print set in its chosen size (worked out once per document), or null when no size was chosen. */
export function bookletQuilt(ctx: Pick<BookletContext, 'document' | 'options'>): { plan: QuiltPlan; chart: QuiltSizeRow[] } | null {
  const size = ctx.options.quiltSize;
  if (size === undefined || !ctx.document.quilt) return null;
  const known = plans.get(ctx.document);
  if (known && known.size === size) return known;
  // The document is already in its colourway (quiltPrintDocument), so no colourway is applied again.
  const entry = { size, plan: quiltPlan(ctx.document, { sizeName: size }), chart: quiltSizes(ctx.document) };
  plans.set(ctx.document, entry);
  return entry;
}

/** "66 × 66 in. (167.6 × 167.6 cm)" */
export function quiltSizeText(size: { width: number; height: number }): string {
  const cm = (v: number) => String(Math.round(v * 2.54 * 10) / 10); // 1 in. = 2.54 cm exactly
  // To the nearest ⅛ in. (an on-point quilt's size is irrational).
  const inch = (v: number) => fmtIn(Math.round(v * 8) / 8);
  return `${inch(size.width)} × ${inch(size.height)} in. (${cm(size.width)} × ${cm(size.height)} cm)`;
}

/** Yards as written on the booklet: eighths as fractions (2.375 → "2⅜"). */
function yd(yards: number): string {
  return `${fmtIn(yards)} yd`;
}

/** The size chart rows for a table: name, finished size, blocks, yardage per fabric. */
export function sizeChartTable(chart: readonly QuiltSizeRow[], chosen: string | null): { header: string[]; rows: string[][] } {
  const fabrics = chart[0]?.fabrics ?? [];
  return {
    header: ['Size', 'Finished', 'Blocks', ...fabrics.map((f) => f.name)],
    rows: chart.map((r) => [
      r.name === chosen ? `${r.name} (this set)` : r.name,
      `${fmtIn(Math.round(r.finishedSizeIn.width * 8) / 8)} × ${fmtIn(Math.round(r.finishedSizeIn.height * 8) / 8)} in.`,
      String(r.blockCount),
      ...r.fabrics.map((f) => (f.yards > 0 ? fmtIn(f.yards) : '—')),
    ]),
  };
}

/** The cover's line about the quilt: its size name, blocks, block size and setting. */
export function quiltCoverLine(plan: QuiltPlan): string {
  const blockSize = `${fmtIn(round3(plan.blockSizeIn.width))} × ${fmtIn(round3(plan.blockSizeIn.height))} in.`;
  const setting = plan.setting === 'on-point' ? 'set on point' : plan.sashing ? 'with sashing' : 'set side by side';
  const borders = plan.borders.length === 0 ? '' : `, ${plan.borders.length} border${plan.borders.length === 1 ? '' : 's'}`;
  return `${plan.sizeName ?? 'Quilt'}: ${plan.blockCount} block${plan.blockCount === 1 ? '' : 's'} of ${blockSize} (${plan.columns} × ${plan.rows}) ${setting}${borders}. Fabric, cutting and templates below are for the whole quilt.`;
}

/** The size chart as a table: each named size's finished size, blocks and yards of each fabric. */
export function drawSizeChart(flow: SheetFlow, chart: readonly QuiltSizeRow[], chosen: string | null): void {
  const { header, rows } = sizeChartTable(chart, chosen);
  const fabricCount = header.length - 3;
  const rest = Math.max(0.5, (flow.width - 3.3) / Math.max(1, fabricCount));
  flow.table(
    header.map((h, i) => ({ header: h, widthIn: i === 0 ? 1.4 : i === 1 ? 1.3 : i === 2 ? 0.6 : rest, align: i >= 2 ? ('right' as const) : undefined })),
    rows,
    8,
  );
}

/**
 * "Fabric for the whole quilt": what to buy of each fabric for the blocks and the setting (sashing,
 * cornerstones, plain blocks, setting triangles), borders, binding and backing, rounded up to ⅛ yd; then
 * the cuts of the setting, the borders and the binding.
 */
export function drawQuiltFabric(ctx: BookletContext, writer: BookletWriter): void {
  const quilt = bookletQuilt(ctx);
  if (!quilt) return;
  const { plan } = quilt;
  const flow = writer.part('Fabric for the whole quilt');
  flow.heading('Fabric for the whole quilt');
  flow.paragraph(
    `${plan.sizeName ?? 'The quilt'}: ${quiltSizeText(plan.finishedSizeIn)} finished, ${plan.blockCount} pieced block${plan.blockCount === 1 ? '' : 's'}. ` +
      'Each fabric is the sum of its strips across the usable WOF for the blocks, the setting, the borders and the binding, and the backing widths, ' +
      'rounded up to ⅛ yd (4½ in.). Lengths in inches of fabric off the bolt.',
    8.5,
  );
  const inch = (v: number) => (v > 0 ? fmtIn(Math.round(v * 8) / 8 === v ? v : Math.round(v * 1000) / 1000) : '—');
  flow.table(
    [
      { header: 'Fabric', widthIn: 1.6 },
      { header: 'Buy', widthIn: 0.8, align: 'right' },
      { header: 'Blocks', widthIn: 0.8, align: 'right' },
      { header: 'Setting', widthIn: 0.8, align: 'right' },
      { header: 'Borders', widthIn: 0.8, align: 'right' },
      { header: 'Binding', widthIn: 0.8, align: 'right' },
      { header: 'Backing', widthIn: flow.width - 5.6, align: 'right' },
    ],
    plan.fabrics
      .filter((f) => f.fabricLengthIn > 0)
      .map((f): TableCell[] => [{ text: f.name, swatch: f.colour }, yd(f.yards), inch(f.blocksIn), inch(f.settingIn), inch(f.bordersIn), inch(f.bindingIn), inch(f.backingIn)]),
  );
  flow.paragraph(`In all: ${yd(plan.totalYards)}. Batting: ${quiltSizeText(plan.batting)}.`, 9, true);

  flow.heading('Cutting the setting, borders and binding', 11);
  const name = (id: string | null) => (id ? (plan.fabrics.find((f) => f.id === id)?.name ?? id) : 'fabric of your choice');
  const rows: string[][] = [];
  for (const f of plan.fabrics) {
    for (const g of f.settingPieces) {
      const strips = g.stripWidthIn !== null ? `${g.stripCount} strip${g.stripCount === 1 ? '' : 's'} ${fmtIn(g.stripWidthIn)} in. × WOF, ${g.piecesPerStrip} per strip` : 'cut along the length';
      rows.push([f.name, `${g.count} × ${fmtIn(g.widthIn)} × ${fmtIn(g.lengthIn)} in.`, g.use, strips]);
    }
  }
  for (const b of plan.borders) {
    rows.push([
      name(b.fabricId),
      `2 × ${fmtIn(b.sides.cutLengthIn)} in., then 2 × ${fmtIn(b.topAndBottom.cutLengthIn)} in.`,
      `border ${b.index} (${fmtIn(b.widthIn)} in.): sides first, then top and bottom`,
      `${b.strips} strip${b.strips === 1 ? '' : 's'} ${fmtIn(b.cutWidthIn)} in. × WOF, joined end to end (${b.joins} join${b.joins === 1 ? '' : 's'})`,
    ]);
  }
  const bi = plan.binding;
  rows.push([name(bi.fabricId), `${fmtIn(bi.lengthIn)} in. joined`, `binding (perimeter ${fmtIn(bi.perimeterIn)} in. + ${fmtIn(bi.extraIn)} in.)`, `${bi.strips} strip${bi.strips === 1 ? '' : 's'} ${fmtIn(bi.stripWidthIn)} in. × WOF`]);
  const ba = plan.backing;
  rows.push([name(ba.fabricId), `${ba.widths} × ${fmtIn(ba.widthLengthIn)} in.`, `backing ${fmtIn(ba.widthIn)} × ${fmtIn(ba.heightIn)} in.`, backingSeamText(plan)]);
  flow.table(
    [
      { header: 'Fabric', widthIn: 1.2 },
      { header: 'Cut', widthIn: 1.9 },
      { header: 'For', widthIn: 2.0 },
      { header: 'From', widthIn: flow.width - 5.1 },
    ],
    rows,
  );
}

function backingSeamText(plan: QuiltPlan): string {
  const b = plan.backing;
  if (b.seams === 'none') return `one width of ${fmtIn(b.usableWofIn)} in. WOF, no seam`;
  return `${b.widths} full widths sewn together, seam${b.widths > 2 ? 's' : ''} running ${b.seams === 'across' ? 'across the quilt (horizontal)' : 'lengthwise (vertical)'}`;
}

/** Type size of the assembly steps, in points. */
const STEP_PT = 8.5;

/**
 * The quilt assembly page: the layout diagram (blocks as drafted, turned or mirrored per cell, sashing,
 * cornerstones, setting triangles, borders, binding edge), then the steps: rows with seams pressed in
 * opposite directions so they nest, rows joined, borders measured through the centre, backing, batting
 * and binding (common practice).
 */
export function drawQuiltAssembly(ctx: BookletContext, writer: BookletWriter): void {
  const quilt = bookletQuilt(ctx);
  if (!quilt) return;
  const { plan } = quilt;
  const { pen } = ctx;
  const flow = writer.part('Quilt assembly');
  flow.heading('Quilt assembly');
  flow.paragraph(
    `${plan.sizeName ?? 'The quilt'}: ${plan.columns} × ${plan.rows} blocks set ${plan.setting === 'on-point' ? 'on point' : 'straight'}, ${quiltSizeText(plan.finishedSizeIn)} finished. ` +
      'The picture is the front of the quilt, not to scale; arrows at the left show which way each row’s seams are pressed.',
    8.5,
  );
  // The picture takes what the steps leave on this sheet (at most 4.2 in., at least 2.5 in.), so the page
  // holds the whole assembly when it can.
  const steps = assemblySteps(plan);
  const stepsHeight = 0.34 + steps.reduce((h, s, i) => h + flow.paragraphHeight(`${i + 1}. ${s}`, STEP_PT), 0);
  const boxHeight = Math.max(2.5, Math.min(4.2, flow.roomLeft - stepsHeight - 0.2));
  const top = flow.room(boxHeight);
  const box = { x: flow.left + 0.35, y: top, width: flow.width - 0.35, height: boxHeight };
  const fit = fitDiagram([{ x: 0, y: 0 }, { x: plan.finishedSizeIn.width, y: plan.finishedSizeIn.height }], box, false, 0.05);
  drawQuiltPicture(ctx, plan, fit);
  // Row pressing arrows (straight setting: one per row of blocks).
  if (plan.setting === 'straight') {
    const bordersIn = plan.borders.reduce((s, b) => s + b.widthIn, 0);
    const step = plan.blockSizeIn.height + (plan.sashing?.widthIn ?? 0);
    for (let r = 0; r < plan.rows; r++) {
      const y = fit.map({ x: 0, y: bordersIn + r * step + plan.blockSizeIn.height / 2 }).y;
      const x0 = flow.left + 0.03;
      const x1 = flow.left + 0.3;
      const [from, to] = r % 2 === 0 ? [x0, x1] : [x1, x0];
      pen.polyline([{ x: from, y }, { x: to, y }], false, { widthPt: 0.9, colour: '#333333' });
      const dir = Math.sign(to - from);
      pen.polyline([{ x: to - dir * 0.07, y: y - 0.045 }, { x: to, y }, { x: to - dir * 0.07, y: y + 0.045 }], false, { widthPt: 0.9, colour: '#333333' });
    }
  }
  flow.gap(boxHeight + 0.1);

  flow.heading('Putting the quilt together (common practice)', 11);
  steps.forEach((s, i) => flow.paragraph(`${i + 1}. ${s}`, STEP_PT));
}

/** The assembly steps in words, for the booklet (common practice, docs/quilt-layout.md). */
export function assemblySteps(plan: QuiltPlan): string[] {
  const name = (id: string | null) => (id ? (plan.fabrics.find((f) => f.id === id)?.name ?? id) : 'fabric of your choice');
  const steps: string[] = [];
  const turned = plan.cells.some((c) => c.rotateDeg !== 0 || c.mirrored);
  steps.push(
    `Lay the ${plan.blockCount} block${plan.blockCount === 1 ? '' : 's'} out as in the picture${plan.alternateBlocks ? `, with the ${plan.alternateBlocks.count} plain ${name(plan.alternateBlocks.fabricId)} blocks` : ''}${turned ? ', each turned or mirrored as drawn' : ''}.`,
  );
  if (plan.setting === 'on-point') {
    const sash = plan.sashing;
    if (sash) {
      steps.push(
        `Sashing frames every block: sew each diagonal row of blocks with a ${name(sash.fabricId)} strip before, between and after the blocks, ` +
          `and each diagonal sashing row of strips with a ${name(sash.cornerstones.fabricId)} cornerstone before, between and after them. Press toward the sashing strips.`,
      );
    }
    steps.push(
      `Sew the ${sash ? 'block rows and sashing rows' : 'blocks into diagonal rows'} with a side setting triangle at each end of a row (the long edge of each triangle on the straight grain at the edge of the quilt). ` +
        'Press the seams of each row the opposite way to the row before, so the seams nest when the rows are joined.',
    );
    steps.push('Join the rows, nesting the seams; add the four corner triangles last. Trim the edges ¼ in. beyond the block points.');
  } else {
    const sash = plan.sashing;
    steps.push(
      `Sew the blocks of each row together${sash ? `, with a ${name(sash.fabricId)} sashing strip between neighbours` : ''}. ` +
        'Press the seams of the first row one way and of the next row the other way, row by row, so the seams nest when the rows are joined (see the arrows).',
    );
    if (sash) {
      steps.push(
        `Sew the sashing rows: strips alternating with ${name(sash.cornerstones.fabricId)} cornerstones. Press toward the sashing strips.`,
      );
      steps.push('Join the block rows and sashing rows, pinning where the seams meet.');
    } else {
      steps.push('Join the rows, pinning where the nested seams meet. Press the long seams one way or open.');
    }
  }
  for (const b of plan.borders) {
    steps.push(
      `Border ${b.index} (${name(b.fabricId)}, ${fmtIn(b.widthIn)} in. finished): join the ${b.strips} strips end to end. ` +
        `Measure the quilt top through its centre from top to bottom (it should be about ${fmtIn(b.sides.cutLengthIn)} in. raw), cut two strips that long and sew them to the sides first; press toward the border. ` +
        `Then measure through the centre from side to side (about ${fmtIn(b.topAndBottom.cutLengthIn)} in. raw) and cut and sew the top and bottom strips. ` +
        'Measuring through the centre, not along the edges, keeps the borders flat.',
    );
  }
  const ba = plan.backing;
  steps.push(
    ba.seams === 'none'
      ? `Backing: one piece ${fmtIn(ba.widthIn)} × ${fmtIn(ba.heightIn)} in. (${fmtIn(ba.marginIn)} in. beyond the top on every side).`
      : `Backing: sew ${ba.widths} widths of ${fmtIn(ba.widthLengthIn)} in. together along their selvage edges (selvages trimmed), seams running ${ba.seams === 'across' ? 'across the quilt' : 'lengthwise'}; press the seams open. It makes ${fmtIn(ba.widthIn)} × ${fmtIn(ba.heightIn)} in., ${fmtIn(ba.marginIn)} in. beyond the top on every side.`,
  );
  steps.push(`Batting: ${fmtIn(plan.batting.width)} × ${fmtIn(plan.batting.height)} in. Layer the backing (right side down), the batting and the top (right side up); baste and quilt, then trim the batting and backing even with the top.`);
  const bi = plan.binding;
  steps.push(
    `Binding: join the ${bi.strips} strips of ${fmtIn(bi.stripWidthIn)} in. end to end with diagonal seams (${fmtIn(bi.lengthIn)} in.: the ${fmtIn(bi.perimeterIn)} in. edge plus ${fmtIn(bi.extraIn)} in. for corners and the join), press open, fold in half lengthwise and sew to the front with the raw edges together, mitring the corners; fold to the back and stitch down by hand or machine.`,
  );
  return steps;
}

function round3(v: number): number {
  return Math.round(v * 1000) / 1000;
}

/** Draws the whole quilt from the front into `fit`: borders, sashing, setting triangles, blocks, binding edge. */
function drawQuiltPicture(ctx: BookletContext, plan: QuiltPlan, fit: { map: (p: { x: number; y: number }) => { x: number; y: number }; scale: number }): void {
  const { pen } = ctx;
  const colour = (id: string | null) => lighten(fabricColour(ctx, id ?? undefined), 0.1);
  const rectRing = (r: { xIn: number; yIn: number; widthIn: number; heightIn: number }) =>
    [
      { x: r.xIn, y: r.yIn },
      { x: r.xIn + r.widthIn, y: r.yIn },
      { x: r.xIn + r.widthIn, y: r.yIn + r.heightIn },
      { x: r.xIn, y: r.yIn + r.heightIn },
    ].map(fit.map);
  const seam = { widthPt: 0.3, colour: '#333333' };
  for (const r of [...plan.borderRects, ...plan.sashingRects]) drawShape(pen, rectRing(r), colour(r.fabricId), seam);
  for (const t of [...plan.sashingPolygons, ...plan.settingTrianglePolygons]) drawShape(pen, t.points.map(fit.map), colour(t.fabricId), seam);
  const b = plan.blockBoundsIn;
  for (const cell of plan.cells) {
    const [a, bb, c, d, e, f] = cell.transform;
    const toQuilt = (p: { x: number; y: number }) => fit.map({ x: a * p.x + c * p.y + e, y: bb * p.x + d * p.y + f });
    if (cell.alternate) {
      const ring = [
        { x: b.x, y: b.y },
        { x: b.x + b.width, y: b.y },
        { x: b.x + b.width, y: b.y + b.height },
        { x: b.x, y: b.y + b.height },
      ].map(toQuilt);
      drawShape(pen, ring, colour(plan.alternateBlocks?.fabricId ?? null), seam);
      continue;
    }
    for (const section of ctx.document.sections) {
      const patches = ctx.patches.get(section.id) ?? [];
      const count = section.ringRepeat?.count ?? 1;
      for (let i = 0; i < count; i++) {
        const turn = section.ringRepeat ? (2 * Math.PI * i) / count : 0;
        const o = section.ringRepeat?.centre ?? { x: 0, y: 0 };
        const rot = (p: { x: number; y: number }) => {
          const dx = p.x - o.x;
          const dy = p.y - o.y;
          return { x: o.x + dx * Math.cos(turn) - dy * Math.sin(turn), y: o.y + dx * Math.sin(turn) + dy * Math.cos(turn) };
        };
        const placed = { scale: fit.scale, map: (p: { x: number; y: number }) => toQuilt(rot(p)) };
        for (const p of patches) {
          if (p.stripSet) fillStripSetPatch(pen, placed, p.polygon, p.stripSet, (id) => lighten(fabricColour(ctx, id), 0.1), '#cccccc');
          else pen.fillPolygon(p.polygon.map(placed.map), lighten(fabricColour(ctx, p.fabricId), 0.1));
        }
      }
    }
    const outline = [
      { x: b.x, y: b.y },
      { x: b.x + b.width, y: b.y },
      { x: b.x + b.width, y: b.y + b.height },
      { x: b.x, y: b.y + b.height },
    ].map(toQuilt);
    drawShape(pen, outline, null, { widthPt: 0.5, colour: '#333333' });
  }
  // The binding edge.
  drawShape(pen, rectRing({ xIn: 0, yIn: 0, widthIn: plan.finishedSizeIn.width, heightIn: plan.finishedSizeIn.height }), null, { widthPt: 2.2, colour: fabricColour(ctx, plan.binding.fabricId ?? undefined) });
}
