import type { Point, Section } from '../../document/index';
import { polygonBounds, type DerivedPatch } from '../../geometry/index';
import { checkSewability, type SewingStep } from '../../sewability/index';
import type { SheetFlow } from '../sheet-flow';
import { sheetFrame } from '../sheet-frame';
import { fabricColour, patchMaterial, sectionUses, type BookletContext } from './booklet-context';
import type { BookletWriter } from './booklet-writer';
import { DIAGRAM_STYLES, drawShape, fillStripSetPatch, fitBounds, lighten, normalTowards, scaledRing, type DiagramFit } from './diagram';
import { pressOf, pressWords, type SectionPressing } from './section-pressing';

/** The usual reminders of foundation piecing (common practice). */
export const PIECING_REMINDERS =
  'Press each patch flat after sewing it, before the next one goes on. Before adding the next patch, fold the foundation ' +
  'back on the next sewing line and pre-trim the fabric ¼ in. beyond it (common practice). Sew on the printed lines with a ' +
  'short stitch (about 1.5 mm) so the paper tears away cleanly.';

const COLUMNS = 5;
const DIAGRAM_IN = 1.45;
const CAPTION_PT = 7.5;
const LINE_IN = (CAPTION_PT * 1.3) / 72;
const NUMBER_IN = 0.2;
/** What a section heading takes ({@link SheetFlow.heading} asks for 0.5 in.), plus the gap above a section that follows another. */
const HEADING_ROOM_IN = 0.5 + 0.15;

/** A section's steps laid out: each step's caption lines, rows of step indices and each row's height. */
interface StepsLayout {
  texts: string[][];
  rows: number[][];
  heights: number[];
}

/**
 * One part per section: its piecing steps as small numbered diagrams (the patch added highlighted, the
 * line to sew in red, an arrow for the press), each with its words, and the designer's note. The usual
 * reminders and how to read the diagrams come once, before the first section. A section begins below the
 * one before it when its heading and first row of steps fit in the room left, so a sheet carries several
 * short sections; its header names them all.
 */
export function drawPiecingSteps(ctx: BookletContext, writer: BookletWriter, pressingOf: (section: Section) => SectionPressing): void {
  const labels = new Map(ctx.document.sections.map((s) => [s.id, s.label]));
  const subtitleOf = (ids: string[]) => `Piecing — section${ids.length > 1 ? 's' : ''} ${ids.map((id) => labels.get(id)).join(', ')}`;
  // Booklet sheets are portrait sheets of the chosen paper (render-print-set.ts).
  const width = sheetFrame(ctx.options.paper, 'portrait', ctx.options.marginIn).content.width;
  let first = true;
  for (const section of ctx.document.sections) {
    const patches = ctx.patches.get(section.id) ?? [];
    if (patches.length === 0) continue;
    const verdict = ctx.verdicts.get(section.id) ?? checkSewability(patches);
    const pressing = pressingOf(section);
    const layout = layoutSteps(ctx, patches, verdict.steps, pressing, width);
    const flow = writer.part(subtitleOf([section.id]), [section.id], { sameSheet: !first, minRoomIn: HEADING_ROOM_IN + layout.heights[0], subtitleOf });
    if (first) {
      flow.heading('Piecing steps');
      flow.paragraph(PIECING_REMINDERS, 8.5);
      flow.paragraph(
        ctx.options.mirrored
          ? 'Diagrams show the printed side of the foundation (a mirror image, as the templates print); the fabric goes on the unprinted side. Red: the line to sew. Arrow: which way to press.'
          : 'Diagrams show the block from the front, as the templates print. Red: the line to sew. Arrow: which way to press.',
        8,
      );
      first = false;
    }
    const uses = sectionUses(ctx.document, section);
    flow.heading(`Section ${section.label}: piecing steps${uses > 1 ? ` (sew ${uses})` : ''}`);
    const unsewable = ctx.unsewable.get(section.id);
    if (unsewable) {
      flow.paragraph(`NOT SEWABLE AS NUMBERED — printed anyway at the designer's request. ${unsewable.reason}.`, 9, true);
    }
    if (section.note?.trim()) flow.paragraph(`Designer's note: ${section.note.trim()}`, 9, true);
    drawSteps(ctx, flow, section.label, patches, verdict.steps, pressing, layout);
    if (!verdict.sewable && verdict.failure) {
      const left = patches.slice(verdict.steps.length + 1).map((p) => p.label);
      flow.paragraph(`The steps stop at ${verdict.failure.label}: ${left.join(', ')} cannot be added in this order. ${verdict.failure.message}.`, 9, true);
    }
  }
}

function layoutSteps(ctx: BookletContext, patches: DerivedPatch[], steps: SewingStep[], pressing: SectionPressing, width: number): StepsLayout {
  const cellW = width / COLUMNS;
  const count = 1 + steps.length;
  const texts: string[][] = [];
  for (let i = 0; i < count; i++) texts.push(ctx.pen.wrap(stepText(ctx, patches, steps, i, pressing), cellW - 0.12, CAPTION_PT));
  const rows: number[][] = [];
  const heights: number[] = [];
  for (let row = 0; row * COLUMNS < count; row++) {
    const items = Array.from({ length: Math.min(COLUMNS, count - row * COLUMNS) }, (_, c) => row * COLUMNS + c);
    rows.push(items);
    heights.push(DIAGRAM_IN + 0.08 + Math.max(...items.map((i) => texts[i].length)) * LINE_IN + 0.12);
  }
  return { texts, rows, heights };
}

function drawSteps(
  ctx: BookletContext,
  flow: SheetFlow,
  label: string,
  patches: DerivedPatch[],
  steps: SewingStep[],
  pressing: SectionPressing,
  layout: StepsLayout,
): void {
  const cellW = flow.width / COLUMNS;
  // Every diagram of a section shows all its patches: their bounds once, fitted into each step's box.
  const bounds = polygonBounds(patches.flatMap((p) => p.polygon));
  const byNumber = new Map(patches.map((p) => [p.number, p]));
  const stepOf = new Map(steps.map((s) => [s.patchNumber, s]));
  // Diagram i adds the patch of rank i (0: the first patch, then each step's) and shows those of lower rank as sewn.
  const rank = new Map<number, number>([[patches[0].number, 0]]);
  steps.forEach((s, k) => rank.set(s.patchNumber, k + 1));
  const { texts } = layout;
  // Every step's box has one size, so one scale: each patch's outline is scaled once and each box adds its corner.
  let scaled: { scale: number; rings: Point[][] } | undefined;
  layout.rows.forEach((items, row) => {
    // Steps running on onto the next sheet go under the section's heading again.
    if (row > 0 && flow.roomLeft < layout.heights[row]) {
      flow.startSheet();
      flow.heading(`Section ${label}: piecing steps (continued)`, 11);
    }
    const top = flow.block(layout.heights[row]);
    items.forEach((i, c) => {
      // The step number sits above its diagram, so a diagram filling its box never covers it.
      const box = { x: top.x + c * cellW + 0.04, y: top.y + NUMBER_IN, width: cellW - 0.08, height: DIAGRAM_IN - NUMBER_IN };
      const fit = fitBounds(bounds, box, ctx.options.mirrored);
      const addedNumber = i === 0 ? patches[0].number : steps[i - 1].patchNumber;
      const sewnBefore = (p: DerivedPatch) => (rank.get(p.number) ?? Infinity) < i;
      if (!scaled || scaled.scale !== fit.scale) scaled = { scale: fit.scale, rings: patches.map((p) => scaledRing(bounds, fit.scale, ctx.options.mirrored, p.polygon)) };
      const { rings } = scaled;
      let addedRing: Point[] = [];
      for (const [k, p] of patches.entries()) {
        const ring = rings[k].map((o) => ({ x: fit.x0 + o.x, y: fit.y0 + o.y }));
        if (p.number === addedNumber) {
          fillPatch(ctx, fit, p, 0, ring);
          addedRing = ring;
        } else if (sewnBefore(p)) fillPatch(ctx, fit, p, 0.6, ring);
        drawShape(ctx.pen, ring, null, DIAGRAM_STYLES.faint);
      }
      drawShape(ctx.pen, addedRing, null, DIAGRAM_STYLES.highlight);
      const step = stepOf.get(addedNumber);
      const shown = patches.filter((p) => p.number === addedNumber || sewnBefore(p));
      const labelsAt = shown.map((p) => fit.map(p.labelPoint));
      if (step) drawSewAndPress(ctx, fit, step, byNumber.get(addedNumber)!, pressOf(pressing, step), labelsAt);
      for (const [k, p] of shown.entries()) {
        const at = labelsAt[k];
        const dark = p.number === addedNumber && isDark(lighten(fabricColour(ctx, p.fabricId ?? p.stripSet?.strips[0]?.fabricId), 0.25));
        ctx.pen.text(p.label, at, { sizePt: 7, bold: p.number === addedNumber, align: 'center', baseline: 'middle', colour: dark ? '#ffffff' : '#000000' });
      }
      ctx.pen.text(`${i + 1}`, { x: box.x + 0.02, y: top.y + 0.15 }, { sizePt: 10, bold: true });
      texts[i].forEach((line, k) => ctx.pen.text(line, { x: box.x + 0.02, y: top.y + DIAGRAM_IN + 0.08 + LINE_IN * (k + 0.8) }, { sizePt: CAPTION_PT }));
    });
  });
}

/** Fills a patch of a step's diagram; `ring` is its outline already on the sheet. */
function fillPatch(ctx: BookletContext, fit: DiagramFit, patch: DerivedPatch, paleness: number, ring: Point[]): void {
  const amount = paleness + (1 - paleness) * 0.25;
  if (patch.stripSet) {
    const colour = (id: string | undefined) => lighten(fabricColour(ctx, id), amount);
    fillStripSetPatch(ctx.pen, fit, patch.polygon, patch.stripSet, colour, colour(undefined));
  } else ctx.pen.fillPolygon(ring, lighten(fabricColour(ctx, patch.fabricId), amount));
}

function drawSewAndPress(ctx: BookletContext, fit: DiagramFit, step: SewingStep, added: DerivedPatch, press: 'added' | 'previous' | 'open', labels: readonly Point[]): void {
  const a = fit.map(step.from);
  const b = fit.map(step.to);
  ctx.pen.segments([{ a, b }], DIAGRAM_STYLES.sewLine);
  const { n } = normalTowards(a, b, fit.map(added.labelPoint));
  const len = 0.22;
  // Along the seam where the arrow stays clearest of the patch labels.
  const at = (t: number) => ({ x: a.x + (b.x - a.x) * t, y: a.y + (b.y - a.y) * t });
  let t = 0.3;
  let bestClearance = arrowClearance(at(t), n, len, labels);
  for (const c of [0.5, 0.7, 0.2, 0.8]) {
    const clearance = arrowClearance(at(c), n, len, labels);
    if (clearance > bestClearance + 0.02) {
      t = c;
      bestClearance = clearance;
    }
  }
  const mid = at(t);
  const colour = isDark(lighten(fabricColour(ctx, added.fabricId ?? added.stripSet?.strips[0]?.fabricId), 0.25)) ? '#ffffff' : '#000000';
  if (press === 'open') {
    pressArrow(ctx, { x: mid.x + n.x * 0.13, y: mid.y + n.y * 0.13 }, n, len * 0.8, colour);
    pressArrow(ctx, { x: mid.x - n.x * 0.13, y: mid.y - n.y * 0.13 }, { x: -n.x, y: -n.y }, len * 0.8, '#000000');
    return;
  }
  const d: Point = press === 'added' ? n : { x: -n.x, y: -n.y };
  pressArrow(ctx, { x: mid.x + d.x * len * 0.6, y: mid.y + d.y * len * 0.6 }, d, len, press === 'added' ? colour : '#000000');
}

/** How far the nearest label is from either end of a pressing arrow of half-length `len` across the seam at `p`. */
function arrowClearance(p: Point, n: Point, len: number, labels: readonly Point[]): number {
  let clearance = Infinity;
  for (const l of labels) {
    clearance = Math.min(clearance, Math.min(Math.hypot(l.x - p.x - n.x * len, l.y - p.y - n.y * len), Math.hypot(l.x - p.x + n.x * len, l.y - p.y + n.y * len)));
  }
  return clearance;
}

/** A pressing arrow in a colour that shows on the fabric under it. */
function pressArrow(ctx: BookletContext, centre: Point, d: Point, lengthIn: number, colour: string): void {
  const tip = { x: centre.x + (d.x * lengthIn) / 2, y: centre.y + (d.y * lengthIn) / 2 };
  const tail = { x: centre.x - (d.x * lengthIn) / 2, y: centre.y - (d.y * lengthIn) / 2 };
  const head = lengthIn * 0.4;
  const side = { x: -d.y, y: d.x };
  const back = { x: tip.x - d.x * head, y: tip.y - d.y * head };
  ctx.pen.segments([{ a: tail, b: back }], { widthPt: 1, colour });
  ctx.pen.fillPolygon([tip, { x: back.x + side.x * head * 0.5, y: back.y + side.y * head * 0.5 }, { x: back.x - side.x * head * 0.5, y: back.y - side.y * head * 0.5 }], colour);
}

/** Whether a colour is dark enough to want white marks on it (relative luminance, ITU-R BT.709 weights). */
export function isDark(hex: string): boolean {
  const v = parseInt(hex.slice(1), 16);
  return 0.2126 * ((v >> 16) & 255) + 0.7152 * ((v >> 8) & 255) + 0.0722 * (v & 255) < 110;
}

function stepText(ctx: BookletContext, patches: DerivedPatch[], steps: SewingStep[], i: number, pressing: SectionPressing): string {
  const first = patches[0];
  if (i === 0) {
    const strips = first.stripSet ? ' Lay its strip seams on the printed guide lines.' : '';
    const trim = steps[0] ? ` Fold back on the ${steps[0].label} line; trim ¼ in. beyond it.` : '';
    return `Place ${first.label} (${patchMaterial(ctx, first)}) right side up on the unprinted side, covering ${first.label} and ¼ in. beyond its lines; hold it with a dab of glue.${strips}${trim}`;
  }
  const step = steps[i - 1];
  const patch = patches.find((p) => p.number === step.patchNumber)!;
  const earlier = [first.label, ...steps.slice(0, i - 1).map((s) => s.label)];
  const strips = patch.stripSet ? ' Strip seams on the guide lines.' : '';
  const next = steps[i];
  const trim = next ? ` Fold back on the ${next.label} line; trim ¼ in. beyond it.` : ' Last patch: trim the section (see Trimming).';
  return `Add ${patch.label} (${patchMaterial(ctx, patch)}) right sides together; sew on the red line.${strips} ${pressWords(pressOf(pressing, step), patch.label, earlier)}${trim}`;
}
