import { describe, expect, it } from 'vitest';
import { parsePatternDocument } from '../document/index';
import { derivePatches, exactSectionArea, polygonArea } from '../geometry/index';
import { checkSewability } from '../sewability/index';
import { buildCuttingList, matchingMarks, planCopies, sectionStripSets } from '../fabrication/index';
import { buildGardenGate, buildOrchardWheel, buildStressPattern } from './index';
import { sectionLetters } from './demo-helpers';

describe.each([
  ['Orchard Wheel', buildOrchardWheel],
  ['Garden Gate', buildGardenGate],
])('%s', (_name, build) => {
  it('passes parsePatternDocument, also after a JSON round trip', () => {
    const doc = build();
    const parsed = parsePatternDocument(JSON.parse(JSON.stringify(doc)));
    expect(parsed.ok ? [] : parsed.issues).toEqual([]);
    if (parsed.ok) expect(parsed.document).toEqual(doc);
  });

  it('every section splits cleanly, every patch has fabric, and each section is sewable in patch order', () => {
    for (const section of build().sections) {
      const { patches, problems } = derivePatches(section);
      expect(problems).toEqual([]);
      expect(patches.map((p) => p.number)).toEqual(section.patches.map((p) => p.number).sort((a, b) => a - b));
      for (const p of patches) expect(p.fabricId ?? p.stripSet?.id).toBeDefined();
      const verdict = checkSewability(section);
      expect(verdict.failure?.message ?? 'sewable').toBe('sewable');
      // The patches partition the section (chord-flattened arcs fall short of the exact area by < 0.1 %).
      const sum = patches.reduce((s, p) => s + polygonArea(p.polygon), 0);
      expect(Math.abs(sum - exactSectionArea(section.geometry)) / exactSectionArea(section.geometry)).toBeLessThan(1e-3);
    }
  });

  it('has a cutting list without problems', () => {
    const list = buildCuttingList(build());
    expect(list.problems).toEqual([]);
    expect(list.totalYardageIn).toBeGreaterThan(0);
  });
});

describe('Orchard Wheel', () => {
  const doc = buildOrchardWheel();

  it('is the demo medallion (docs/design-notes.md#demo-data): 8 star wedges r 5, 8 stripe arcs 5–8, 16 point arcs 8–11, 4 corners in 26 in.', () => {
    expect(doc.canvas).toEqual({ widthIn: 26, heightIn: 26 });
    const [star, band, points, corner] = doc.sections;
    expect(star.geometry).toMatchObject({ kind: 'wedge', radiusIn: 5, sweepDeg: 45 });
    expect(band.geometry).toMatchObject({ kind: 'arc', innerRadiusIn: 5, outerRadiusIn: 8, sweepDeg: 45 });
    expect(points.geometry).toMatchObject({ kind: 'arc', innerRadiusIn: 8, outerRadiusIn: 11, sweepDeg: 22.5 });
    expect(corner.geometry.kind).toBe('straight');
    expect([star, band, points, corner].map((s) => s.ringRepeat?.count)).toEqual([8, 8, 16, 4]);
    expect(doc.fabrics.map((f) => f.name)).toEqual(['Plum', 'Oat', 'Sage', 'Marigold', 'Ink']);
    // The four corners and the circle of radius 11 fill the 26 in. square: 26² = π·11² + 4 corners. The
    // corners' inner edges are chords of the circle, so they come out larger by less than a band of the
    // chord tolerance (0.002 in.) round the circumference.
    const excess = 4 * exactSectionArea(corner.geometry) + Math.PI * 121 - 676;
    expect(excess).toBeGreaterThan(0);
    expect(excess).toBeLessThan(2 * Math.PI * 11 * 0.002);
  });

  it('the stripe band carries the Plum 2 + Oat 1 + Plum 2 strip set with two guide lines across the patch', () => {
    const [entry] = sectionStripSets(doc.sections[1], doc.seamAllowanceIn, doc.piecingMarginIn);
    expect(entry.problems).toEqual([]);
    expect(entry.layout.strips.map((s) => [s.fabricId, s.finishedWidthIn, s.cutWidthIn])).toEqual([
      ['plum', 2, 2.5],
      ['oat', 1, 1.5],
      ['plum', 2, 2.5],
    ]);
    expect(entry.layout.guideLines).toHaveLength(2);
    for (const g of entry.layout.guideLines) {
      expect(g.segments).toHaveLength(1);
      const { a, b } = g.segments[0];
      // Each guide line runs radially from the inner arc (r ≈ 5) to the outer arc (r ≈ 8), ½ in. off centre.
      const radii = [a, b].map((p) => Math.hypot(p.x - 13, p.y - 13)).sort((x, y) => x - y);
      expect(radii[0]).toBeCloseTo(5, 2);
      expect(radii[1]).toBeCloseTo(8, 2);
      expect(Math.abs(a.x - 13)).toBeCloseTo(0.5, 9);
    }
  });

  it('matching marks coincide on both neighbours, and the template marks hold for every copy', () => {
    const result = matchingMarks(doc);
    const all = result.flatMap((s) => s.instances.flatMap((i) => i.marks.map((mark) => ({ id: i.instanceId, mark }))));
    const spacing = all.filter((m) => m.mark.kind === 'spacing');
    expect(spacing.length).toBeGreaterThan(0);
    for (const { id, mark } of spacing) {
      const twin = all.find((m) => m.id === mark.neighbourId && m.mark.neighbourId === id && Math.hypot(m.mark.point.x - mark.point.x, m.mark.point.y - mark.point.y) < 1e-9);
      expect(twin).toBeDefined();
    }
    const points = result.find((s) => s.sectionId === 'points')!;
    // Odd copies of the points ring sit over a seam between two stripe arcs and get a mark for it; the
    // template carries only the marks every copy has.
    expect(points.instances[1].marks.some((m) => m.kind === 'neighbour-seam')).toBe(true);
    expect(points.marks.every((m) => m.kind === 'spacing')).toBe(true);
    expect(points.marks.length).toBeGreaterThan(0);
  });

  it('needs 8 + 8 + 16 + 4 templates; at 16 pressings a 3-patch template lasts 5 sections, a 2-patch one 8', () => {
    // docs/design-notes.md#copies: copies = ceil(uses / max(1, floor(P / k))).
    const plan = planCopies(doc);
    expect(plan.sections.map((s) => [s.label, s.templatesNeeded, s.printedCopies])).toEqual([
      ['A', 8, 2],
      ['B', 8, 2],
      ['C', 16, 4],
      ['D', 4, 1],
    ]);
  });
});

describe('buildStressPattern', () => {
  it.each([1, 37, 1000])('builds a valid pattern with exactly %i patches, every section sewable', (n) => {
    const doc = buildStressPattern(n);
    const parsed = parsePatternDocument(JSON.parse(JSON.stringify(doc)));
    expect(parsed.ok ? [] : parsed.issues).toEqual([]);
    let total = 0;
    for (const s of doc.sections) {
      const { patches, problems } = derivePatches(s);
      expect(problems).toEqual([]);
      total += patches.length;
    }
    expect(total).toBe(n);
    expect(checkSewability(doc.sections[0]).sewable).toBe(true);
  });

  it('rejects counts it cannot hold', () => {
    expect(() => buildStressPattern(0)).toThrow(RangeError);
    expect(() => buildStressPattern(1e6)).toThrow(RangeError);
  });

  it('labels sections A … Z, AA … as quilters do', () => {
    expect([0, 25, 26, 27, 51, 52, 701, 702].map(sectionLetters)).toEqual(['A', 'Z', 'AA', 'AB', 'AZ', 'BA', 'ZZ', 'AAA']);
  });
});
