import { describe, expect, it } from 'vitest';
import type { Section } from '../document/pattern-schema';
import { expandRingRepeat, ringRepeatTransforms } from './ring-repeat';
import { flattenSectionOutline } from './section-outline';
import { polygonArea, polygonCentroid } from './polygon';
import { distance } from './vector';

const centre = { x: 12, y: 12 };
const arcSection: Section = {
  id: 'ring1',
  label: 'B',
  geometry: { kind: 'arc', centre, innerRadiusIn: 5, outerRadiusIn: 8, startAngleDeg: -112.5, sweepDeg: 45 },
  seams: [{ id: 's1', a: { x: 12, y: 3 }, b: { x: 12, y: 8 } }],
  patches: [{ number: 1, anchor: { x: 11, y: 5.5 }, fabricId: 'plum', stripSet: { id: 'ss', strips: [{ fabricId: 'plum', finishedWidthIn: 2 }, { fabricId: 'oat', finishedWidthIn: 1 }], axisAngleDeg: 90, offsetIn: 0 } }],
  ringRepeat: { count: 8, centre },
};

describe('ring repeat', () => {
  it('places 8 repeats 45° apart (8 identical sections around a circle are 45° each: common practice)', () => {
    const t = ringRepeatTransforms(arcSection);
    expect(t.map((x) => x.angleDeg)).toEqual([0, 45, 90, 135, 180, 225, 270, 315]);
    expect(t[1].angleRad).toBeCloseTo(Math.PI / 4, 15);
    expect(ringRepeatTransforms({ ringRepeat: undefined })).toEqual([{ index: 0, angleDeg: 0, angleRad: 0, centre: { x: 0, y: 0 } }]);
  });

  it('expands into turned copies with ids, same label, no ring repeat of their own', () => {
    const copies = expandRingRepeat(arcSection);
    expect(copies.map((c) => c.id)).toEqual(['ring1', 'ring1_r2', 'ring1_r3', 'ring1_r4', 'ring1_r5', 'ring1_r6', 'ring1_r7', 'ring1_r8']);
    expect(copies.every((c) => c.label === 'B' && c.ringRepeat === undefined)).toBe(true);
    expect(copies[0].geometry).toEqual(arcSection.geometry);
    const g2 = copies[2].geometry;
    expect(g2.kind === 'arc' && g2.startAngleDeg).toBeCloseTo(337.5, 9); // −112.5° + 90°, normalised to [0, 360)
    // The seam and anchor turn with the section: a quarter turn takes (12, 3) to (21, 12).
    expect(copies[2].seams[0].a.x).toBeCloseTo(21, 12);
    expect(copies[2].seams[0].a.y).toBeCloseTo(12, 12);
    expect(copies[2].patches[0].stripSet!.axisAngleDeg).toBeCloseTo(180, 12);
    // Each copy has the same area; their centroids sit 45° apart on one circle.
    const areas = copies.map((c) => polygonArea(flattenSectionOutline(c.geometry)));
    for (const a of areas) expect(a).toBeCloseTo(areas[0], 9);
    const c0 = polygonCentroid(flattenSectionOutline(copies[0].geometry));
    const c1 = polygonCentroid(flattenSectionOutline(copies[1].geometry));
    const angle = Math.acos(((c0.x - 12) * (c1.x - 12) + (c0.y - 12) * (c1.y - 12)) / (distance(c0, centre) * distance(c1, centre)));
    expect(angle).toBeCloseTo(Math.PI / 4, 9);
    // The input is untouched.
    expect(arcSection.ringRepeat).toEqual({ count: 8, centre });
  });

  it('turns straight sections about the ring centre', () => {
    const square: Section = { id: 'q', label: 'C', geometry: { kind: 'straight', vertices: [{ x: 13, y: 12 }, { x: 14, y: 12 }, { x: 14, y: 13 }, { x: 13, y: 13 }] }, seams: [], patches: [], ringRepeat: { count: 4, centre } };
    const copies = expandRingRepeat(square);
    expect(copies).toHaveLength(4);
    const v = copies[2].geometry.kind === 'straight' ? copies[2].geometry.vertices[0] : null;
    expect(v!.x).toBeCloseTo(11, 12);
    expect(v!.y).toBeCloseTo(12, 12);
  });
});
