import ClipperLib from 'clipper-lib';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Point } from '../../document/pattern-schema';
import { distanceToSegment, flattenSectionOutline, polygonPerimeter } from '../../geometry/index';
import { CHORD_TOLERANCE_IN, CLIPPER_SCALE, MITRE_LIMIT } from '../../tolerance';
import { fromIntegerRing, PolygonOffsetter, toIntegerRing, type IntegerRing } from './clipper-offset';
import { OutwardRingOffset } from './outward-ring-offset';

/** ClipperOffset in full (raw offset, then its union), as the product ran it before the shortcut. */
function clipperInFull(ring: IntegerRing, distanceIn: number, join: 'mitre' | 'square' = 'mitre'): IntegerRing[] {
  const offset = new ClipperLib.ClipperOffset(MITRE_LIMIT, CHORD_TOLERANCE_IN * CLIPPER_SCALE);
  offset.AddPath(ring, join === 'mitre' ? ClipperLib.JoinType.jtMiter : ClipperLib.JoinType.jtSquare, ClipperLib.EndType.etClosedPolygon);
  const solution: IntegerRing[] = [];
  offset.Execute(solution, distanceIn * CLIPPER_SCALE);
  return solution;
}

function shortcut(ring: IntegerRing, distanceIn: number, join: 'mitre' | 'square' = 'mitre'): IntegerRing | undefined {
  return new OutwardRingOffset().offsetIntegerRing(ring, { delta: distanceIn * CLIPPER_SCALE, mitreLimit: MITRE_LIMIT, squareJoins: join === 'square' });
}

/** Largest distance from a vertex of `a` to the boundary of ring `b`, in grid units. */
function farthestFrom(a: IntegerRing, b: IntegerRing): number {
  const pb = fromIntegerRing(b);
  let worst = 0;
  for (const p of fromIntegerRing(a)) {
    let best = Infinity;
    for (let i = 0; i < pb.length; i++) best = Math.min(best, distanceToSegment(p, pb[i], pb[(i + 1) % pb.length]));
    worst = Math.max(worst, best * CLIPPER_SCALE);
  }
  return worst;
}

/**
 * The shortcut's ring is ClipperOffset's: each vertex of either ring within two grid steps of the other's
 * outline (each library rounds a point to the grid once; where two offset edges cross, clipper-lib
 * intersects the rounded edges and the shortcut the exact offset lines), areas apart by at most that band
 * along the perimeter, and as many vertices but for a few: one library may find a point exactly on a line
 * between its neighbours and drop it, and where two nearly parallel rounded edges cross, clipper-lib's
 * union can leave a jog of two extra points a grid step or two long.
 */
function expectSameAsClipper(ours: IntegerRing, theirs: IntegerRing[]): void {
  expect(theirs).toHaveLength(1);
  expect(Math.abs(ours.length - theirs[0].length)).toBeLessThanOrEqual(2 + theirs[0].length / 100);
  expect(farthestFrom(ours, theirs[0])).toBeLessThanOrEqual(2);
  expect(farthestFrom(theirs[0], ours)).toBeLessThanOrEqual(2);
  const band = (polygonPerimeter(fromIntegerRing(ours)) * 2) / CLIPPER_SCALE;
  expect(Math.abs(ClipperLib.Clipper.Area(ours) - ClipperLib.Clipper.Area(theirs[0])) / CLIPPER_SCALE ** 2).toBeLessThanOrEqual(band);
  // Wound as clipper-lib winds an outer ring.
  expect(ClipperLib.Clipper.Orientation(ours)).toBe(true);
}

/**
 * Arc sections whose offset ends stay apart: with inner radius r ≥ 1¼ in., sweep ≤ 240° and offset
 * d ≤ ½ in., the two straight ends' offset lines meet d / sin 60° ≈ 0.58 in. from the centre, short of
 * the offset inner arc at r − d ≥ ¾ in. (plane geometry).
 */
const arcSection = fc.record({
  cx: fc.double({ min: -30, max: 30, noNaN: true }),
  cy: fc.double({ min: -30, max: 30, noNaN: true }),
  inner: fc.double({ min: 1.25, max: 40, noNaN: true }),
  width: fc.double({ min: 0.25, max: 6, noNaN: true }),
  start: fc.double({ min: 0, max: 360, noNaN: true }),
  sweep: fc.double({ min: 3, max: 240, noNaN: true }),
});

/** Star-shaped (hence simple) polygons a few inches across, with concave and convex corners. */
const starPolygon = fc
  .record({
    n: fc.integer({ min: 3, max: 14 }),
    jitter: fc.array(fc.double({ min: 0, max: 0.8, noNaN: true }), { minLength: 14, maxLength: 14 }),
    radii: fc.array(fc.double({ min: 0.5, max: 3, noNaN: true }), { minLength: 14, maxLength: 14 }),
  })
  .map(({ n, jitter, radii }) =>
    Array.from({ length: n }, (_, i) => {
      // One vertex per 1/n of the turn keeps every angular gap below 180°, so the ring cannot cross itself.
      const a = ((i + jitter[i]) * 2 * Math.PI) / n;
      return { x: 5 + radii[i] * Math.cos(a), y: -3 + radii[i] * Math.sin(a) };
    }),
  );

describe('OutwardRingOffset (ClipperOffset without its union where the union changes nothing)', () => {
  it('takes the shortcut on every flattened arc section and gives ClipperOffset’s ring', () => {
    fc.assert(
      fc.property(arcSection, fc.constantFrom(0.25, 0.375, 0.5), ({ cx, cy, inner, width, start, sweep }, d) => {
        const outline = flattenSectionOutline({
          kind: 'arc',
          centre: { x: cx, y: cy },
          innerRadiusIn: inner,
          outerRadiusIn: inner + width,
          startAngleDeg: start,
          sweepDeg: sweep,
        });
        const ring = toIntegerRing(outline);
        const ours = shortcut(ring, d);
        expect(ours).toBeDefined();
        expectSameAsClipper(ours!, clipperInFull(ring, d));
      }),
      { numRuns: 300 },
    );
  });

  it('gives ClipperOffset’s ring on star-shaped polygons whenever it takes the shortcut, mitred or squared', () => {
    let taken = 0;
    fc.assert(
      fc.property(starPolygon, fc.constantFrom(0.25, 0.375, 0.5), fc.constantFrom('mitre' as const, 'square' as const), (points, d, join) => {
        const ring = toIntegerRing(points);
        const ours = shortcut(ring, d, join);
        if (ours) {
          taken++;
          expectSameAsClipper(ours, clipperInFull(ring, d, join));
        }
      }),
      { numRuns: 300 },
    );
    // Most star polygons' offsets do not overlap themselves, so the shortcut was really tried.
    expect(taken).toBeGreaterThan(150);
  });

  it('declines where the offsets of two far-apart edges overlap, and the offsetter then runs the union', () => {
    // A bottle-shaped pocket: a 0.3 in. neck into a 1.5 × 1.5 in. chamber. Offset by ¼ in., the neck's two
    // walls pass each other (0.3 < 2 × 0.25) while every offset edge keeps its direction, so only the
    // check for crossing segments can tell; the union closes the neck and leaves the chamber as a hole.
    const bottle: Point[] = [
      { x: 0, y: 0 },
      { x: 3, y: 0 },
      { x: 3, y: 1.35 },
      { x: 2.5, y: 1.35 },
      { x: 2.5, y: 0.75 },
      { x: 1, y: 0.75 },
      { x: 1, y: 2.25 },
      { x: 2.5, y: 2.25 },
      { x: 2.5, y: 1.65 },
      { x: 3, y: 1.65 },
      { x: 3, y: 3 },
      { x: 0, y: 3 },
    ];
    const ring = toIntegerRing(bottle);
    expect(shortcut(ring, 0.25)).toBeUndefined();
    const full = clipperInFull(ring, 0.25);
    expect(full).toHaveLength(2);
    expect(new PolygonOffsetter().offsetIntegerRings([ring], 0.25)).toEqual(full);
    // The outer ring alone, from the inch entry point: the 3.5 × 3.5 in. square (neck closed).
    const outer = new PolygonOffsetter().offsetPolygon(bottle, 0.25);
    expect(Math.abs(ClipperLib.Clipper.Area(toIntegerRing(outer))) / CLIPPER_SCALE ** 2).toBeCloseTo(3.5 * 3.5, 6);
  });

  it('declines where an offset edge is overrun by its neighbours (a slot narrower than twice the offset)', () => {
    const slot: Point[] = [
      { x: 0, y: 0 },
      { x: 3, y: 0 },
      { x: 3, y: 2 },
      { x: 1.65, y: 2 },
      { x: 1.65, y: 0.5 },
      { x: 1.35, y: 0.5 },
      { x: 1.35, y: 2 },
      { x: 0, y: 2 },
    ];
    const ring = toIntegerRing(slot);
    expect(shortcut(ring, 0.25)).toBeUndefined();
    // The slot fills: the offset is the 3.5 × 2.5 in. rectangle.
    expect(ClipperLib.Clipper.Area(new PolygonOffsetter().offsetIntegerRings([ring], 0.25)[0]) / CLIPPER_SCALE ** 2).toBeCloseTo(3.5 * 2.5, 6);
  });

  it('declines rings with no area or fewer than three distinct points', () => {
    const line = toIntegerRing([{ x: 0, y: 0 }, { x: 2, y: 0 }, { x: 1, y: 0 }]);
    expect(shortcut(line, 0.25)).toBeUndefined();
    expect(shortcut(toIntegerRing([{ x: 0, y: 0 }, { x: 1, y: 1 }, { x: 0, y: 0 }]), 0.25)).toBeUndefined();
  });

  it('from inches, keeps the input untouched and its winding, and matches the integer route', () => {
    const square: Point[] = [{ x: 0, y: 0 }, { x: 3, y: 0 }, { x: 3, y: 3 }, { x: 0, y: 3 }];
    const clockwise = [...square].reverse();
    const copy = clockwise.map((p) => ({ ...p }));
    const offset = new OutwardRingOffset();
    const settings = { delta: 0.25 * CLIPPER_SCALE, mitreLimit: MITRE_LIMIT, squareJoins: false };
    const out = offset.offsetInchRing(clockwise, CLIPPER_SCALE, settings)!;
    expect(clockwise).toEqual(copy);
    expect(ClipperLib.Clipper.Orientation(toIntegerRing(out))).toBe(false);
    // Reference: (w + 2d)² = 3.5² = 12.25 sq in. for a mitred square.
    expect(-ClipperLib.Clipper.Area(toIntegerRing(out)) / CLIPPER_SCALE ** 2).toBeCloseTo(12.25, 10);
    expect(toIntegerRing([...out].reverse())).toEqual(expect.arrayContaining(offset.offsetIntegerRing(toIntegerRing(square), settings)!));
  });
});
