import type { PatternDocument } from '../document/pattern-schema';
import { polygonBounds, ringRepeatTransforms, rotatePoint } from '../geometry/index';
import { sectionSewingLine } from '../fabrication/seam-allowance/section-seam-allowance';

/** The block as drawn: the bounding box of every section's sewing line, ring copies included (inches). */
export interface BlockBounds {
  x: number;
  y: number;
  width: number;
  height: number;
}

/**
 * The bounds of the drawn block (design §11): the bounding box of all sections' sewing lines, ring-repeat
 * copies turned into place. A document without sections falls back to its drawing area.
 */
export function blockDrawingBounds(doc: Pick<PatternDocument, 'sections' | 'canvas'>): BlockBounds {
  const points = doc.sections.flatMap((section) => {
    const line = sectionSewingLine(section);
    return ringRepeatTransforms(section).flatMap((t) => (t.angleRad === 0 ? line : line.map((p) => rotatePoint(p, t.centre, t.angleRad))));
  });
  if (points.length === 0) return { x: 0, y: 0, width: doc.canvas.widthIn, height: doc.canvas.heightIn };
  const b = polygonBounds(points);
  return { x: b.minX, y: b.minY, width: b.maxX - b.minX, height: b.maxY - b.minY };
}

/**
 * The finished block size a quilt layout uses when it sets none (design §11): the bounding box of all
 * sections' sewing lines, ring copies included, rounded to 1/1000 in. (the flattening of arcs leaves noise).
 */
export function defaultBlockSizeIn(doc: Pick<PatternDocument, 'sections' | 'canvas'>): { width: number; height: number } {
  const b = blockDrawingBounds(doc);
  return { width: Math.round(b.width * 1000) / 1000, height: Math.round(b.height * 1000) / 1000 };
}
