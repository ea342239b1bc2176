import { describe, expect, it } from 'vitest';
import type { Section } from '../document/pattern-schema';
import { checkSewability } from '../sewability/index';
import { CHORD_TOLERANCE_IN } from '../tolerance';
import { derivePatches } from './derive-patches';
import { polygonArea } from './polygon';
import { exactSectionArea, flattenSectionOutline } from './section-outline';
import { curvedCornerDocument, onRing } from './testing/curved-corner';

describe('splitting a straight section with a curved edge', () => {
  it('a seam ending on the concave curve reaches it and splits the corner in two equal halves', () => {
    const corner = { ...curvedCornerDocument().sections[1], seams: [{ id: 'd', a: { x: 8, y: 8 }, b: onRing(5, 45) }], patches: [] };
    const { patches, problems } = derivePatches(corner);
    expect(problems).toEqual([]);
    expect(patches).toHaveLength(2);
    // Standard mensuration: the block less the quarter disc, 64 − 25π/4, cut in two by its line of symmetry.
    const half = (64 - (25 * Math.PI) / 4) / 2;
    for (const p of patches) {
      // Each half keeps half the curve (arc length 5π/4); its chords stray at most ε from it.
      expect(Math.abs(polygonArea(p.polygon) - half)).toBeLessThan(CHORD_TOLERANCE_IN * ((5 * Math.PI) / 4));
    }
    expect(polygonArea(patches[0].polygon) + polygonArea(patches[1].polygon)).toBeCloseTo(polygonArea(flattenSectionOutline(corner.geometry)), 9);
  });

  it('the example corner: three patches, sewable as numbered, areas adding up to the exact area within the chord error', () => {
    const corner = curvedCornerDocument().sections[1];
    const { patches, problems } = derivePatches(corner);
    expect(problems).toEqual([]);
    expect(patches).toHaveLength(3);
    const total = patches.reduce((s, p) => s + polygonArea(p.polygon), 0);
    expect(Math.abs(total - exactSectionArea(corner.geometry))).toBeLessThan(CHORD_TOLERANCE_IN * ((5 * Math.PI) / 2));
    expect(checkSewability(patches).sewable).toBe(true);
  });

  it('a seam ending on a convex half-circle edge reaches it too', () => {
    // A 4 in. square with a half circle of radius 2 on top; the seam runs from the bottom to the top of the curve.
    const section: Section = {
      id: 'dome',
      label: 'D',
      geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 4 }, { x: 0, y: 4 }], bulges: [1, 0, 0, 0] },
      seams: [{ id: 'up', a: { x: 2, y: 4 }, b: { x: 2, y: -2 } }],
      patches: [],
    };
    const { patches, problems } = derivePatches(section);
    expect(problems).toEqual([]);
    expect(patches).toHaveLength(2);
    // Standard mensuration: half of (square 16 + half disc π·2²/2).
    const half = (16 + 2 * Math.PI) / 2;
    for (const p of patches) expect(Math.abs(polygonArea(p.polygon) - half)).toBeLessThan(CHORD_TOLERANCE_IN * Math.PI);
  });

  it('a seam stopping short of the curve is reported', () => {
    const corner = { ...curvedCornerDocument().sections[1], seams: [{ id: 'short', a: { x: 8, y: 8 }, b: onRing(5.5, 45) }], patches: [] };
    const { patches, problems } = derivePatches(corner);
    expect(patches).toHaveLength(1);
    expect(problems.map((p) => [p.kind, p.seamId])).toEqual([['seam-stops-short', 'short']]);
  });
});
