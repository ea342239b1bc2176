import type { Point, StripSet } from '../../document/index';
import { polygonBounds } from '../../geometry/index';
import { stripSetBands } from '../../fabrication/index';
import type { RectIn } from '../paper';
import type { PdfPen, StrokeStyle } from '../pdf-pen';

/*
 * Small, not-to-scale diagrams of the booklet: shapes from the drawing plane fitted into a box on the
 * sheet. Line widths stay off the template styles (0.9 pt sewing, 0.5 pt dashed cutting) so a diagram
 * is never mistaken for a template.
 */

/** Booklet diagram strokes. */
export const DIAGRAM_STYLES = {
  outline: { widthPt: 0.6, colour: '#333333' },
  faint: { widthPt: 0.4, colour: '#9a9a9a' },
  highlight: { widthPt: 1.4, colour: '#000000' },
  sewLine: { widthPt: 1.8, colour: '#b3261e' },
  guide: { widthPt: 0.7, dashPt: [2, 1.5], colour: '#1d5fa6' },
  centre: { widthPt: 0.7, dashPt: [4, 1.5, 1, 1.5], colour: '#1d5fa6' },
} satisfies Record<string, StrokeStyle>;

/** Maps drawing-plane points into a box on the sheet, keeping proportions. */
export interface DiagramFit {
  map: (p: Point) => Point;
  /** Sheet inches per drawing inch. */
  scale: number;
}

/** A fit into a box, with where it puts the drawing's corner (left, or right when mirrored; top): `map(p)` is that plus {@link scaledRing}'s point. */
export interface BoxFit extends DiagramFit {
  x0: number;
  y0: number;
}

/**
 * Fits `points` into `box` with `padIn` to spare, centred; mirrored left to right when asked (the
 * printed side of a foundation is the back of the block).
 */
export function fitDiagram(points: readonly Point[], box: RectIn, mirrored = false, padIn = 0.06): BoxFit {
  return fitBounds(polygonBounds(points), box, mirrored, padIn);
}

/** {@link fitDiagram} for shapes whose bounds are known (one section's patches in each of its step diagrams). */
export function fitBounds(b: { minX: number; minY: number; maxX: number; maxY: number }, box: RectIn, mirrored = false, padIn = 0.06): BoxFit {
  const w = Math.max(1e-6, b.maxX - b.minX);
  const h = Math.max(1e-6, b.maxY - b.minY);
  const scale = Math.min((box.width - 2 * padIn) / w, (box.height - 2 * padIn) / h);
  const x0 = box.x + (box.width - w * scale) / 2;
  const y0 = box.y + (box.height - h * scale) / 2;
  return {
    scale,
    x0,
    y0,
    map: (p) => ({ x: mirrored ? x0 + (b.maxX - p.x) * scale : x0 + (p.x - b.minX) * scale, y: y0 + (p.y - b.minY) * scale }),
  };
}

/**
 * A ring as {@link fitBounds} with these bounds, scale and mirroring maps it, less the box's corner: for
 * shapes drawn in many boxes of one size, scaled once; `{ x: fit.x0 + o.x, y: fit.y0 + o.y }` is then
 * exactly `fit.map(p)` (the same operations in the same order).
 */
export function scaledRing(b: { minX: number; minY: number; maxX: number }, scale: number, mirrored: boolean, ring: readonly Point[]): Point[] {
  return ring.map((p) => ({ x: mirrored ? (b.maxX - p.x) * scale : (p.x - b.minX) * scale, y: (p.y - b.minY) * scale }));
}

/** {@link lighten}'s results by amount and colour: a booklet asks for the same few thousands of times. */
const lightened = new Map<number, Map<string, string>>();

/** A paler version of a colour (`amount` 0 … 1 towards white), so black text stays legible on it. */
export function lighten(hex: string, amount = 0.55): string {
  let byColour = lightened.get(amount);
  if (!byColour) lightened.set(amount, (byColour = new Map()));
  let paler = byColour.get(hex);
  if (paler === undefined) {
    if (byColour.size > 4096) byColour.clear();
    byColour.set(hex, (paler = mixHex(hex, amount)));
  }
  return paler;
}

function mixHex(hex: string, amount: number): string {
  const v = parseInt(hex.slice(1), 16);
  const r = mixTowardWhite((v >> 16) & 255, amount);
  const g = mixTowardWhite((v >> 8) & 255, amount);
  const b = mixTowardWhite(v & 255, amount);
  return `#${((r << 16) | (g << 8) | b).toString(16).padStart(6, '0')}`;
}

function mixTowardWhite(c: number, amount: number): number {
  return Math.round(c + (255 - c) * amount);
}

/** Fills a polygon (already on the sheet) and strokes its outline. */
export function drawShape(pen: PdfPen, ring: readonly Point[], fill: string | null, stroke: StrokeStyle | null): void {
  if (fill) pen.fillPolygon(ring, fill);
  if (stroke) pen.polyline(ring, true, stroke);
}

/**
 * Fills a strip-set patch with its strips (each clipped to the patch), coloured by `colourOf`. Falls
 * back to `fallback` when the set does not fit the patch.
 */
export function fillStripSetPatch(
  pen: PdfPen,
  fit: DiagramFit,
  polygon: readonly Point[],
  stripSet: StripSet,
  colourOf: (fabricId: string) => string,
  fallback: string,
): void {
  const ring = polygon.map(fit.map);
  const bands = stripSetBands(polygon, stripSet);
  if (bands.length === 0) {
    pen.fillPolygon(ring, fallback);
    return;
  }
  clipToRing(pen, ring, () => {
    for (const band of bands) pen.fillPolygon(band.polygon.map(fit.map), colourOf(band.fabricId));
  });
}

/** Runs `draw` clipped to a polygon on the sheet. */
export function clipToRing(pen: PdfPen, ring: readonly Point[], draw: () => void): void {
  pen.clippedToRing(ring, draw);
}

/** Middle of a segment and the unit normal pointing to the side of `towards`. */
export function normalTowards(a: Point, b: Point, towards: Point): { mid: Point; n: Point } {
  const mid = { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 };
  const len = Math.hypot(b.x - a.x, b.y - a.y) || 1;
  let n = { x: -(b.y - a.y) / len, y: (b.x - a.x) / len };
  if ((towards.x - mid.x) * n.x + (towards.y - mid.y) * n.y < 0) n = { x: -n.x, y: -n.y };
  return { mid, n };
}
