import { describe, expect, it } from 'vitest';
import type { Section } from '../../document/pattern-schema';
import { fitEdgeToCircle } from '../../geometry/edge-circles';
import { curvedCornerDocument } from '../../geometry/testing/curved-corner';
import { matchingMarks, type SectionMatchingMarks } from './matching-marks';

function instanceMarks(result: SectionMatchingMarks[]) {
  return result.flatMap((s) => s.instances.flatMap((i) => i.marks.map((mark) => ({ instanceId: i.instanceId, mark }))));
}

describe('matching marks on the curved edge of a straight section', () => {
  it('a corner against a quarter circle: the same marks on both, the corner marked on its edge 4, normals opposed', () => {
    const result = matchingMarks(curvedCornerDocument());
    const [quarter, corner] = result;
    // r = 5: circumference 2π·5 ≈ 31.4 in. / 2 in. ≈ 16 steps of 22.5°; the grid sits midway between the
    // corners at 0° and 90°: marks at 11.25°, 33.75°, 56.25° and 78.75°.
    expect(quarter.marks.map((m) => m.angleDeg)).toEqual([11.25, 33.75, 56.25, 78.75].map((a) => expect.closeTo(a, 9)));
    expect(corner.marks.map((m) => m.angleDeg)).toEqual([11.25, 33.75, 56.25, 78.75].map((a) => expect.closeTo(a, 9)));
    for (const [i, m] of corner.marks.entries()) {
      const twin = quarter.marks[i];
      expect(Math.hypot(m.point.x - twin.point.x, m.point.y - twin.point.y)).toBeLessThan(1e-12);
      expect(Math.hypot(m.point.x, m.point.y)).toBeCloseTo(5, 12);
      expect(m.edge).toBe('inner');
      expect(m.edgeIndex).toBe(4);
      expect(m.neighbourLabel).toBe('A');
      // Out of the corner means towards the circle's centre, into the quarter circle.
      expect(m.normal.x).toBeCloseTo(-twin.normal.x, 12);
      expect(m.normal.y).toBeCloseTo(-twin.normal.y, 12);
      expect(m.normal.x * m.point.x + m.normal.y * m.point.y).toBeLessThan(0);
    }
  });

  it('four ring-repeated corners round a disc: every copy marked alike, each mark met on the disc', () => {
    const centre = { x: 8, y: 8 };
    // The top-left corner of a 16 in. block outside a circle of radius 5 about its middle; edge 1 snapped to the circle.
    const drawn = { kind: 'straight' as const, vertices: [{ x: 8, y: 0 }, { x: 8, y: 3 }, { x: 3, y: 8 }, { x: 0, y: 8 }, { x: 0, y: 0 }] };
    const fit = fitEdgeToCircle(drawn, 1, { centre, radiusIn: 5 });
    if (!fit.ok) throw new Error(fit.message);
    const sections: Section[] = [
      { id: 'disc', label: 'A', geometry: { kind: 'wedge', centre, radiusIn: 5, startAngleDeg: 0, sweepDeg: 360 }, seams: [], patches: [] },
      { id: 'corner', label: 'B', geometry: fit.geometry, seams: [], patches: [], ringRepeat: { count: 4, centre } },
    ];
    const result = matchingMarks({ sections });
    const corner = result[1];
    // 16 steps round the circle (a multiple of the 4 copies): 4 marks on each corner, the same on the template.
    expect(corner.instances.map((i) => i.marks.length)).toEqual([4, 4, 4, 4]);
    expect(corner.marks).toHaveLength(4);
    expect(result[0].marks).toHaveLength(16);
    const all = instanceMarks(result);
    for (const { instanceId, mark } of all.filter((m) => m.instanceId.startsWith('corner'))) {
      const twins = all.filter((o) => o.instanceId === 'disc' && o.mark.neighbourId === instanceId && Math.hypot(o.mark.point.x - mark.point.x, o.mark.point.y - mark.point.y) < 1e-9);
      expect(twins).toHaveLength(1);
    }
  });
});
