import { describe, expect, it } from 'vitest';
import { polygonArea, flattenSectionOutline, type PatternDocument } from '@seamwright/piecing';
import { exactSectionArea } from '@seamwright/piecing/testing';
import { emptyPattern, click, play, testEditor } from '../testing/board-fixtures';
import { followRingEdges } from './ring-edges';

const disc = (doc: PatternDocument): PatternDocument => ({
  ...doc,
  sections: [{ id: 'w', label: 'A', geometry: { kind: 'wedge', centre: { x: 0, y: 0 }, radiusIn: 4, startAngleDeg: 0, sweepDeg: 90 }, seams: [], patches: [] }],
});

describe('a corner drawn against a ring', () => {
  it('gets an exact concave edge on the ring: area s² − πr²/4 (standard mensuration)', () => {
    // A 6 in. square corner at the origin whose edge from (4, 0) to (0, 4) runs through a quarter disc of radius 4.
    const doc = disc(emptyPattern());
    const corner = { kind: 'straight' as const, vertices: [{ x: 4, y: 0 }, { x: 6, y: 0 }, { x: 6, y: 6 }, { x: 0, y: 6 }, { x: 0, y: 4 }] };
    const g = followRingEdges(doc, corner);
    expect(g.bulges?.filter((b) => b !== 0)).toHaveLength(1);
    // The square 6 × 6 less the quarter disc of radius 4: 36 − 4π.
    expect(exactSectionArea(g)).toBeCloseTo(36 - 4 * Math.PI, 9);
    // The flattened outline is within the chord tolerance of it.
    expect(Math.abs(polygonArea(flattenSectionOutline(g)) - (36 - 4 * Math.PI))).toBeLessThan(0.01);
  });

  it('leaves an edge that only meets the circle from outside straight', () => {
    const doc = disc(emptyPattern());
    // (4, 0)–(4, 3): its ends are (4, 0) on the circle and (4, 3) outside it; nothing to follow.
    const g = followRingEdges(doc, { kind: 'straight', vertices: [{ x: 4, y: 0 }, { x: 8, y: 0 }, { x: 8, y: 3 }, { x: 4, y: 3 }] });
    expect((g.bulges ?? []).every((b) => b === 0)).toBe(true);
  });

  it('is what the straight-section tool does when the corners snap onto the ring', () => {
    const ed = testEditor(disc(emptyPattern()));
    ed.setTool('straight');
    play(ed, [...click(4, 0), ...click(6, 0), ...click(6, 6), ...click(0, 6), ...click(0, 4), ...click(4, 0)]);
    const s = ed.store.document.sections[1];
    expect(s.geometry.kind).toBe('straight');
    if (s.geometry.kind !== 'straight') return;
    expect(exactSectionArea(s.geometry)).toBeCloseTo(36 - 4 * Math.PI, 9);
  });
});
