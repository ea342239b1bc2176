import { describe, expect, it } from 'vitest';
import type { Section } from '../../document/pattern-schema';
import { matchingMarks, type MatchingMark, type SectionMatchingMarks } from './matching-marks';

const centre = { x: 13, y: 13 };

function ringDocument(outerRingTurnDeg = 0): { sections: Section[] } {
  return {
    sections: [
      { id: 'star', label: 'A', geometry: { kind: 'wedge', centre, radiusIn: 5, startAngleDeg: -112.5, sweepDeg: 45 }, seams: [], patches: [], ringRepeat: { count: 8, centre } },
      { id: 'band', label: 'B', geometry: { kind: 'arc', centre, innerRadiusIn: 5, outerRadiusIn: 8, startAngleDeg: -112.5, sweepDeg: 45 }, seams: [], patches: [], ringRepeat: { count: 8, centre } },
      {
        id: 'points',
        label: 'C',
        geometry: { kind: 'arc', centre, innerRadiusIn: 8, outerRadiusIn: 11, startAngleDeg: -112.5 + outerRingTurnDeg, sweepDeg: 22.5 },
        seams: [],
        patches: [],
        ringRepeat: { count: 16, centre },
      },
    ],
  };
}

function allMarks(result: SectionMatchingMarks[]): Array<{ instanceId: string; mark: MatchingMark }> {
  return result.flatMap((s) => s.instances.flatMap((i) => i.marks.map((mark) => ({ instanceId: i.instanceId, mark }))));
}

/** Every spacing mark has a twin on its neighbour, at the same point and absolute angle. */
function expectMarksCoincide(result: SectionMatchingMarks[]): number {
  const marks = allMarks(result);
  let checked = 0;
  for (const { instanceId, mark } of marks.filter((m) => m.mark.kind === 'spacing')) {
    const twins = marks.filter(
      (m) => m.instanceId === mark.neighbourId && m.mark.neighbourId === instanceId && Math.hypot(m.mark.point.x - mark.point.x, m.mark.point.y - mark.point.y) < 1e-9,
    );
    expect(twins).toHaveLength(1);
    const angleGap = Math.abs(((twins[0].mark.angleDeg - mark.angleDeg + 540) % 360) - 180);
    expect(angleGap).toBeLessThan(1e-9);
    // The twin's normal points the other way: out of the neighbour, into this section.
    expect(twins[0].mark.normal.x).toBeCloseTo(-mark.normal.x, 12);
    expect(twins[0].mark.normal.y).toBeCloseTo(-mark.normal.y, 12);
    checked++;
  }
  return checked;
}

describe('matchingMarks', () => {
  it('marks coincide on both neighbours of every shared curved edge', () => {
    const result = matchingMarks(ringDocument());
    // r = 5: circumference 2π·5 = 31.4 in. (CRC tables) / 2 in. ≈ 16 steps, a multiple of the 8-fold rings:
    // 22.5° apart, 2 marks on each of the 8 wedge/band stretches. r = 8: 50.3 in. / 2 ≈ 25 → 32 steps (the
    // nearest multiple of 16), 11.25° apart, one on each: 16 + 32 shared marks, each on both sides.
    expect(expectMarksCoincide(result)).toBe(2 * (16 + 32));
  });

  it('still coincides when the outer ring is turned against the one inside it', () => {
    const result = matchingMarks(ringDocument(7));
    // The same 16 + 32 steps; the r = 8 grid now starts midway between the band's and the turned points'
    // corners (3.5° from each), so no mark falls near a corner and none is lost.
    expect(expectMarksCoincide(result)).toBe(2 * (16 + 32));
  });

  it('puts marks on the exact arcs at equal arc-length spacing', () => {
    const result = matchingMarks(ringDocument(), { spacingIn: 0.5 });
    for (const { mark } of allMarks(result)) {
      expect(Math.hypot(mark.point.x - centre.x, mark.point.y - centre.y)).toBeCloseTo(mark.radiusIn, 12);
      // Tangent ⟂ radius, both unit length.
      expect(Math.hypot(mark.tangent.x, mark.tangent.y)).toBeCloseTo(1, 12);
      expect(mark.tangent.x * mark.normal.x + mark.tangent.y * mark.normal.y).toBeCloseTo(0, 12);
    }
    // r = 5: 31.4 in. / 0.5 ≈ 63 → 64 steps (a multiple of 8) of 5.625°, s = rθ = 0.4909 in. each (CRC
    // tables); a 45° wedge arc holds 8 of them, half a step in from its start.
    const step = (5 * Math.PI) / 32;
    const wedge = result.find((s) => s.sectionId === 'star')!;
    expect(wedge.marks).toHaveLength(8);
    const gaps = wedge.marks.slice(1).map((m, i) => m.alongEdgeIn - wedge.marks[i].alongEdgeIn);
    for (const g of gaps) expect(g).toBeCloseTo(step, 12);
    expect(wedge.marks[0].alongEdgeIn).toBeCloseTo(step / 2, 12);
  });

  it('marks where a neighbour’s seam lands inside an edge', () => {
    const result = matchingMarks(ringDocument());
    const band = result.find((s) => s.sectionId === 'band')!;
    const seams = band.marks.filter((m) => m.kind === 'neighbour-seam');
    // Two points sections meet in the middle of the band's outer arc: one mark there, at 22.5° along it.
    expect(seams).toHaveLength(1);
    expect(seams[0].edge).toBe('outer');
    expect(seams[0].alongEdgeIn).toBeCloseTo(8 * (Math.PI / 8), 12);
    expect(seams[0].angleDeg).toBeCloseTo(270, 9);
  });

  it('ring-repeat copies carry the marks turned with them; the template is copy 0', () => {
    const result = matchingMarks(ringDocument());
    const points = result.find((s) => s.sectionId === 'points')!;
    expect(points.instances).toHaveLength(16);
    expect(points.marks).toEqual(points.instances[0].marks);
    for (const inst of points.instances) expect(inst.marks).toHaveLength(points.marks.length);
    const first = points.instances[0].marks.map((m) => m.angleDeg);
    const third = points.instances[2].marks.map((m) => m.angleDeg);
    third.forEach((a, k) => expect(((a - first[k] + 360) % 360)).toBeCloseTo(45, 9));
  });

  it('leaves straight sections and unshared arcs without marks', () => {
    const result = matchingMarks({
      sections: [
        { id: 's', label: 'A', geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 0, y: 1 }] }, seams: [], patches: [] },
        { id: 'w', label: 'B', geometry: { kind: 'wedge', centre, radiusIn: 5, startAngleDeg: 0, sweepDeg: 90 }, seams: [], patches: [] },
      ],
    });
    expect(result.map((s) => s.marks.length)).toEqual([0, 0]);
  });
});
