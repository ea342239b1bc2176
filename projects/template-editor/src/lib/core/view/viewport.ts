import type { Bounds, Point } from '@seamwright/piecing';

/**
 * The board's view: `scale` screen pixels per inch and the screen position of the document origin.
 * Mirrored views flip x about the vertical centre line of the drawing area (`mirrorWidthIn`), as the
 * printed templates are seen from the back.
 */
export interface Viewport {
  scale: number;
  originX: number;
  originY: number;
  mirrored: boolean;
  mirrorWidthIn: number;
}

/** Zoom limits, pixels per inch. */
export const MIN_SCALE = 2;
export const MAX_SCALE = 2000;

/** Screen position of a document point. */
export function toScreen(v: Viewport, p: Point): Point {
  const x = v.mirrored ? v.mirrorWidthIn - p.x : p.x;
  return { x: v.originX + x * v.scale, y: v.originY + p.y * v.scale };
}

/** Document point under a screen position. */
export function toDocument(v: Viewport, s: Point): Point {
  const x = (s.x - v.originX) / v.scale;
  return { x: v.mirrored ? v.mirrorWidthIn - x : x, y: (s.y - v.originY) / v.scale };
}

/** Zooms by `factor` keeping the document point under `screen` where it is (zoom to the cursor). */
export function zoomAt(v: Viewport, screen: Point, factor: number): Viewport {
  const scale = Math.min(MAX_SCALE, Math.max(MIN_SCALE, v.scale * factor));
  const k = scale / v.scale;
  return { ...v, scale, originX: screen.x - (screen.x - v.originX) * k, originY: screen.y - (screen.y - v.originY) * k };
}

/** Moves the view by screen pixels. */
export function panBy(v: Viewport, dx: number, dy: number): Viewport {
  return { ...v, originX: v.originX + dx, originY: v.originY + dy };
}

/** The view that shows `bounds` (document inches) whole and centred in a widthPx × heightPx screen. */
export function fitBounds(v: Viewport, bounds: Bounds, widthPx: number, heightPx: number, marginPx = 40): Viewport {
  const w = Math.max(1e-6, bounds.maxX - bounds.minX);
  const h = Math.max(1e-6, bounds.maxY - bounds.minY);
  const scale = Math.min(MAX_SCALE, Math.max(MIN_SCALE, Math.min((widthPx - 2 * marginPx) / w, (heightPx - 2 * marginPx) / h)));
  const cx = (bounds.minX + bounds.maxX) / 2;
  const cy = (bounds.minY + bounds.maxY) / 2;
  const sx = v.mirrored ? v.mirrorWidthIn - cx : cx;
  return { ...v, scale, originX: widthPx / 2 - sx * scale, originY: heightPx / 2 - cy * scale };
}
