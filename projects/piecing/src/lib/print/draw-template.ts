import type { Point } from '../document/index';
import { distanceToSegment, polygonBounds } from '../geometry/index';
import { applyAffine, applyLinear } from './affine';
import { distanceToRing, insideRing } from './layout-geometry';
import type { SheetPlacement } from './layout-types';
import type { PdfPen, StrokeStyle } from './pdf-pen';
import type { PrintTemplate } from './template-model';

/** Line styles of a template; the cover sheet's legend describes them. */
export const TEMPLATE_STYLES = {
  sewing: { widthPt: 0.9, colour: '#000000' },
  seam: { widthPt: 0.9, colour: '#000000' },
  cutting: { widthPt: 0.5, dashPt: [6, 3], colour: '#000000' },
  guide: { widthPt: 0.6, dashPt: [1.5, 1.5], colour: '#1d5fa6' },
  matching: { widthPt: 0.8, colour: '#000000' },
  alignment: { widthPt: 0.4, colour: '#000000' },
  join: { widthPt: 0.4, dashPt: [2, 2], colour: '#555555' },
} satisfies Record<string, StrokeStyle>;

/** Draws one print of a template (or one tile of it) where the layout placed it. */
export function drawPlacement(pen: PdfPen, placement: SheetPlacement, template: PrintTemplate): void {
  const map = (p: Point) => applyAffine(placement.transform, p);
  const ring = (points: readonly Point[]) => points.map(map);
  const drawBody = () => {
    pen.polyline(ring(template.cuttingLine), true, TEMPLATE_STYLES.cutting);
    pen.polyline(ring(template.sewingLine), true, TEMPLATE_STYLES.sewing);
    pen.segments(template.seams.map((s) => ({ a: map(s.a), b: map(s.b) })), TEMPLATE_STYLES.seam);
    pen.segments(template.guideLines.map((s) => ({ a: map(s.a), b: map(s.b) })), TEMPLATE_STYLES.guide);
    pen.segments(
      template.matchingMarks.map((m) => {
        const at = map(m.at);
        const n = unit(applyLinear(placement.transform, m.normal));
        return { a: { x: at.x - n.x * 0.12, y: at.y - n.y * 0.12 }, b: { x: at.x + n.x * 0.12, y: at.y + n.y * 0.12 } };
      }),
      TEMPLATE_STYLES.matching,
    );
    for (const patch of template.patches) {
      const at = map(patch.labelAt);
      const sub = patch.stripSetName ?? patch.fabricName;
      pen.text(patch.label, { x: at.x, y: at.y }, { sizePt: 8, bold: true, align: 'center', baseline: sub ? 'bottom' : 'middle' });
      if (sub) pen.text(sub, { x: at.x, y: at.y + 0.01 }, { sizePt: 6, align: 'center', baseline: 'top' });
    }
    drawOrientation(pen, placement, template);
    if (placement.tile) drawTileMarks(pen, placement);
  };
  if (placement.tile) pen.clipped(placement.rect, drawBody);
  else drawBody();
  drawCaption(pen, placement, template);
}

function drawTileMarks(pen: PdfPen, placement: SheetPlacement): void {
  const tile = placement.tile!;
  for (const m of tile.alignmentMarks) {
    pen.circle(m, 0.07, TEMPLATE_STYLES.alignment);
    pen.segments(
      [
        { a: { x: m.x - 0.15, y: m.y }, b: { x: m.x + 0.15, y: m.y } },
        { a: { x: m.x, y: m.y - 0.15 }, b: { x: m.x, y: m.y + 0.15 } },
      ],
      TEMPLATE_STYLES.alignment,
    );
  }
  for (const line of tile.joinLines) {
    pen.segments([line], TEMPLATE_STYLES.join);
    const vertical = Math.abs(line.b.x - line.a.x) < Math.abs(line.b.y - line.a.y);
    const mid = { x: (line.a.x + line.b.x) / 2, y: (line.a.y + line.b.y) / 2 };
    pen.text(`edge of ${line.neighbour}`, vertical ? { x: mid.x - 0.03, y: mid.y } : { x: mid.x, y: mid.y - 0.03 }, {
      sizePt: 5,
      colour: '#555555',
      align: 'center',
      ...(vertical ? { angleDeg: 90 } : {}),
    });
  }
}

/** The caption text: section, copy (or the two nested copies) and, for tiles, the tile key. */
export function captionText(placement: SheetPlacement, template: PrintTemplate): string {
  const parts = [`Section ${template.sectionLabel}`];
  if (placement.nestedWith !== undefined) {
    const [a, b] = [placement.copy, placement.nestedWith].sort((p, q) => p - q);
    parts.push(`copies ${a} and ${b} of ${placement.copies}`);
  } else if (placement.copies > 1) {
    parts.push(`copy ${placement.copy} of ${placement.copies}`);
  }
  if (placement.tile) parts.push(`row ${placement.tile.row}, column ${placement.tile.column} of ${placement.tile.rows} × ${placement.tile.columns}`);
  return parts.join(' · ');
}

function drawCaption(pen: PdfPen, placement: SheetPlacement, template: PrintTemplate): void {
  if (!placement.caption) return;
  const { rect, vertical } = placement.caption;
  const size = 6.5;
  const length = vertical ? rect.height : rect.width;
  const full = captionText(placement, template);
  const text = pen.textWidth(full, size, true) <= length ? full : fitCaption(pen, full, length, size);
  if (vertical) pen.text(text, { x: rect.x + rect.width * 0.72, y: rect.y + rect.height }, { sizePt: size, bold: true, angleDeg: 90 });
  else pen.text(text, { x: rect.x, y: rect.y + rect.height * 0.72 }, { sizePt: size, bold: true });
}

function fitCaption(pen: PdfPen, text: string, widthIn: number, sizePt: number): string {
  let s = text;
  while (s.length > 1 && pen.textWidth(`${s}…`, sizePt, true) > widthIn) s = s.slice(0, -1);
  return `${s}…`;
}

/**
 * The orientation arrow inside the template: at the candidate spot (beside a patch label) farthest
 * from the outline and from every label, pointing to the top of the block or the centre.
 */
function drawOrientation(pen: PdfPen, placement: SheetPlacement, template: PrintTemplate): void {
  const outline = template.sewingLine.map((p) => applyAffine(placement.transform, p));
  const labels = template.patches.map((p) => applyAffine(placement.transform, p.labelAt));
  const candidates: Point[] = [];
  for (const at of labels.slice(0, 40)) {
    for (const [dx, dy] of [[0, 0.36], [0, -0.42], [0.5, -0.1], [-0.5, -0.1], [0.6, 0.3], [-0.6, 0.3], [0, 0.7], [0, -0.75], [0.9, 0], [-0.9, 0]]) candidates.push({ x: at.x + dx, y: at.y + dy });
  }
  const seams = template.seams.map((seg) => [applyAffine(placement.transform, seg.a), applyAffine(placement.transform, seg.b)]);
  const guides = template.guideLines.map((seg) => [applyAffine(placement.transform, seg.a), applyAffine(placement.transform, seg.b)]);
  const lines = [...seams, ...guides];
  const tagHalf = placement.tile ? 0 : 0.42;
  let best: Point | null = null;
  let bestScore = 0.1;
  for (const c of candidates) {
    if (!insideRing(c, outline)) continue;
    // Arrow point, and the tag below it (its middle and both ends), kept off the outline, seams and labels.
    const probes = [c, { x: c.x, y: c.y - 0.13 }, { x: c.x, y: c.y + 0.25 }, { x: c.x - tagHalf, y: c.y + 0.25 }, { x: c.x + tagHalf, y: c.y + 0.25 }];
    // The score only falls as probes and obstacles are added: a candidate stops being scored as soon as
    // it cannot beat the best so far (the same spot wins as when every distance is taken).
    let score = Infinity;
    for (const p of probes) {
      if (!insideRing(p, outline)) {
        score = -1;
        break;
      }
      score = Math.min(score, distanceToRing(p, outline) - 0.04);
      for (let i = 0; i < lines.length && score > bestScore; i++) score = Math.min(score, distanceToSegment(p, lines[i][0], lines[i][1]) - 0.04);
      for (let i = 0; i < labels.length && score > bestScore; i++) score = Math.min(score, Math.hypot((p.x - labels[i].x) * 0.7, (p.y - labels[i].y) * 1.6) - 0.16);
      if (score <= bestScore) break;
    }
    if (score > bestScore) {
      bestScore = score;
      best = c;
    }
  }
  if (!best) {
    const box = polygonBounds(outline);
    best = { x: (box.minX + box.maxX) / 2, y: (box.minY + box.maxY) / 2 };
  }
  const d = unit(applyLinear(placement.transform, template.orientation.direction));
  drawArrow(pen, best, d, 0.26);
  const word = template.orientation.towards === 'centre' ? 'centre' : 'top';
  pen.text(word, { x: best.x + 0.1 + Math.abs(d.x) * 0.06, y: best.y }, { sizePt: 5, baseline: 'middle', colour: '#333333' });
  if (!placement.tile) {
    // Whole templates have no caption strip: section and copy are written beside the arrow.
    const tag = placement.copies > 1 ? `${template.sectionLabel} · copy ${placement.copy} of ${placement.copies}` : `Section ${template.sectionLabel}`;
    pen.text(tag, { x: best.x, y: best.y + 0.25 }, { sizePt: 6, bold: true, align: 'center', baseline: 'middle' });
  }
}


/** An arrow of a length centred on a point, pointing along a unit direction. */
export function drawArrow(pen: PdfPen, centre: Point, d: Point, lengthIn: number): void {
  const tip = { x: centre.x + (d.x * lengthIn) / 2, y: centre.y + (d.y * lengthIn) / 2 };
  const tail = { x: centre.x - (d.x * lengthIn) / 2, y: centre.y - (d.y * lengthIn) / 2 };
  const head = lengthIn * 0.35;
  const side = { x: -d.y, y: d.x };
  const back = { x: tip.x - d.x * head, y: tip.y - d.y * head };
  pen.segments([{ a: tail, b: tip }], { widthPt: 0.7 });
  pen.fillPolygon(
    [tip, { x: back.x + side.x * head * 0.5, y: back.y + side.y * head * 0.5 }, { x: back.x - side.x * head * 0.5, y: back.y - side.y * head * 0.5 }],
    '#000000',
  );
}

function unit(v: Point): Point {
  const len = Math.hypot(v.x, v.y) || 1;
  return { x: v.x / len, y: v.y / len };
}
