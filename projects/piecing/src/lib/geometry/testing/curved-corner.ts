import type { PatternDocument, Section } from '../../document/pattern-schema';
import { readPatternDocument } from '../../document/parse-pattern';

/** Bulge of a quarter circle turning back (from +y towards +x): −tan(90°/4). */
export const CONCAVE_QUARTER_BULGE = -Math.tan(Math.PI / 8);

/** The point at `angleDeg` on the circle of radius `radiusIn` about the origin. */
export function onRing(radiusIn: number, angleDeg: number): { x: number; y: number } {
  const a = (angleDeg * Math.PI) / 180;
  return { x: radiusIn * Math.cos(a), y: radiusIn * Math.sin(a) };
}

/**
 * An 8 in. block (as docs/examples/corner-following-a-ring.json): section A a quarter circle of radius 5
 * about the top-left corner, section B the rest of the block, a straight section whose edge 4 (from
 * (0, 5) to (5, 0)) follows A's arc, curving into B. B's seams run from the far corner to the curve at
 * 45° and from the right side to the curve at 30°.
 */
export function curvedCornerDocument(): PatternDocument {
  const corner: Partial<Section> = {
    id: 'corner',
    label: 'B',
    geometry: {
      kind: 'straight',
      vertices: [{ x: 5, y: 0 }, { x: 8, y: 0 }, { x: 8, y: 8 }, { x: 0, y: 8 }, { x: 0, y: 5 }],
      bulges: [0, 0, 0, 0, CONCAVE_QUARTER_BULGE],
    },
    seams: [
      { id: 'b-diagonal', a: { x: 8, y: 8 }, b: onRing(5, 45) },
      { id: 'b-upper', a: { x: 8, y: 4 }, b: onRing(5, 30) },
    ],
  };
  return readPatternDocument({
    formatVersion: 2,
    title: 'Garden Corner',
    canvas: { widthIn: 8, heightIn: 8 },
    fabrics: [],
    sections: [
      {
        id: 'quarter',
        label: 'A',
        geometry: { kind: 'wedge', centre: { x: 0, y: 0 }, radiusIn: 5, startAngleDeg: 0, sweepDeg: 90 },
        seams: [{ id: 'a-split', a: { x: 0, y: 0 }, b: onRing(5, 45) }],
      },
      corner,
    ],
  });
}
