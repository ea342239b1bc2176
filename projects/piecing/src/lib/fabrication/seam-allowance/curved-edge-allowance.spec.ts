import { describe, expect, it } from 'vitest';
import type { Point, Section } from '../../document/pattern-schema';
import { curvedCornerDocument } from '../../geometry/testing/curved-corner';
import { CHORD_TOLERANCE_IN } from '../../tolerance';
import { sectionSeamAllowance } from './section-seam-allowance';

/**
 * Points along the closed ring (every vertex and 20 points on each segment) whose angle about `centre`
 * lies within [fromDeg, toDeg] and whose distance from it is below `withinIn`: the stretch of the line
 * that runs along a curved edge, away from the corners where the mitres are.
 */
function stretchNear(ring: readonly Point[], centre: Point, fromDeg: number, toDeg: number, withinIn: number): Point[] {
  const out: Point[] = [];
  for (let i = 0; i < ring.length; i++) {
    const a = ring[i];
    const b = ring[(i + 1) % ring.length];
    for (let k = 0; k < 20; k++) {
      const p = { x: a.x + ((b.x - a.x) * k) / 20, y: a.y + ((b.y - a.y) * k) / 20 };
      const angle = (Math.atan2(p.y - centre.y, p.x - centre.x) * 180) / Math.PI;
      if (angle >= fromDeg && angle <= toDeg && Math.hypot(p.x - centre.x, p.y - centre.y) < withinIn) out.push(p);
    }
  }
  return out;
}

function radialError(points: readonly Point[], centre: Point, radiusIn: number): number {
  return Math.max(...points.map((p) => Math.abs(Math.hypot(p.x - centre.x, p.y - centre.y) - radiusIn)));
}

describe('seam allowance along a curved edge of a straight section', () => {
  const origin = { x: 0, y: 0 };

  it('a concave edge on a ring of radius 5: the cutting line follows the circle of radius 5 − ¼ within the chord tolerance', () => {
    const corner = curvedCornerDocument().sections[1];
    const { sewingLine, cuttingLine } = sectionSeamAllowance(corner, 0.25);
    // Away from the corners at 0° and 90° (the neighbouring straight sides' offsets meet there).
    const sewing = stretchNear(sewingLine, origin, 5, 85, 5.5);
    const cutting = stretchNear(cuttingLine, origin, 5, 85, 5.5);
    expect(sewing.length).toBeGreaterThan(100);
    expect(cutting.length).toBeGreaterThan(100);
    expect(radialError(sewing, origin, 5)).toBeLessThanOrEqual(CHORD_TOLERANCE_IN);
    // The offset of a chord within ε of radius r lies within ε of r − d; clipper's 1/10,000 in. grid adds its rounding.
    expect(radialError(cutting, origin, 4.75)).toBeLessThanOrEqual(CHORD_TOLERANCE_IN + 1e-4);
    // And the cutting line does not stray towards the old chord: it keeps to the inside of the offset circle.
    expect(Math.min(...cutting.map((p) => Math.hypot(p.x, p.y)))).toBeGreaterThan(4.75 - CHORD_TOLERANCE_IN - 1e-4);
  });

  it('a convex half-circle edge: the cutting line follows radius r + ¼ within the chord tolerance', () => {
    // A 4 in. square whose top edge bulges up into a half circle of radius 2 about (2, 0).
    const section: Pick<Section, 'geometry'> = {
      geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 4 }, { x: 0, y: 4 }], bulges: [1, 0, 0, 0] },
    };
    const centre = { x: 2, y: 0 };
    const { sewingLine, cuttingLine } = sectionSeamAllowance(section, 0.25);
    const sewing = stretchNear(sewingLine, centre, -175, -5, 3);
    const cutting = stretchNear(cuttingLine, centre, -175, -5, 3);
    expect(cutting.length).toBeGreaterThan(100);
    expect(radialError(sewing, centre, 2)).toBeLessThanOrEqual(CHORD_TOLERANCE_IN);
    expect(radialError(cutting, centre, 2.25)).toBeLessThanOrEqual(CHORD_TOLERANCE_IN + 1e-4);
  });
});
