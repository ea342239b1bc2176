/**
 * flattenStraightEdges and straightSectionSignedArea walk the vertices once, without edge objects, and
 * skip the arc of a curve whose sagitta is within the chord tolerance (a save checks outlines of
 * thousands of edges). They must give exactly what the edge-by-edge definitions give: every edge's arc
 * from sectionEdges, flattened by flattenArc; the shoelace area plus each edge's circular segment.
 */
import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../../../../tests/support/random';
import type { Point } from '../document/pattern-schema';
import { CHORD_TOLERANCE_IN } from '../tolerance';
import { flattenArc } from './arc';
import { circularSegmentSignedArea, flattenStraightEdges, sectionEdges, straightSectionSignedArea } from './curved-edge';

/** The edge-by-edge flattening (what flattenStraightEdges is defined as). */
function byEdges(geometry: { vertices: Point[]; bulges?: number[] }, toleranceIn = CHORD_TOLERANCE_IN): Point[] {
  const out: Point[] = [];
  for (const edge of sectionEdges(geometry)) {
    out.push({ x: edge.from.x, y: edge.from.y });
    if (!edge.arc) continue;
    const points = flattenArc(edge.arc.centre, edge.arc.radiusIn, edge.arc.startRad, edge.arc.sweepRad, toleranceIn);
    for (let k = 1; k < points.length - 1; k++) out.push(points[k]);
  }
  return out;
}

function areaByEdges(geometry: { vertices: Point[]; bulges?: number[] }): number {
  let twice = 0;
  let segments = 0;
  for (const edge of sectionEdges(geometry)) {
    twice += edge.from.x * edge.to.y - edge.to.x * edge.from.y;
    if (edge.arc) segments += circularSegmentSignedArea(edge.arc);
  }
  return twice / 2 + segments;
}

describe('curved edges walked in one pass', () => {
  it('flatten and measure as the edge-by-edge definitions, sagittas at, under and over the tolerance', () => {
    const random = seededRandom(1507);
    for (let trial = 0; trial < 200; trial++) {
      const n = 3 + Math.floor(random() * 30);
      const vertices = Array.from({ length: n }, (_, i) => {
        const t = (2 * Math.PI * i) / n;
        const r = 1 + 5 * random();
        return { x: 10 + r * Math.cos(t), y: 10 + r * Math.sin(t) };
      });
      const bulges = vertices.map((v, i) => {
        const roll = random();
        if (roll < 0.2) return 0;
        const next = vertices[(i + 1) % n];
        const c = Math.hypot(next.x - v.x, next.y - v.y);
        // A bulge whose sagitta c·|b|/2 is the tolerance times 0.5–1.5 (the boundary of one chord), or any.
        const sign = random() < 0.5 ? -1 : 1;
        return roll < 0.7 ? (sign * (2 * CHORD_TOLERANCE_IN * (0.5 + random()))) / c : sign * random();
      });
      // An edge of no length with a bulge is left straight by both.
      if (trial % 10 === 0) vertices[1] = { ...vertices[0] };
      const geometry = { vertices, bulges };
      expect(flattenStraightEdges(geometry)).toEqual(byEdges(geometry));
      expect(flattenStraightEdges(geometry, 0.0005)).toEqual(byEdges(geometry, 0.0005));
      expect(straightSectionSignedArea(geometry)).toBeCloseTo(areaByEdges(geometry), 12);
    }
  });

  it('keeps a curve of exactly the tolerance as flattenArc decides, and straight outlines untouched', () => {
    // Chord 1 in., bulge 2ε: sagitta c·|b|/2 = ε exactly.
    const geometry = { vertices: [{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 1, y: 1 }], bulges: [2 * CHORD_TOLERANCE_IN, 0, 0] };
    expect(flattenStraightEdges(geometry)).toEqual(byEdges(geometry));
    const straight = { vertices: geometry.vertices };
    expect(flattenStraightEdges(straight)).toEqual(straight.vertices);
    expect(straightSectionSignedArea(straight)).toBe(0.5);
  });
});
