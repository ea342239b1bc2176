import { describe, expect, it } from 'vitest';
import type { Point, Section, StripSet } from '../../document/pattern-schema';
import { locatePoint } from '../../geometry/index';
import { layoutStripSet, stripCutWidthIn, stripFinishedWidthIn } from './strip-set-layout';
import { sectionStripSets } from './section-guide-lines';

const rect = (w: number, h: number, x = 0, y = 0): Point[] => [
  { x, y },
  { x: x + w, y },
  { x: x + w, y: y + h },
  { x, y: y + h },
];

const set = (widths: number[], axisAngleDeg = 0, offsetIn = 0): StripSet => ({
  id: 'stripe',
  strips: widths.map((w, i) => ({ fabricId: `f${i}`, finishedWidthIn: w })),
  axisAngleDeg,
  offsetIn,
});

describe('strip widths', () => {
  it('a ⅞ in. strip sewn between two seams finishes at ⅜ in. with ¼ in. seams', () => {
    // Common practice: a strip sewn on both long edges finishes ½ in. narrower than cut (docs/design-notes.md#common-practice).
    expect(stripFinishedWidthIn(0.875, 0.25)).toBe(0.375);
    expect(stripCutWidthIn(0.375, 0.25)).toBe(0.875);
    // With a ⅜ in. allowance a strip loses ¾ in.
    expect(stripCutWidthIn(1, 0.375)).toBe(1.75);
  });

  it('the guide lines either side of a ⅜ in. finished strip are ⅜ in. apart and its cut width is ⅞ in.', () => {
    const layout = layoutStripSet(rect(6, 4), set([1.8125, 0.375, 1.8125]));
    expect(layout.guideLines).toHaveLength(2);
    expect(layout.guideLines[1].acrossIn - layout.guideLines[0].acrossIn).toBeCloseTo(0.375, 12);
    expect(layout.strips[1].cutWidthIn).toBe(0.875);
    expect(layout.sewnWidthIn).toBe(4.5);
  });
});

describe('layoutStripSet', () => {
  it('places horizontal strip seams across a 6 × 4 in. patch, centred on its centroid', () => {
    // y points down: across (+90° from the axis) is +y. Strips from y = 0: 1.5, 0.375, 2.125 in.
    const layout = layoutStripSet(rect(6, 4), set([1.5, 0.375, 2.125]));
    expect(layout.centre).toEqual({ x: 3, y: 2 });
    const [g1, g2] = layout.guideLines;
    expect(g1.fromFabricId).toBe('f0');
    expect(g1.toFabricId).toBe('f1');
    expect(g1.segments).toHaveLength(1);
    const ys = (g: typeof g1) => [g.segments[0].a.y, g.segments[0].b.y];
    const xs = (g: typeof g1) => [g.segments[0].a.x, g.segments[0].b.x].sort((a, b) => a - b);
    ys(g1).forEach((y) => expect(y).toBeCloseTo(1.5, 12));
    ys(g2).forEach((y) => expect(y).toBeCloseTo(1.875, 12));
    expect(xs(g1)[0]).toBeCloseTo(0, 12);
    expect(xs(g1)[1]).toBeCloseTo(6, 12);
    expect(layout.coversPatch).toBe(true);
    // Sub-cut: 6 in. along + 2 × (¼ in. allowance + ½ in. margin) = 7.5 in.
    expect(layout.subCutLengthIn).toBe(7.5);
    expect(layout.strips.map((s) => s.cutWidthIn)).toEqual([2, 0.875, 2.625]);
  });

  it('turns with the axis angle and moves across by the offset', () => {
    // Axis 90° (strips run along +y); across is the axis turned +90°, i.e. −x.
    const layout = layoutStripSet(rect(4, 6), set([1.5, 1, 1.5], 90, 0.25));
    expect(layout.centre.x).toBeCloseTo(1.75, 12);
    const xs = layout.guideLines.map((g) => g.segments[0].a.x);
    expect(xs[0]).toBeCloseTo(1.75 + 0.5, 12);
    expect(xs[1]).toBeCloseTo(1.75 - 0.5, 12);
    expect(layout.patchExtentAlongIn).toBeCloseTo(6, 12);
    // 6 + 1.5 = 7.5 in.
    expect(layout.subCutLengthIn).toBe(7.5);
    expect(layout.subCutSetByDesigner).toBe(false);
  });

  it("takes the designer's sub-cut length when the set gives one, and keeps the one the patch needs beside it", () => {
    const layout = layoutStripSet(rect(4, 6), { ...set([1.5, 1, 1.5], 90, 0.25), subCutLengthIn: 8 });
    expect(layout.subCutLengthIn).toBe(8);
    expect(layout.computedSubCutLengthIn).toBe(7.5);
    expect(layout.subCutSetByDesigner).toBe(true);
  });

  it('clips a guide line to a concave patch in two pieces', () => {
    // A U shape: the seam line y = 1 crosses both arms.
    const u: Point[] = [
      { x: 0, y: 0 }, { x: 1, y: 0 }, { x: 1, y: 2 }, { x: 3, y: 2 }, { x: 3, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 3 }, { x: 0, y: 3 },
    ];
    const layout = layoutStripSet(u, { ...set([2, 2]), offsetIn: 0 });
    // Centroid of the U: the 4 × 3 rectangle (area 12, centroid y 1.5) less the 2 × 2 notch (area 4,
    // centroid y 1): y = (12·1.5 − 4·1) / 8 = 1.75, x = 2 by symmetry. The seam line y = 1.75 crosses both arms.
    expect(layout.centre.x).toBeCloseTo(2, 12);
    expect(layout.centre.y).toBeCloseTo(1.75, 12);
    const g = layout.guideLines[0];
    expect(g.segments).toHaveLength(2);
    for (const s of g.segments) {
      expect(locatePoint(s.a, u, 1e-9)).toBe('boundary');
      expect(locatePoint(s.b, u, 1e-9)).toBe('boundary');
    }
    // Move the set so its seam lands at y = 1, through both arms.
    const lowered = layoutStripSet(u, { ...set([2, 2]), offsetIn: 1 - layout.centre.y });
    expect(lowered.guideLines[0].segments).toHaveLength(2);
    const lengths = lowered.guideLines[0].segments.map((s) => Math.hypot(s.b.x - s.a.x, s.b.y - s.a.y));
    lengths.forEach((l) => expect(l).toBeCloseTo(1, 12));
  });

  it('says when the strips do not span the patch', () => {
    expect(layoutStripSet(rect(6, 5), set([2, 1, 2])).coversPatch).toBe(true);
    expect(layoutStripSet(rect(6, 5.25), set([2, 1, 2])).coversPatch).toBe(false);
  });
});

describe('sectionStripSets', () => {
  const section: Section = {
    id: 'b',
    label: 'B',
    geometry: { kind: 'straight', vertices: rect(6, 6) },
    seams: [
      { id: 's1', a: { x: 2, y: -0.1 }, b: { x: 2, y: 6.1 } },
      { id: 's2', a: { x: 4, y: -0.1 }, b: { x: 4, y: 6.1 } },
    ],
    patches: [
      { number: 1, anchor: { x: 3, y: 3 }, stripSet: { id: 'st', strips: [{ fabricId: 'plum', finishedWidthIn: 0.75 }, { fabricId: 'oat', finishedWidthIn: 0.5 }, { fabricId: 'plum', finishedWidthIn: 0.75 }], axisAngleDeg: 90, offsetIn: 0 } },
      { number: 2, anchor: { x: 1, y: 3 }, fabricId: 'sage' },
      { number: 3, anchor: { x: 5, y: 3 }, fabricId: 'sage' },
    ],
  };

  it('finds the strip-set patch and puts its guide lines on it, end to end', () => {
    const [entry, ...rest] = sectionStripSets(section);
    expect(rest).toHaveLength(0);
    expect(entry.patchLabel).toBe('B1');
    expect(entry.problems).toEqual([]);
    const xs = entry.layout.guideLines.map((g) => g.segments[0].a.x).sort((a, b) => a - b);
    expect(xs[0]).toBeCloseTo(2.75, 9);
    expect(xs[1]).toBeCloseTo(3.25, 9);
    for (const g of entry.layout.guideLines) {
      const [seg] = g.segments;
      expect(Math.abs(seg.b.y - seg.a.y)).toBeCloseTo(6, 9);
    }
  });

  it('reports a strip set narrower than its patch', () => {
    const narrow: Section = {
      ...section,
      patches: [{ ...section.patches[0], stripSet: { ...section.patches[0].stripSet!, strips: [{ fabricId: 'plum', finishedWidthIn: 0.5 }, { fabricId: 'oat', finishedWidthIn: 0.5 }] } }],
    };
    const [entry] = sectionStripSets(narrow);
    expect(entry.problems).toHaveLength(1);
    expect(entry.problems[0]).toMatch(/B1 is 1 in\. wide but the patch spans 2 in\./);
  });
});
