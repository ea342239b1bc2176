import type { Point } from '../../document/index';
import type { SheetPlacement } from '../layout-types';
import { clipRingToRect } from '../layout-geometry';
import type { RectIn } from '../paper';
import { intersectRects } from '../prepare-template';

/**
 * What a tile prints (it is drawn clipped to its box): the part of the cutting line inside the box,
 * the alignment marks (circle and cross, 0.15 in. each way) and the join lines with their labels.
 */
export function tileDrawing(p: SheetPlacement, cut: Point[]): Point[][] {
  const rings: Point[][] = [];
  const body = clipRingToRect(cut, p.rect);
  if (body.length >= 3) rings.push(body);
  // Everything of a tile is drawn clipped to its box.
  const clipped = (r: RectIn) => {
    const part = intersectRects(r, p.rect);
    if (part) rings.push(rectRing(part));
  };
  for (const m of p.tile!.alignmentMarks) clipped({ x: m.x - 0.15, y: m.y - 0.15, width: 0.3, height: 0.3 });
  for (const line of p.tile!.joinLines) {
    rings.push([line.a, line.b]);
    const vertical = Math.abs(line.b.x - line.a.x) < Math.abs(line.b.y - line.a.y);
    const mid = { x: (line.a.x + line.b.x) / 2, y: (line.a.y + line.b.y) / 2 };
    // "edge of row r, column c" in 5 pt (about 0.8 in. long, 0.07 in. high), just beside the line's middle.
    clipped(vertical ? { x: mid.x - 0.1, y: mid.y - 0.4, width: 0.1, height: 0.8 } : { x: mid.x - 0.4, y: mid.y - 0.1, width: 0.8, height: 0.1 });
  }
  return rings;
}


function rectRing(r: RectIn): Point[] {
  return [{ x: r.x, y: r.y }, { x: r.x + r.width, y: r.y }, { x: r.x + r.width, y: r.y + r.height }, { x: r.x, y: r.y + r.height }];
}
