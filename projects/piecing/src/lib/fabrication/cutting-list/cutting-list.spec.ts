import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { Point } from '../../document/pattern-schema';
import { readPatternDocument, type PatternDocumentInput } from '../../document/index';
import { INCHES_PER_YARD, roundUpToEighthInch, roundUpToStep, YARDAGE_STEP_IN } from '../shared/rounding';
import { buildCuttingList } from './build-cutting-list';
import { convexHull, minAreaRectangle } from './min-area-rectangle';
import { patchRoughCut } from './patch-rough-cut';
import { planWofStrips } from './wof-strips';

const rotate = (p: Point, deg: number): Point => {
  const a = (deg * Math.PI) / 180;
  return { x: p.x * Math.cos(a) - p.y * Math.sin(a), y: p.x * Math.sin(a) + p.y * Math.cos(a) };
};

/** Smallest enclosing-rectangle area over many directions, by brute force: an independent check. */
function bruteForceMinArea(points: Point[]): number {
  let best = Infinity;
  const hull = convexHull(points);
  const dirs: number[] = [];
  for (let i = 0; i < hull.length; i++) {
    const a = hull[i];
    const b = hull[(i + 1) % hull.length];
    dirs.push(Math.atan2(b.y - a.y, b.x - a.x));
  }
  for (let k = 0; k < 180; k++) dirs.push((k * Math.PI) / 180);
  for (const t of dirs) {
    const c = Math.cos(t), s = Math.sin(t);
    let minU = Infinity, maxU = -Infinity, minV = Infinity, maxV = -Infinity;
    for (const p of points) {
      const u = p.x * c + p.y * s;
      const v = -p.x * s + p.y * c;
      minU = Math.min(minU, u); maxU = Math.max(maxU, u); minV = Math.min(minV, v); maxV = Math.max(maxV, v);
    }
    best = Math.min(best, (maxU - minU) * (maxV - minV));
  }
  return best;
}

describe('rounding', () => {
  it('rounds cut sizes up to ⅛ in. and leaves exact eighths alone', () => {
    expect(roundUpToEighthInch(3)).toBe(3);
    expect(roundUpToEighthInch(3.0000000001)).toBe(3);
    expect(roundUpToEighthInch(3.01)).toBe(3.125);
    expect(roundUpToEighthInch(4.376)).toBe(4.5);
    expect(Object.is(roundUpToStep(0, 4.5), 0)).toBe(true);
  });

  it('buys yardage in ⅛ yd steps of 4.5 in.', () => {
    // 1 yd = 36 in. exactly (international yard, 1959; NIST Handbook 44); ⅛ yd = 4.5 in. (common practice).
    expect(INCHES_PER_YARD).toBe(36);
    expect(YARDAGE_STEP_IN).toBe(4.5);
    expect(roundUpToStep(4.5, YARDAGE_STEP_IN)).toBe(4.5);
    expect(roundUpToStep(4.6, YARDAGE_STEP_IN)).toBe(9);
    expect(roundUpToStep(10, YARDAGE_STEP_IN) / INCHES_PER_YARD).toBe(0.375);
    expect(roundUpToStep(36, YARDAGE_STEP_IN) / INCHES_PER_YARD).toBe(1);
  });
});

describe('planWofStrips', () => {
  it('sixteen 3 in. squares from 42 in. usable WOF take 2 strips, 14 per strip', () => {
    // Common practice (docs/design-notes.md#common-practice): floor(42 / 3) = 14 per strip, ceil(16 / 14) = 2 strips.
    expect(planWofStrips({ widthIn: 3, lengthIn: 3, count: 16 }, 42)).toEqual({
      stripWidthIn: 3,
      pieceLengthIn: 3,
      piecesPerStrip: 14,
      stripCount: 2,
      depthIn: 6,
    });
  });

  it('turns long pieces across the strip when that takes less fabric', () => {
    // Two 2 × 10 pieces: 2 in. strips hold four each (one strip, 2 in. of fabric);
    // 10 in. strips would hold 21 each but take 10 in.
    expect(planWofStrips({ widthIn: 2, lengthIn: 10, count: 2 }, 42)?.depthIn).toBe(2);
    // Thirty 2 × 30 pieces: 2 in. strips hold one each (60 in.), 30 in. strips hold 21 each (2 strips, 60 in.):
    // a tie keeps the narrow strips.
    expect(planWofStrips({ widthIn: 2, lengthIn: 30, count: 30 }, 42)?.stripWidthIn).toBe(2);
    // A 2 × 50 piece only fits the other way round.
    expect(planWofStrips({ widthIn: 2, lengthIn: 50, count: 1 }, 42)).toMatchObject({ stripWidthIn: 50, piecesPerStrip: 21, stripCount: 1 });
    expect(planWofStrips({ widthIn: 45, lengthIn: 50, count: 1 }, 42)).toBeNull();
  });
});

describe('minAreaRectangle', () => {
  it('finds a 2 × 5 rectangle turned by 30°', () => {
    const ring = [{ x: 0, y: 0 }, { x: 5, y: 0 }, { x: 5, y: 2 }, { x: 0, y: 2 }].map((p) => rotate(p, 30));
    const r = minAreaRectangle(ring);
    expect(r.areaSqIn).toBeCloseTo(10, 9);
    expect([r.alongIn, r.acrossIn].sort((a, b) => a - b)[0]).toBeCloseTo(2, 9);
    expect(r.angleDeg % 90).toBeCloseTo(30, 9);
  });

  it('a right triangle with legs 3 and 4 fits a 3 × 4 rectangle (area 12, twice the triangle)', () => {
    // For a triangle the best rectangle has a side on a triangle edge; the legs give 3 × 4 = 12, the
    // hypotenuse 5 × 2.4 = 12 too.
    expect(minAreaRectangle([{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 0, y: 3 }]).areaSqIn).toBeCloseTo(12, 9);
  });

  it('never beats, and always matches, a brute-force search over directions', () => {
    fc.assert(
      fc.property(fc.array(fc.record({ x: fc.integer({ min: -10_000, max: 10_000 }), y: fc.integer({ min: -10_000, max: 10_000 }) }), { minLength: 3, maxLength: 40 }), (raw) => {
        // Points on a 0.001 in. grid within ±10 in.; hulls with real area (thin slivers only test float noise).
        const points = raw.map((p) => ({ x: p.x / 1000, y: p.y / 1000 }));
        const hull = convexHull(points);
        fc.pre(hull.length >= 3 && Math.abs(hull.reduce((s, p, i) => s + p.x * hull[(i + 1) % hull.length].y - hull[(i + 1) % hull.length].x * p.y, 0)) > 1e-2);
        const r = minAreaRectangle(points);
        const brute = bruteForceMinArea(points);
        // The calipers try every hull edge (where the optimum lies), so they match the brute force, which
        // tries every hull edge plus 180 other directions.
        expect(r.areaSqIn).toBeLessThanOrEqual(brute + 1e-9 * Math.max(1, brute));
        expect(r.areaSqIn).toBeGreaterThanOrEqual(brute - 1e-9 * Math.max(1, brute));
        // Every point lies in the rectangle.
        const [c0, c1, , c3] = r.corners;
        const ex = { x: c1.x - c0.x, y: c1.y - c0.y };
        const ey = { x: c3.x - c0.x, y: c3.y - c0.y };
        for (const p of points) {
          const u = ((p.x - c0.x) * ex.x + (p.y - c0.y) * ex.y) / Math.max(1e-12, r.alongIn);
          const v = ((p.x - c0.x) * ey.x + (p.y - c0.y) * ey.y) / Math.max(1e-12, r.acrossIn);
          expect(u).toBeGreaterThanOrEqual(-1e-7);
          expect(u).toBeLessThanOrEqual(r.alongIn + 1e-7);
          expect(v).toBeGreaterThanOrEqual(-1e-7);
          expect(v).toBeLessThanOrEqual(r.acrossIn + 1e-7);
        }
      }),
      { numRuns: 300 },
    );
  });
});

describe('patchRoughCut', () => {
  it('a 3 in. finished square with ¼ in. allowance and ½ in. margin is cut 4½ in. square', () => {
    // (w + 2d) with d = allowance + margin = ¾ in. (docs/design-notes.md#published, mitre offset of a rectangle).
    const cut = patchRoughCut([{ x: 0, y: 0 }, { x: 3, y: 0 }, { x: 3, y: 3 }, { x: 0, y: 3 }], 0.25, 0.5);
    expect(cut).toMatchObject({ widthIn: 4.5, lengthIn: 4.5 });
  });

  it('a turned 1 × 2.3 in. patch is measured along its own sides and rounded up to ⅛ in.', () => {
    const ring = [{ x: 0, y: 0 }, { x: 2.3, y: 0 }, { x: 2.3, y: 1 }, { x: 0, y: 1 }].map((p) => rotate(p, 17));
    // 1 + 1.5 = 2.5 and 2.3 + 1.5 = 3.8 → 3⅞ in.
    expect(patchRoughCut(ring, 0.25, 0.5)).toMatchObject({ widthIn: 2.5, lengthIn: 3.875 });
  });
});

describe('buildCuttingList', () => {
  /** A 10 × 10 in. section cut by seams into sixteen 2½ in. squares. */
  function gridDocument(extra: Partial<PatternDocumentInput> = {}): PatternDocumentInput {
    const seams = [2.5, 5, 7.5].flatMap((v, i) => [
      { id: `v${i}`, a: { x: v, y: -0.1 }, b: { x: v, y: 10.1 } },
      { id: `h${i}`, a: { x: -0.1, y: v }, b: { x: 10.1, y: v } },
    ]);
    const patches = Array.from({ length: 16 }, (_, k) => ({
      number: k + 1,
      anchor: { x: 1.25 + 2.5 * (k % 4), y: 1.25 + 2.5 * Math.floor(k / 4) },
      fabricId: 'oat',
    }));
    return {
      formatVersion: 1,
      title: 'Sixteen squares',
      canvas: { widthIn: 10, heightIn: 10 },
      seamAllowanceIn: 0.25,
      piecingMarginIn: 0,
      fabrics: [{ id: 'oat', name: 'Oat', colour: '#e8dcc0', usableWofIn: 42 }],
      sections: [{ id: 'a', label: 'A', geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 10, y: 0 }, { x: 10, y: 10 }, { x: 0, y: 10 }] }, seams, patches }],
      ...extra,
    };
  }

  it('sixteen 2½ in. finished squares are sixteen 3 in. squares: 2 strips of 14 from 42 in. WOF', () => {
    // Common practice (docs/design-notes.md#common-practice): 3 in. squares, 14 per 42 in. strip, 16 take 2 strips.
    const list = buildCuttingList(readPatternDocument(gridDocument()));
    expect(list.problems).toEqual([]);
    expect(list.patches).toHaveLength(16);
    for (const p of list.patches) expect([p.cutWidthIn, p.cutLengthIn]).toEqual([3, 3]);
    const [oat] = list.fabrics;
    expect(oat.pieces).toHaveLength(1);
    expect(oat.pieces[0]).toMatchObject({ widthIn: 3, lengthIn: 3, count: 16, piecesPerStrip: 14, stripCount: 2 });
    expect(oat.stripCount).toBe(2);
    expect(oat.totalStripLengthIn).toBe(84);
    // Two 3 in. strips take 6 in. off the bolt: ⅛ yd steps of 4.5 in. make it 9 in. = ¼ yd.
    expect(oat.fabricLengthIn).toBe(6);
    expect(oat.yardageIn).toBe(9);
    expect(oat.yardageYd).toBe(0.25);
    expect(oat.yardageEighths).toBe(2);
    // The list survives a JSON round trip unchanged.
    expect(JSON.parse(JSON.stringify(list))).toEqual(list);
  });

  it('multiplies by ring repeats and by the block count', () => {
    const doc = gridDocument({ blockCount: 3 });
    const sections = (doc.sections ?? []).map((s) => ({ ...s, ringRepeat: { count: 4, centre: { x: 20, y: 20 } } }));
    const list = buildCuttingList(readPatternDocument({ ...doc, canvas: { widthIn: 40, heightIn: 40 }, sections }));
    // 16 squares × 4 repeats × 3 blocks = 192 squares; 14 per strip → 14 strips.
    expect(list.patches[0].count).toBe(12);
    expect(list.fabrics[0].pieceCount).toBe(192);
    expect(list.fabrics[0].stripCount).toBe(14);
    // 14 × 3 in. = 42 in. → 45 in. (ten ⅛ yd steps).
    expect(list.fabrics[0].yardageIn).toBe(45);
  });

  it('counts strip-set sub-cuts and their strips per fabric', () => {
    const doc: PatternDocumentInput = {
      formatVersion: 1,
      title: 'Stripes',
      canvas: { widthIn: 30, heightIn: 30 },
      seamAllowanceIn: 0.25,
      piecingMarginIn: 0.5,
      fabrics: [
        { id: 'plum', name: 'Plum', colour: '#6b3a5b' },
        { id: 'oat', name: 'Oat', colour: '#e8dcc0', usableWofIn: 40 },
      ],
      sections: [
        {
          id: 'a',
          label: 'A',
          ringRepeat: { count: 8, centre: { x: 15, y: 15 } },
          geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 3 }, { x: 0, y: 3 }] },
          patches: [
            {
              number: 1,
              anchor: { x: 2, y: 1.5 },
              stripSet: { id: 'stripe', strips: [{ fabricId: 'plum', finishedWidthIn: 1 }, { fabricId: 'oat', finishedWidthIn: 1 }, { fabricId: 'plum', finishedWidthIn: 1 }], axisAngleDeg: 0 },
            },
          ],
        },
      ],
    };
    const list = buildCuttingList(readPatternDocument(doc));
    expect(list.problems).toEqual([]);
    const [set] = list.stripSets;
    // Sub-cut: 4 in. along + 2 × (¼ + ½) = 5.5 in.; 8 sub-cuts; floor(40 / 5.5) = 7 per set → 2 sets.
    expect(set).toMatchObject({ stripSetId: 'stripe', subCutLengthIn: 5.5, subCutCount: 8, subCutsPerSet: 7, setCount: 2, sewnWidthIn: 3.5 });
    const plum = list.fabrics.find((f) => f.fabricId === 'plum')!;
    const oat = list.fabrics.find((f) => f.fabricId === 'oat')!;
    // Each 1 in. finished strip is cut 1½ in.; Plum gives two strips per set, Oat one.
    expect(plum.stripCount).toBe(4);
    expect(oat.stripCount).toBe(2);
    expect(plum.fabricLengthIn).toBe(6);
    expect(oat.fabricLengthIn).toBe(3);
    expect(plum.yardageIn).toBe(9);
    expect(oat.yardageIn).toBe(4.5);
    expect(list.patches[0]).toMatchObject({ stripSetId: 'stripe', fabricId: null, cutWidthIn: 3.5, cutLengthIn: 5.5, count: 8 });
  });

  it('a strip set whose axis is written -0° is cut at 0°, so the list reads back from JSON unchanged', () => {
    // Found by the fabrication fuzz (seed 645800262): JSON has no -0, so -0 read back as 0.
    const doc: PatternDocumentInput = {
      formatVersion: 1,
      title: 'Minus zero',
      canvas: { widthIn: 10, heightIn: 10 },
      seamAllowanceIn: 0.25,
      piecingMarginIn: 0,
      fabrics: [{ id: 'plum', name: 'Plum', colour: '#6b3a5b' }],
      sections: [
        {
          id: 'a',
          label: 'A',
          geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 3 }, { x: 0, y: 3 }] },
          patches: [{ number: 1, anchor: { x: 2, y: 1.5 }, stripSet: { id: 's', strips: [{ fabricId: 'plum', finishedWidthIn: 1.5 }, { fabricId: 'plum', finishedWidthIn: 1.5 }], axisAngleDeg: -0 } }],
        },
      ],
    };
    const list = buildCuttingList(readPatternDocument(doc));
    expect(Object.is(list.patches[0].rectangleAngleDeg, 0)).toBe(true);
    expect(JSON.parse(JSON.stringify(list))).toEqual(list);
  });

  it('lists a patch without fabric as a problem and leaves it out of the yardage', () => {
    const doc = gridDocument();
    const sections = (doc.sections ?? []).map((s) => ({ ...s, patches: (s.patches ?? []).slice(1) }));
    const list = buildCuttingList(readPatternDocument({ ...doc, sections }));
    expect(list.problems.map((p) => p.patchLabel)).toEqual(['A1']);
    expect(list.fabrics[0].pieceCount).toBe(15);
  });
});

describe('buildCuttingList with one strip-set id for different strips', () => {
  it('keeps the sets apart, with distinct ids, and says so', () => {
    const stripe = (widths: number[]) => ({ id: 'stripe', strips: widths.map((w) => ({ fabricId: 'plum', finishedWidthIn: w })), axisAngleDeg: 0 });
    const square = (x: number) => [{ x, y: 0 }, { x: x + 3, y: 0 }, { x: x + 3, y: 3 }, { x, y: 3 }];
    const list = buildCuttingList(
      readPatternDocument({
        formatVersion: 1,
        title: 'Two stripes',
        canvas: { widthIn: 10, heightIn: 4 },
        fabrics: [{ id: 'plum', name: 'Plum', colour: '#6d3b5e' }],
        sections: [
          { id: 'a', label: 'A', geometry: { kind: 'straight', vertices: square(0) }, patches: [{ number: 1, anchor: { x: 1.5, y: 1.5 }, stripSet: stripe([1.5, 1.5]) }] },
          { id: 'b', label: 'B', geometry: { kind: 'straight', vertices: square(4) }, patches: [{ number: 1, anchor: { x: 5.5, y: 1.5 }, stripSet: stripe([1, 1, 1]) }] },
        ],
      }),
    );
    expect(list.stripSets.map((s) => s.stripSetId)).toEqual(['stripe', 'stripe-2']);
    expect(list.patches.map((p) => p.stripSetId)).toEqual(['stripe', 'stripe-2']);
    // Spoken of by its place in the list, never by the id the two sets share.
    expect(list.stripSets.map((s) => s.displayName)).toEqual(['Strip set 1', 'Strip set 2']);
    expect(list.problems.map((p) => p.message)).toEqual(['Strip set 2: another strip set has the same id but different strips; they are listed apart, this one for B1']);
  });
});
