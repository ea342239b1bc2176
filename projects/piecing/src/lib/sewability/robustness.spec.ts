import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parsePatternDocument } from '../document/parse-pattern';
import { derivePatches } from '../geometry/derive-patches';
import { expandRingRepeat } from '../geometry/ring-repeat';
import { flattenSectionOutline, flattenSectionRings } from '../geometry/section-outline';
import { checkSewability } from './check-sewability';
import { findSewableOrder } from './find-sewable-order';

// Numbers from ordinary to hostile: tiny, huge, negative, NaN, ±Infinity.
const anyNumber = fc.oneof(
  { arbitrary: fc.double({ min: -12, max: 12, noNaN: true }), weight: 12 },
  { arbitrary: fc.constantFrom(0, 1e-12, 1e-300, 199.999, 200, 200.0001, 1e308, -1e-9, Number.NaN, Infinity, -Infinity), weight: 1 },
  { arbitrary: fc.double(), weight: 1 },
);
/** Mostly sensible values of a field, now and then a hostile one. */
const mostly = (sane: fc.Arbitrary<number>) => fc.oneof({ arbitrary: sane, weight: 40 }, { arbitrary: anyNumber, weight: 1 });
const point = fc.record({ x: mostly(fc.double({ min: -12, max: 12, noNaN: true })), y: mostly(fc.double({ min: -12, max: 12, noNaN: true })) });
const seam = fc
  .tuple(fc.constantFrom('s1', 's2', 's3'), point, fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }), mostly(fc.double({ min: 0.05, max: 30, noNaN: true })))
  .map(([id, a, angle, length]) => ({ id, a, b: { x: a.x + length * Math.cos(angle), y: a.y + length * Math.sin(angle) } }));
const radius = mostly(fc.double({ min: 0.01, max: 12, noNaN: true }));
const sweepDeg = mostly(fc.oneof(fc.double({ min: 0.001, max: 360, noNaN: true }), fc.constantFrom(360, 359.9999, 1e-9)));
const regularPolygon = fc
  .tuple(fc.integer({ min: 3, max: 9 }), fc.double({ min: 0.5, max: 8, noNaN: true }), point)
  .map(([n, r, c]) => Array.from({ length: n }, (_, i) => ({ x: (Number.isFinite(c.x) ? c.x : 0) + r * Math.cos((2 * Math.PI * i) / n), y: (Number.isFinite(c.y) ? c.y : 0) + r * Math.sin((2 * Math.PI * i) / n) })));
const geometry = fc.oneof(
  fc.record({ kind: fc.constant('straight'), vertices: fc.oneof({ arbitrary: regularPolygon, weight: 3 }, { arbitrary: fc.array(point, { maxLength: 12 }), weight: 1 }) }),
  fc.record({ kind: fc.constant('arc'), centre: point, innerRadiusIn: radius, outerRadiusIn: radius, startAngleDeg: anyNumber, sweepDeg }),
  fc.record({ kind: fc.constant('wedge'), centre: point, radiusIn: radius, startAngleDeg: anyNumber, sweepDeg }),
);
const section = fc.record({
  id: fc.constantFrom('a', 'b'),
  geometry,
  seams: fc.array(seam, { maxLength: 6 }),
  patches: fc.uniqueArray(fc.record({ number: fc.integer({ min: 1, max: 12 }), anchor: point }), { maxLength: 4, selector: (p) => p.number }),
  ringRepeat: fc.option(fc.record({ count: fc.integer({ min: 1, max: 24 }), centre: point }), { nil: undefined, freq: 2 }),
});

describe('robustness', () => {
  it('property: whatever document comes in, parsing and every computation on a valid result finish without throwing', () => {
    let valid = 0;
    fc.assert(
      fc.property(fc.uniqueArray(section, { minLength: 1, maxLength: 2, selector: (s) => s.id }), (drawn) => {
        const sections = drawn.map((s) => ({ ...s, label: s.id.toUpperCase() }));
        const raw = JSON.parse(JSON.stringify({ formatVersion: 1, title: 'Robustness', canvas: { widthIn: 10, heightIn: 10 }, sections }, (_k, v) => (typeof v === 'number' && !Number.isFinite(v) ? String(v) : v)));
        const result = parsePatternDocument(raw);
        if (!result.ok) {
          for (const issue of result.issues) expect(issue.message.length).toBeGreaterThan(0);
          return;
        }
        valid++;
        for (const s of result.document.sections) {
          flattenSectionOutline(s.geometry);
          flattenSectionRings(s.geometry);
          expect(expandRingRepeat(s).length).toBe(s.ringRepeat?.count ?? 1);
          const { patches } = derivePatches(s);
          expect(patches.length).toBeGreaterThanOrEqual(1);
          const verdict = checkSewability(patches);
          const search = findSewableOrder(patches, { maxSearchStates: 5_000 });
          if (search.found) expect(checkSewability(patches, search.order).sewable).toBe(true);
          if (verdict.sewable) expect(search.found).toBe(true);
        }
      }),
      { numRuns: 400 },
    );
    // Enough of the generated documents must be valid for the property to say anything.
    expect(valid).toBeGreaterThan(100);
  });
});
