import type { PatternDocument, Point, Section } from '../../document/index';
import { polygonBounds, ringRepeatTransforms, rotatePoint } from '../../geometry/index';
import { sectionSewingLine } from '../../fabrication/index';

/** The finished block: the bounding box of every section's sewing line, ring copies included. */
export interface FinishedBlockSize {
  widthIn: number;
  heightIn: number;
  minX: number;
  minY: number;
}

/** The sewing lines of every copy of a section in the block (ring-repeat copies turned into place). */
export function sectionCopyOutlines(section: Section): Point[][] {
  const line = sectionSewingLine(section);
  return ringRepeatTransforms(section).map((t) => (t.angleRad === 0 ? line : line.map((p) => rotatePoint(p, t.centre, t.angleRad))));
}

/**
 * The finished size of the block: the sections' bounding box, not the drawing area (a pattern drawn
 * on a 30 in. canvas may finish at 26 in.). Null when the document has no section.
 */
export function finishedBlockSize(document: Pick<PatternDocument, 'sections'>): FinishedBlockSize | null {
  const points = document.sections.flatMap((s) => sectionCopyOutlines(s).flat());
  if (points.length === 0) return null;
  const b = polygonBounds(points);
  return { widthIn: b.maxX - b.minX, heightIn: b.maxY - b.minY, minX: b.minX, minY: b.minY };
}
