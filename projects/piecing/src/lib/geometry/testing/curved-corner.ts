import { exampleJson } from '../../../../../../tests/fixtures/documents';
import type { PatternDocument } from '../../document/pattern-schema';
import { readPatternDocument } from '../../document/parse-pattern';

/** The point at `angleDeg` on the circle of radius `radiusIn` about the origin. */
export function onRing(radiusIn: number, angleDeg: number): { x: number; y: number } {
  const a = (angleDeg * Math.PI) / 180;
  return { x: radiusIn * Math.cos(a), y: radiusIn * Math.sin(a) };
}

/**
 * The documented example docs/examples/corner-following-a-ring.json, an 8 in. block: section A a
 * quarter circle of radius 5 about the top-left corner, section B the rest of the block, a straight
 * section whose edge 4 (from (0, 5) to (5, 0)) follows A's arc, curving into B. B's seams run from
 * the far corner to the curve at 45° and from the right side to the curve at 30°; its patches are
 * numbered 1 (lower left), 2, 3 (upper right).
 */
export function curvedCornerDocument(): PatternDocument {
  return readPatternDocument(exampleJson('corner-following-a-ring'));
}
