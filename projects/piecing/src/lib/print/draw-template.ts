import type { Point } from '../document/index';
import { applyAffine, applyLinear } from './affine';
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
      const sub = patch.stripSetName ? `strip set${patch.stripSetName === 'strip set' ? '' : ` ${patch.stripSetName}`}` : patch.fabricName;
      pen.text(patch.label, { x: at.x, y: at.y }, { sizePt: 8, bold: true, align: 'center', baseline: sub ? 'bottom' : 'middle' });
      if (sub) pen.text(sub, { x: at.x, y: at.y + 0.01 }, { sizePt: 6, align: 'center', baseline: 'top' });
    }
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

/** Section label, copy tag, orientation arrow and (for tiles) the tile key, in the caption strip. */
function drawCaption(pen: PdfPen, placement: SheetPlacement, template: PrintTemplate): void {
  const { rect, vertical } = placement.caption;
  const parts = [`Section ${template.sectionLabel}`];
  if (placement.copies > 1) parts.push(`copy ${placement.copy} of ${placement.copies}`);
  if (placement.tile) parts.push(`row ${placement.tile.row}, column ${placement.tile.column} of ${placement.tile.rows} × ${placement.tile.columns}`);
  const text = parts.join(' · ');
  const arrowText = template.orientation.towards;
  const size = 6.5;
  const length = vertical ? rect.height : rect.width;
  const textW = pen.textWidth(text, size, true);
  const arrowW = 0.22 + pen.textWidth(arrowText, size);
  const showArrow = textW + 0.12 + arrowW <= length;
  const shown = showArrow || textW <= length ? text : `${template.sectionLabel}${placement.copies > 1 ? ` ${placement.copy}/${placement.copies}` : ''}`;
  if (vertical) {
    pen.text(shown, { x: rect.x + rect.width * 0.72, y: rect.y + rect.height }, { sizePt: size, bold: true, angleDeg: 90 });
  } else {
    pen.text(shown, { x: rect.x, y: rect.y + rect.height * 0.72 }, { sizePt: size, bold: true });
  }
  if (!showArrow) return;
  const d = unit(applyLinear(placement.transform, template.orientation.direction));
  const along = textW + 0.12 + 0.09;
  const centre = vertical
    ? { x: rect.x + rect.width / 2, y: rect.y + rect.height - along }
    : { x: rect.x + along, y: rect.y + rect.height / 2 };
  drawArrow(pen, centre, d, 0.16);
  const labelAt = vertical
    ? { x: rect.x + rect.width * 0.72, y: centre.y - 0.13 }
    : { x: centre.x + 0.13, y: rect.y + rect.height * 0.72 };
  pen.text(arrowText, labelAt, { sizePt: size, ...(vertical ? { angleDeg: 90 } : {}) });
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
