import { describe, expect, it } from 'vitest';
import { buildGardenGate, buildOrchardWheel } from '../demo/index';
import { buildCuttingList } from '../fabrication/cutting-list/build-cutting-list';
import { derivePatches } from '../geometry/derive-patches';
import { polygonArea } from '../geometry/polygon';
import { exactSectionArea } from '../geometry/section-outline';
import type { PatternDocument, Section } from './pattern-schema';
import { readPatternDocument } from './parse-pattern';
import { resizeFactor, resizePattern, scalePattern, scaleSection, sectionsOutsideCanvas } from './scale-pattern';

/** Patch areas by label, arcs flattened at `toleranceIn` (scale it with the design to flatten alike). */
function patchAreas(document: PatternDocument, toleranceIn = 0.002): Map<string, number> {
  const areas = new Map<string, number>();
  for (const s of document.sections) for (const p of derivePatches(s, { toleranceIn }).patches) areas.set(p.label, polygonArea(p.polygon));
  return areas;
}

describe('scalePattern', () => {
  it('scales every length of a section and keeps angles, counts, ids and names', () => {
    const section: Section = {
      id: 'band',
      label: 'B',
      geometry: { kind: 'arc', centre: { x: 13, y: 13 }, innerRadiusIn: 5, outerRadiusIn: 8, startAngleDeg: 30, sweepDeg: 45 },
      seams: [{ id: 's1', a: { x: 1, y: 2 }, b: { x: 3, y: 4 } }],
      patches: [
        { number: 2, anchor: { x: 6, y: 7 }, fabricId: 'plum' },
        {
          number: 1,
          anchor: { x: 8, y: 9 },
          stripSet: { id: 't1', name: 'Sunset', strips: [{ fabricId: 'plum', finishedWidthIn: 2 }, { fabricId: 'oat', finishedWidthIn: 1.5 }], axisAngleDeg: 60, offsetIn: 0.5 },
        },
      ],
      ringRepeat: { count: 8, centre: { x: 13, y: 13 } },
      note: 'Press open.',
    };
    expect(scaleSection(section, 0.5)).toEqual({
      id: 'band',
      label: 'B',
      geometry: { kind: 'arc', centre: { x: 6.5, y: 6.5 }, innerRadiusIn: 2.5, outerRadiusIn: 4, startAngleDeg: 30, sweepDeg: 45 },
      seams: [{ id: 's1', a: { x: 0.5, y: 1 }, b: { x: 1.5, y: 2 } }],
      patches: [
        { number: 2, anchor: { x: 3, y: 3.5 }, fabricId: 'plum' },
        {
          number: 1,
          anchor: { x: 4, y: 4.5 },
          stripSet: { id: 't1', name: 'Sunset', strips: [{ fabricId: 'plum', finishedWidthIn: 1 }, { fabricId: 'oat', finishedWidthIn: 0.75 }], axisAngleDeg: 60, offsetIn: 0.25 },
        },
      ],
      ringRepeat: { count: 8, centre: { x: 6.5, y: 6.5 } },
      note: 'Press open.',
    });
    expect(section.geometry).toMatchObject({ innerRadiusIn: 5 }); // the input is not changed
  });

  it('keeps the bulges of curved edges (ratios, not sizes) and scales any length field added later', () => {
    // A bulge is tan(θ/4) of the edge's turning angle: a similarity keeps θ, so the bulge stays. `extraIn`
    // stands for any length a later format version adds: the `…In` naming rule makes it scale.
    const geometry = { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 4 }], bulges: [0.41421356, 0, -0.2], extraIn: 3 };
    const scaled = scaleSection({ id: 's', label: 'A', geometry, seams: [], patches: [] } as unknown as Section, 2).geometry as unknown as typeof geometry;
    expect(scaled).toEqual({ kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 8, y: 0 }, { x: 8, y: 8 }], bulges: [0.41421356, 0, -0.2], extraIn: 6 });
  });

  it('keeps the seam allowance, margin, fabrics and counts, and scales the drawing area and trace image', () => {
    const doc = readPatternDocument({ ...buildGardenGate(), referenceImage: { uploadId: 'img', origin: { x: 1, y: 2 }, widthIn: 8, opacity: 0.3 } });
    const scaled = scalePattern(doc, 1.5);
    expect(scaled.canvas).toEqual({ widthIn: 12, heightIn: 12 });
    expect(scaled.referenceImage).toEqual({ uploadId: 'img', origin: { x: 1.5, y: 3 }, widthIn: 12, opacity: 0.3 });
    expect([scaled.seamAllowanceIn, scaled.piecingMarginIn, scaled.blockCount, scaled.pressingsPerTemplate]).toEqual([0.25, 0.5, 4, 16]);
    expect(scaled.fabrics).toEqual(doc.fabrics);
    expect(() => scalePattern(doc, 0)).toThrow(RangeError);
    expect(() => scalePattern(doc, Number.NaN)).toThrow(RangeError);
  });

  it('scales the area of every patch by k² (arcs, wedges, ring repeats, strip sets)', () => {
    const doc = buildOrchardWheel();
    const k = 0.75;
    const before = patchAreas(doc, 0.002);
    // Flattened at k × the chord tolerance, the scaled arcs get the same chords, scaled.
    const after = patchAreas(scalePattern(doc, k), 0.002 * k);
    expect(after.size).toBe(before.size);
    expect(before.size).toBeGreaterThan(10);
    // Area scales as the square of length under a similarity (standard mensuration).
    for (const [label, area] of before) expect(after.get(label)! / area, label).toBeCloseTo(k * k, 8);
    // The exact section areas (θ(R² − r²)/2 and friends) scale by k² to rounding.
    doc.sections.forEach((s, i) => expect(exactSectionArea(scalePattern(doc, k).sections[i].geometry) / exactSectionArea(s.geometry)).toBeCloseTo(k * k, 9));
  });
});

describe('cutting list after a resize', () => {
  it('is worked out afresh from the scaled patches, with the seam allowance kept', () => {
    const doc = buildGardenGate();
    const result = resizePattern(doc, { widthIn: 12, heightIn: 12 });
    if (!result.ok) throw new Error(JSON.stringify(result.issues));
    expect(result.factor).toBe(1.5);
    const list = buildCuttingList(result.document);
    expect(list.seamAllowanceIn).toBe(0.25);
    expect(list.piecingMarginIn).toBe(0.5);
    // B1, the gate, is a 2½ in. square; at 1.5× it is a 3¾ in. square. Its rough cut is the square grown by
    // allowance + margin on every side: 3¾ + 2 × (¼ + ½) = 5¼ in. (before: 2½ + 1½ = 4 in.).
    const b1 = (l: typeof list) => l.patches.find((p) => p.patchLabel === 'B1')!;
    expect([b1(buildCuttingList(doc)).cutWidthIn, b1(buildCuttingList(doc)).cutLengthIn]).toEqual([4, 4]);
    expect([b1(list).cutWidthIn, b1(list).cutLengthIn]).toEqual([5.25, 5.25]);
    // A1, the roof, is a triangle 8 wide and 3 high, 12 × 4½ after; every rough cut covers its scaled patch.
    const scaledAreas = patchAreas(result.document);
    for (const row of list.patches) expect(row.cutWidthIn * row.cutLengthIn, row.patchLabel).toBeGreaterThan(scaledAreas.get(row.patchLabel)!);
    // Counts do not change with size; yardage grows.
    expect(list.patches.map((p) => [p.patchLabel, p.count])).toEqual(buildCuttingList(doc).patches.map((p) => [p.patchLabel, p.count]));
    expect(list.totalYardageIn).toBeGreaterThan(buildCuttingList(doc).totalYardageIn);
  });

  it('cuts strip-set strips at the scaled finished width plus the same allowance', () => {
    const doc = buildOrchardWheel();
    const before = buildCuttingList(doc);
    const after = buildCuttingList(scalePattern(doc, 0.5));
    expect(before.stripSets.length).toBeGreaterThan(0);
    after.stripSets.forEach((s, i) => {
      s.strips.forEach((st, j) => {
        expect(st.finishedWidthIn).toBeCloseTo(before.stripSets[i].strips[j].finishedWidthIn / 2, 9);
        expect(st.cutWidthIn).toBeCloseTo(st.finishedWidthIn + 2 * 0.25, 9);
      });
    });
  });
});

describe('resizePattern', () => {
  it('takes the smaller ratio when the new size is not in proportion, and sets the area as typed', () => {
    expect(resizeFactor({ widthIn: 12, heightIn: 12 }, { widthIn: 10, heightIn: 12 })).toBeCloseTo(10 / 12, 12);
    const r = resizePattern(buildGardenGate(), { widthIn: 6, heightIn: 10 });
    expect(r.ok && r.document.canvas).toEqual({ widthIn: 6, heightIn: 10 });
    expect(r.factor).toBe(0.75);
    expect(r.ok && sectionsOutsideCanvas(r.document)).toEqual([]);
  });

  it('refuses a size that pushes lengths past the largest the format holds, naming where', () => {
    // Garden Gate's seams overshoot its 8 in. edges by 0.05 in.: 8.05 × 23.75 = 191.2 in. is within 200 in.
    expect(resizePattern(buildGardenGate(), { widthIn: 190, heightIn: 190 }).ok).toBe(true);
    // Orchard Wheel (26 in.) told its area is 13 in.: doubling to 200 in. makes it 400 in. across.
    const wheel = buildOrchardWheel();
    const tooBig = resizePattern({ ...wheel, canvas: { widthIn: 13, heightIn: 13 } }, { widthIn: 200, heightIn: 200 });
    expect(tooBig.ok).toBe(false);
    expect(!tooBig.ok && tooBig.issues.some((i) => /^sections\.\d+\./.test(i.path) && /200 in/.test(i.message))).toBe(true);
  });
});

describe('sectionsOutsideCanvas', () => {
  const square = (id: string, label: string, x0: number, y0: number, size: number): Section => ({
    id,
    label,
    geometry: { kind: 'straight', vertices: [{ x: x0, y: y0 }, { x: x0 + size, y: y0 }, { x: x0 + size, y: y0 + size }, { x: x0, y: y0 + size }] },
    seams: [],
    patches: [],
  });
  const doc = (sections: Section[]) => readPatternDocument({ formatVersion: 1, title: 'T', canvas: { widthIn: 10, heightIn: 10 }, sections });

  it('finds nothing in the demo blocks, which fill their drawing areas edge to edge', () => {
    expect(sectionsOutsideCanvas(buildGardenGate())).toEqual([]);
    expect(sectionsOutsideCanvas(buildOrchardWheel())).toEqual([]);
  });

  it('tells partly from wholly outside, by label, in document order', () => {
    const d = doc([square('in', 'A', 0, 0, 10), square('over', 'B', 8, 8, 4), square('gone', 'C', 11, 0, 2), square('edge', 'D', 9, 0, 1)]);
    expect(sectionsOutsideCanvas(d)).toEqual([
      { sectionId: 'over', label: 'B', extent: 'partly' },
      { sectionId: 'gone', label: 'C', extent: 'wholly' },
    ]);
  });

  it('counts a triangle past a corner as wholly outside though its bounding box overlaps the area', () => {
    const tri: Section = { id: 't', label: 'A', geometry: { kind: 'straight', vertices: [{ x: 9, y: 11 }, { x: 11, y: 9 }, { x: 11, y: 11 }] }, seams: [], patches: [] };
    expect(sectionsOutsideCanvas(doc([tri]))).toEqual([{ sectionId: 't', label: 'A', extent: 'wholly' }]);
    // Moved in so one corner crosses the area's corner: now partly.
    const tri2: Section = { ...tri, geometry: { kind: 'straight', vertices: [{ x: 8, y: 11 }, { x: 11, y: 8 }, { x: 11, y: 11 }] } };
    expect(sectionsOutsideCanvas(doc([tri2]))[0].extent).toBe('partly');
  });

  it('checks every ring-repeat copy and exact arcs just inside or just outside the edge', () => {
    // A wedge of radius 5 about (5, 5) from 0° to 90° stays in a 10 in. area; its copy at 180° as well.
    const wedge = (r: number): Section => ({ id: 'w', label: 'A', geometry: { kind: 'wedge', centre: { x: 5, y: 5 }, radiusIn: r, startAngleDeg: 0, sweepDeg: 90 }, seams: [], patches: [], ringRepeat: { count: 2, centre: { x: 5, y: 5 } } });
    expect(sectionsOutsideCanvas(doc([wedge(5)]))).toEqual([]);
    expect(sectionsOutsideCanvas(doc([wedge(5.01)]))).toEqual([{ sectionId: 'w', label: 'A', extent: 'partly' }]);
    // Only the copy turned 180° (from 180° to 270°) leaves the area, on the left and top.
    // The drawn wedge about (4.5, 4.5) reaches 9.5; its copy about (3.5, 3.5) reaches −1.5.
    const shifted: Section = { ...wedge(5), geometry: { kind: 'wedge', centre: { x: 4.5, y: 4.5 }, radiusIn: 5, startAngleDeg: 0, sweepDeg: 90 }, ringRepeat: { count: 2, centre: { x: 4, y: 4 } } };
    expect(sectionsOutsideCanvas(doc([shifted]))).toEqual([{ sectionId: 'w', label: 'A', extent: 'partly' }]);
  });

  it('warns after a resize that leaves the design larger than a drawing area set by hand', () => {
    const grown = scalePattern(buildGardenGate(), 1.25);
    const d = { ...grown, canvas: { widthIn: 8, heightIn: 8 } };
    expect(sectionsOutsideCanvas(d).map((s) => `${s.label} ${s.extent}`)).toEqual(['A partly', 'B partly', 'C partly']);
  });
});
