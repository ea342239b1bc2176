import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parsePatternDocument } from '../document/index';
import { buildCuttingList } from './cutting-list/build-cutting-list';
import { matchingMarks } from './matching-marks/matching-marks';
import { planCopies } from './copies/plan-copies';
import { sectionSeamAllowance } from './seam-allowance/section-seam-allowance';
import { patternStripSets } from './strip-sets/section-guide-lines';

const num = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });
const point = fc.record({ x: num(-30, 30), y: num(-30, 30) });
const fabricId = fc.constantFrom('plum', 'oat', 'sage');

const geometry = fc.oneof(
  fc.record({
    kind: fc.constant('straight' as const),
    // Star-shaped rings (one vertex per slice of the turn) are simple; the schema rejects crossing ones anyway.
    vertices: fc
      .tuple(point, fc.array(fc.tuple(num(0, 0.8), num(0.3, 8)), { minLength: 3, maxLength: 9 }))
      .map(([c, spokes]) => spokes.map(([j, r], i) => {
        const a = ((i + j) * 2 * Math.PI) / spokes.length;
        return { x: c.x + r * Math.cos(a), y: c.y + r * Math.sin(a) };
      })),
  }),
  fc.record({ kind: fc.constant('arc' as const), centre: point, innerRadiusIn: num(0.2, 10), outerRadiusIn: num(10.5, 20), startAngleDeg: num(-720, 720), sweepDeg: num(1, 360) }),
  fc.record({ kind: fc.constant('wedge' as const), centre: point, radiusIn: num(0.2, 15), startAngleDeg: num(-720, 720), sweepDeg: num(1, 360) }),
);

const section = fc.record({
  geometry,
  seams: fc.array(fc.record({ a: point, b: point }), { maxLength: 4 }),
  patches: fc.array(
    fc.record({
      anchor: point,
      fabricId: fc.option(fabricId, { nil: undefined }),
      stripSet: fc.option(
        fc.record({
          id: fc.constantFrom('s1', 's2'),
          strips: fc.array(fc.record({ fabricId, finishedWidthIn: num(0.1, 5) }), { minLength: 2, maxLength: 4 }),
          axisAngleDeg: num(-360, 360),
          offsetIn: num(-3, 3),
        }),
        { nil: undefined },
      ),
    }),
    { maxLength: 4 },
  ),
  ring: fc.option(fc.record({ count: fc.integer({ min: 2, max: 24 }), centre: point }), { nil: undefined }),
});

const documentInput = fc.record({ sections: fc.array(section, { minLength: 1, maxLength: 4 }), blockCount: fc.integer({ min: 1, max: 12 }), allowance: num(0.05, 1), margin: num(0, 1) }).map((d) => ({
  formatVersion: 1,
  title: 'Fuzz',
  seamAllowanceIn: d.allowance,
  piecingMarginIn: d.margin,
  blockCount: d.blockCount,
  canvas: { widthIn: 60, heightIn: 60 },
  fabrics: [
    { id: 'plum', name: 'Plum', colour: '#6d3b5e' },
    { id: 'oat', name: 'Oat', colour: '#e9dcc1', usableWofIn: 40 },
    { id: 'sage', name: 'Sage', colour: '#9aae8c', usableWofIn: 4 },
  ],
  sections: d.sections.map((s, i) => ({
    id: `s${i}`,
    label: String.fromCharCode(65 + i),
    geometry: s.geometry,
    seams: s.seams.map((seam, k) => ({ id: `m${k}`, ...seam })),
    patches: s.patches.map((p, k) => ({ number: k + 1, anchor: p.anchor, ...(p.fabricId ? { fabricId: p.fabricId } : {}), ...(p.stripSet ? { stripSet: p.stripSet } : {}) })),
    ...(s.ring ? { ringRepeat: s.ring } : {}),
  })),
}));

/** Every number in a JSON value is finite (JSON would turn NaN and Infinity into null). */
function allFinite(value: unknown): boolean {
  if (typeof value === 'number') return Number.isFinite(value);
  if (Array.isArray(value)) return value.every(allFinite);
  if (value && typeof value === 'object') return Object.values(value).every(allFinite);
  return true;
}

describe('fabrication on random valid documents', () => {
  it('never throws and always gives finite, JSON-serialisable results', () => {
    let valid = 0;
    fc.assert(
      fc.property(documentInput, (raw) => {
        const parsed = parsePatternDocument(raw);
        fc.pre(parsed.ok);
        if (!parsed.ok) return;
        valid++;
        const doc = parsed.document;
        const list = buildCuttingList(doc);
        expect(allFinite(list)).toBe(true);
        expect(JSON.parse(JSON.stringify(list))).toEqual(list);
        for (const f of list.fabrics) {
          expect(f.yardageIn).toBeGreaterThanOrEqual(f.fabricLengthIn - 1e-9);
          expect(f.yardageIn % 4.5).toBeCloseTo(0, 9);
        }
        expect(allFinite(matchingMarks(doc))).toBe(true);
        expect(allFinite(patternStripSets(doc))).toBe(true);
        const copies = planCopies(doc);
        // docs/design-notes.md#copies: a template lasts u = max(1, floor(P / k)) sections of k patches.
        for (const s of copies.sections) expect(s.printedCopies).toBe(Math.ceil(s.templatesNeeded / Math.max(1, Math.floor(doc.pressingsPerTemplate / s.patches))));
        for (const s of doc.sections) {
          const sa = sectionSeamAllowance(s, doc.seamAllowanceIn);
          expect(sa.cuttingLine.length).toBeGreaterThanOrEqual(3);
          expect(allFinite(sa)).toBe(true);
        }
      }),
      { numRuns: 150 },
    );
    // The generator must produce mostly valid documents, or the property proves little.
    expect(valid).toBeGreaterThan(50);
  });
});
