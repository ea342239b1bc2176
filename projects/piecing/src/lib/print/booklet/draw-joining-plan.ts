import type { Point } from '../../document/index';
import { polygonBounds, polygonCentroid } from '../../geometry/index';
import type { ResolvedJoiningPlan, ResolvedJoinStep } from '../../joining/index';
import { drawArrow } from '../draw-template';
import type { SheetFlow } from '../sheet-flow';
import type { BookletContext } from './booklet-context';
import type { BookletWriter } from './booklet-writer';
import { DIAGRAM_STYLES, drawShape, fitDiagram, type DiagramFit } from './diagram';
import { sectionCopyOutlines } from './finished-size';

const COLUMNS = 4;
const DIAGRAM_IN = 1.7;
const CAPTION_PT = 8;
const LINE_IN = (CAPTION_PT * 1.3) / 72;
const NUMBER_IN = 0.2;
const PART_A = '#c9d7ea';
const PART_B = '#f0d3b5';

/**
 * The joining plan (docs/design-notes.md#joining-plan) as numbered diagrams of the block seen from the
 * front: the two parts of each join shaded, the seam in red, matching marks as dots, arrows for the
 * press. Without a resolved plan, the sections are listed from the centre outward in words.
 */
export function drawJoiningPlan(ctx: BookletContext, writer: BookletWriter, plan: ResolvedJoiningPlan | null): void {
  const flow = writer.part('Joining the sections');
  flow.heading('Joining the sections');
  flow.paragraph(
    'Join trimmed sections right sides together, pinning at the ends of each seam and at every matching mark first. Sew on the sewing lines of the foundations. ' +
      'Curved seams: match the marks, pin, and ease the fullness as you sew. Diagrams show the block from the front; red is the seam, arrows show the press.',
    8.5,
  );
  if (!plan) {
    drawPlainList(ctx, flow);
    return;
  }
  if (plan.isDefault) flow.paragraph('The designer set no joining order: this is the usual order, ring copies into rings, then from the centre outward.', 8);
  drawSteps(ctx, flow, plan.steps);
  // Units named as in the captions: a long unit by the step that made it, so a check stays a few lines at any size.
  for (const problem of plan.problems) flow.paragraph(`Check: ${unitsNamed(problem.message)}`, 8.5, true);
}

/** Above this many section copies a join diagram shows the seam's neighbourhood, not the whole block. */
export const WHOLE_BLOCK_DIAGRAM_MAX = 48;

interface Outline {
  sectionId: string;
  ring: Point[];
  bounds: { minX: number; minY: number; maxX: number; maxY: number };
}

function drawSteps(ctx: BookletContext, flow: SheetFlow, steps: readonly ResolvedJoinStep[]): void {
  const outlines = new Map(ctx.document.sections.map((s) => [s.id, sectionCopyOutlines(s)]));
  const copies: Outline[] = [...outlines].flatMap(([sectionId, rings]) => rings.map((ring) => ({ sectionId, ring, bounds: polygonBounds(ring) })));
  const all = copies.flatMap((c) => c.ring);
  const block = polygonBounds(all);
  const zoomed = copies.length > WHOLE_BLOCK_DIAGRAM_MAX;
  // Each section's bounds over all its copies, so a late step's view does not walk every outline of its large unit.
  const sectionBounds = new Map([...outlines].map(([id, rings]) => [id, polygonBounds(rings.flat())]));
  const cellW = flow.width / COLUMNS;
  const texts = steps.map((s) => ctx.pen.wrap(captionOf(s), cellW - 0.15, CAPTION_PT));
  for (let row = 0; row * COLUMNS < steps.length; row++) {
    const items = steps.slice(row * COLUMNS, row * COLUMNS + COLUMNS);
    const lines = Math.max(...items.map((_, c) => texts[row * COLUMNS + c].length));
    const top = flow.block(DIAGRAM_IN + 0.1 + lines * LINE_IN + 0.15);
    items.forEach((step, c) => {
      // The step number sits above its diagram, so a diagram filling its box never covers it.
      const box = { x: top.x + c * cellW + 0.05, y: top.y + NUMBER_IN, width: cellW - 0.1, height: DIAGRAM_IN - NUMBER_IN };
      const view = zoomed ? seamView(step, sectionBounds) : null;
      const fit = view ? fitDiagram(corners(view), box, false) : fitDiagram(all, box, false);
      // A large block: only the copies near the seam, clipped to the diagram, so each diagram costs the same at any size.
      const shown = view ? copies.filter((o) => overlapsBox(o.bounds, view)) : copies;
      const inA = new Set(step.partA.sectionIds);
      const inB = new Set(step.partB.sectionIds);
      const draw = () => {
        for (const { sectionId: id, ring } of shown) {
          const fill = step.kind === 'ring' ? (inA.has(id) ? PART_A : null) : inA.has(id) ? PART_A : inB.has(id) ? PART_B : null;
          drawShape(ctx.pen, ring.map(fit.map), fill, DIAGRAM_STYLES.faint);
        }
        ctx.pen.segments(step.seam.paths.flatMap((path) => pathSegments(path.map(fit.map))), DIAGRAM_STYLES.sewLine);
        for (const m of step.marks) ctx.pen.fillPolygon(dot(fit.map(m), 0.028), '#000000');
        drawPress(ctx, fit, step, shown);
      };
      if (view) {
        ctx.pen.clipped(box, draw);
        drawLocator(ctx, box, block, view);
      } else draw();
      ctx.pen.text(String(step.number), { x: box.x + 0.02, y: top.y + 0.15 }, { sizePt: 11, bold: true });
      texts[row * COLUMNS + c].forEach((line, k) =>
        ctx.pen.text(line, { x: box.x + 0.02, y: top.y + DIAGRAM_IN + 0.1 + LINE_IN * (k + 0.8) }, { sizePt: CAPTION_PT, bold: k === 0 }),
      );
    });
  }
}

type Bounds = { minX: number; minY: number; maxX: number; maxY: number };

/** The seam and the part joined on, with as much again around them (a square, so the diagram stays in proportion). */
function seamView(step: ResolvedJoinStep, sectionBounds: Map<string, Bounds>): Bounds {
  // The bounds of the seam's points and part B's outlines (of part A's when there are none): min and max
  // taken over each section's bounds are those taken over all their points.
  const b = polygonBounds(step.seam.paths.flat());
  let any = step.seam.paths.some((path) => path.length > 0);
  const widen = (ids: readonly string[]) => {
    for (const id of ids) {
      const s = sectionBounds.get(id);
      if (!s || s.minX > s.maxX) continue;
      any = true;
      b.minX = Math.min(b.minX, s.minX);
      b.minY = Math.min(b.minY, s.minY);
      b.maxX = Math.max(b.maxX, s.maxX);
      b.maxY = Math.max(b.maxY, s.maxY);
    }
  };
  widen(step.partB.sectionIds);
  if (!any) widen(step.partA.sectionIds);
  const size = Math.max(b.maxX - b.minX, b.maxY - b.minY, 1e-3) * 2;
  const cx = (b.minX + b.maxX) / 2;
  const cy = (b.minY + b.maxY) / 2;
  return { minX: cx - size / 2, minY: cy - size / 2, maxX: cx + size / 2, maxY: cy + size / 2 };
}

function corners(b: Bounds): Point[] {
  return [{ x: b.minX, y: b.minY }, { x: b.maxX, y: b.maxY }];
}

function overlapsBox(a: Bounds, b: Bounds): boolean {
  return a.minX <= b.maxX && b.minX <= a.maxX && a.minY <= b.maxY && b.minY <= a.maxY;
}

/** A small map in the diagram's corner: the whole block, and the part of it the diagram shows. */
function drawLocator(ctx: BookletContext, box: { x: number; y: number; width: number; height: number }, block: Bounds, view: Bounds): void {
  const size = 0.32;
  const area = { x: box.x + box.width - size - 0.02, y: box.y + box.height - size - 0.02, width: size, height: size };
  const fit = fitDiagram(corners(block), area, false, 0.02);
  const a = fit.map({ x: Math.max(view.minX, block.minX), y: Math.max(view.minY, block.minY) });
  const b = fit.map({ x: Math.min(view.maxX, block.maxX), y: Math.min(view.maxY, block.maxY) });
  const whole = { a: fit.map({ x: block.minX, y: block.minY }), b: fit.map({ x: block.maxX, y: block.maxY }) };
  ctx.pen.rect({ x: whole.a.x, y: whole.a.y, width: whole.b.x - whole.a.x, height: whole.b.y - whole.a.y }, { widthPt: 0.4, colour: '#666666' }, '#ffffff');
  ctx.pen.rect({ x: a.x, y: a.y, width: Math.max(0.01, b.x - a.x), height: Math.max(0.01, b.y - a.y) }, { widthPt: 0.8, colour: '#b3261e' });
}

/** The words under a join diagram: the step, the press, the marks. */
export function captionOf(step: ResolvedJoinStep): string {
  const ring = step.kind === 'ring' && step.ringCount ? ` (${step.ringCount} seams; the last closes the ring)` : '';
  const marks = step.marks.length > 0 ? ` Match the ${step.marks.length} matching marks.` : '';
  const curved = step.seam.kind === 'curved' ? ' Curved seam.' : '';
  return `${step.number}. ${unitsNamed(step.label)}${ring}. ${unitsNamed(step.pressLabel)}.${curved}${marks}`.replace(/\.\./g, '.');
}

/** Most section labels a unit is named by in a caption; a larger unit is named by its step instead. */
export const UNIT_LABELS_MAX = 8;

/**
 * "unit 12 (A, B, C, …)" with more than {@link UNIT_LABELS_MAX} sections becomes "unit 12 (made in step 12, 13 sections)":
 * the step that made it lists how, so every section stays traceable and a caption stays a few lines long at any size.
 */
export function unitsNamed(text: string): string {
  // One pass over the text (labels of late units list hundreds of sections): each "unit n (" is followed
  // to its ")" counting the ", " between; one with a "(" before its ")" is left as it is.
  const start = /unit (\d+) \(/g;
  let out = '';
  let copied = 0;
  for (let m = start.exec(text); m; m = start.exec(text)) {
    let count = 1;
    let j = m.index + m[0].length;
    for (; j < text.length; j++) {
      const c = text.charCodeAt(j);
      if (c === 0x28 || c === 0x29) break;
      if (c === 0x2c && text.charCodeAt(j + 1) === 0x20) count++;
    }
    if (text.charCodeAt(j) !== 0x29) {
      start.lastIndex = m.index + 1;
      continue;
    }
    if (count > UNIT_LABELS_MAX) {
      out += `${text.slice(copied, m.index)}unit ${m[1]} (made in step ${m[1]}, ${count} sections)`;
      copied = j + 1;
    }
    start.lastIndex = j + 1;
  }
  return copied === 0 ? text : out + text.slice(copied);
}

function pathSegments(points: readonly Point[]): Array<{ a: Point; b: Point }> {
  const out: Array<{ a: Point; b: Point }> = [];
  for (let i = 1; i < points.length; i++) out.push({ a: points[i - 1], b: points[i] });
  return out;
}

function dot(c: Point, r: number): Point[] {
  return Array.from({ length: 10 }, (_, i) => ({ x: c.x + r * Math.cos((i * Math.PI) / 5), y: c.y + r * Math.sin((i * Math.PI) / 5) }));
}

/** Arrows across the seam toward the part it is pressed to; both ways for open; round the ring for a ring. */
function drawPress(ctx: BookletContext, fit: DiagramFit, step: ResolvedJoinStep, shown: readonly Outline[]): void {
  const press = step.press;
  for (const path of step.seam.paths.slice(0, step.kind === 'ring' ? step.seam.paths.length : 1)) {
    if (path.length < 2) continue;
    const i = Math.floor((path.length - 1) / 2);
    const a = fit.map(path[i]);
    const b = fit.map(path[i + 1]);
    const mid = { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 };
    const len = Math.hypot(b.x - a.x, b.y - a.y) || 1;
    const n = { x: -(b.y - a.y) / len, y: (b.x - a.x) / len };
    const arrow = (d: Point) => drawArrow(ctx.pen, { x: mid.x + d.x * 0.1, y: mid.y + d.y * 0.1 }, d, 0.17);
    if ('open' in press) {
      arrow(n);
      arrow({ x: -n.x, y: -n.y });
      continue;
    }
    let target: Point;
    if ('ring' in press) {
      // Clockwise on the page (y down): the document's positive turn.
      const centre = ctx.document.sections.find((s) => s.id === step.partA.sectionIds[0])?.ringRepeat?.centre ?? path[i];
      const c = fit.map(centre);
      const t = { x: -(mid.y - c.y), y: mid.x - c.x };
      const s = press.ring === 'clockwise' ? 1 : -1;
      target = { x: mid.x + s * t.x, y: mid.y + s * t.y };
    } else {
      const part = press.toward === step.partA.id ? step.partA : step.partB;
      const ids = new Set(part.sectionIds);
      const rings = shown.filter((o) => ids.has(o.sectionId)).map((o) => o.ring);
      // The part's copy nearest the seam says which side it is on.
      let best: Point | null = null;
      let bestD = Infinity;
      for (const ring of rings) {
        const c = fit.map(polygonCentroid(ring));
        const d = Math.hypot(c.x - mid.x, c.y - mid.y);
        if (d < bestD) {
          bestD = d;
          best = c;
        }
      }
      target = best ?? { x: mid.x + n.x, y: mid.y + n.y };
    }
    const side = (target.x - mid.x) * n.x + (target.y - mid.y) * n.y >= 0 ? n : { x: -n.x, y: -n.y };
    arrow(side);
  }
}

/** Without a plan: the sections from the centre outward, ring copies into rings first. */
function drawPlainList(ctx: BookletContext, flow: SheetFlow): void {
  const all = ctx.document.sections.flatMap((s) => sectionCopyOutlines(s).flat());
  if (all.length === 0) return;
  const xs = all.map((p) => p.x);
  const ys = all.map((p) => p.y);
  const centre = { x: (Math.min(...xs) + Math.max(...xs)) / 2, y: (Math.min(...ys) + Math.max(...ys)) / 2 };
  const order = [...ctx.document.sections].sort((a, b) => distance(a.id) - distance(b.id));
  function distance(id: string): number {
    const s = ctx.document.sections.find((x) => x.id === id)!;
    const rings = sectionCopyOutlines(s);
    return Math.min(...rings.map((r) => Math.hypot(polygonCentroid(r).x - centre.x, polygonCentroid(r).y - centre.y)));
  }
  let n = 1;
  for (const s of order) {
    if (s.ringRepeat) flow.paragraph(`${n++}. Join the ${s.ringRepeat.count} copies of ${s.label} into a ring (${s.ringRepeat.count} seams; the last closes the ring).`, 9);
  }
  flow.paragraph(`${n}. Join the sections and rings from the centre outward: ${order.map((s) => (s.ringRepeat ? `the ${s.label} ring` : s.label)).join(', then ')}.`, 9);
}
