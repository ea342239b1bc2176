import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { Point, Section } from '../../document/pattern-schema';
import { distanceToSegment, pointInPolygon, polygonArea, polygonPerimeter } from '../../geometry/index';
import { CHORD_TOLERANCE_IN, CLIPPER_SCALE, MITRE_LIMIT } from '../../tolerance';
import { jstsBufferArea, jstsBufferParameters, jstsBufferRing } from '../testing/jsts-reference';
import { offsetPolygon } from './clipper-offset';
import { sectionCuttingLine, sectionSeamAllowance } from './section-seam-allowance';

const square3: Point[] = [
  { x: 0, y: 0 },
  { x: 3, y: 0 },
  { x: 3, y: 3 },
  { x: 0, y: 3 },
];

function regularPolygon(n: number, radius: number, centre: Point = { x: 5, y: 5 }): Point[] {
  return Array.from({ length: n }, (_, i) => ({
    x: centre.x + radius * Math.cos((2 * Math.PI * i) / n),
    y: centre.y + radius * Math.sin((2 * Math.PI * i) / n),
  }));
}

/** Distance from p to the closed ring's boundary. */
function distanceToRing(p: Point, ring: readonly Point[]): number {
  let best = Infinity;
  for (let i = 0; i < ring.length; i++) best = Math.min(best, distanceToSegment(p, ring[i], ring[(i + 1) % ring.length]));
  return best;
}

/** Angle of p about c in degrees, normalised to [from, from + 360). */
function angleFrom(p: Point, c: Point, fromDeg: number): number {
  let a = (Math.atan2(p.y - c.y, p.x - c.x) * 180) / Math.PI;
  while (a < fromDeg) a += 360;
  while (a >= fromDeg + 360) a -= 360;
  return a;
}

/** Star-shaped (hence simple) polygons with vertices on the clipper grid, a few inches across. */
const starPolygon = fc
  .record({
    n: fc.integer({ min: 3, max: 12 }),
    cx: fc.double({ min: -20, max: 20, noNaN: true }),
    cy: fc.double({ min: -20, max: 20, noNaN: true }),
    jitter: fc.array(fc.double({ min: 0, max: 0.8, noNaN: true }), { minLength: 12, maxLength: 12 }),
    radii: fc.array(fc.double({ min: 0.5, max: 3, noNaN: true }), { minLength: 12, maxLength: 12 }),
  })
  .map(({ n, cx, cy, jitter, radii }) =>
    Array.from({ length: n }, (_, i) => {
      // One vertex per 1/n of the turn keeps every angular gap below 180°, so the ring cannot cross itself.
      const a = ((i + jitter[i]) * 2 * Math.PI) / n;
      return {
        x: Math.round((cx + radii[i] * Math.cos(a)) * CLIPPER_SCALE) / CLIPPER_SCALE,
        y: Math.round((cy + radii[i] * Math.sin(a)) * CLIPPER_SCALE) / CLIPPER_SCALE,
      };
    }),
  );

/** Whether every convex corner's mitre stays below `limit` × d (then no library cuts a mitre off). */
function mitresWithin(points: Point[], limit: number): boolean {
  const n = points.length;
  for (let i = 0; i < n; i++) {
    const a = points[(i + n - 1) % n];
    const b = points[i];
    const c = points[(i + 1) % n];
    const ux = a.x - b.x, uy = a.y - b.y, vx = c.x - b.x, vy = c.y - b.y;
    const cos = (ux * vx + uy * vy) / (Math.hypot(ux, uy) * Math.hypot(vx, vy));
    const interior = Math.acos(Math.max(-1, Math.min(1, cos)));
    if (1 / Math.sin(interior / 2) > limit) return false;
  }
  return true;
}

/** Orthogonal "skyline" polygons on a 1/16 in. grid: columns of random heights above a base line. */
const skylinePolygon = fc
  .array(fc.tuple(fc.integer({ min: 1, max: 24 }), fc.integer({ min: 1, max: 48 })), { minLength: 1, maxLength: 10 })
  .map((columns) => {
    const g = 1 / 16;
    const top: Point[] = [];
    let x = 0;
    for (const [width, height] of columns) {
      top.push({ x: x * g, y: -height * g }, { x: (x + width) * g, y: -height * g });
      x += width;
    }
    return [{ x: 0, y: 0 }, ...top, { x: x * g, y: 0 }];
  });

describe('offsetPolygon', () => {
  it('mitre offset of a 3 × 3 in. square by ¼ in. has area 12.25 sq in.', () => {
    // Reference: (w + 2d)(h + 2d) = 3.5 × 3.5 = 12.25 (docs/design-notes.md#published, rectangle with mitre joins).
    expect(polygonArea(offsetPolygon(square3, 0.25))).toBeCloseTo(12.25, 10);
    // The same square wound the other way gives the same offset, wound like its input.
    const reversed = [...square3].reverse();
    expect(polygonArea(offsetPolygon(reversed, 0.25))).toBeCloseTo(12.25, 10);
  });

  it('keeps the input untouched and the winding of the input', () => {
    const input = square3.map((p) => ({ ...p }));
    const out = offsetPolygon(input, 0.25);
    expect(input).toEqual(square3);
    const signed = (r: Point[]) => r.reduce((s, p, i) => s + p.x * r[(i + 1) % r.length].y - r[(i + 1) % r.length].x * p.y, 0);
    expect(Math.sign(signed(out))).toBe(Math.sign(signed(input)));
  });

  it('an inward offset that leaves nothing gives an empty ring', () => {
    expect(offsetPolygon(square3, -2)).toEqual([]);
    // Inward by ¼ in.: (3 − 0.5)² = 6.25.
    expect(polygonArea(offsetPolygon(square3, -0.25))).toBeCloseTo(6.25, 10);
  });

  it.each([
    ['3 × 3 square', square3],
    ['regular hexagon r = 2', regularPolygon(6, 2)],
    ['triangle', [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 1, y: 3 }]],
    ['2 × 7 rectangle', [{ x: 0, y: 0 }, { x: 7, y: 0 }, { x: 7, y: 2 }, { x: 0, y: 2 }]],
  ])('round-join offset of a %s matches the Steiner formula A + Pd + πd² within the chord error', (_name, ring) => {
    // Reference: Steiner formula for the outer parallel body of a convex polygon (docs/design-notes.md#published).
    for (const d of [0.25, 0.375, 0.75 / 2.54]) {
      const steiner = polygonArea(ring) + polygonPerimeter(ring) * d + Math.PI * d * d;
      const area = polygonArea(offsetPolygon(ring, d, 'round'));
      // The round corners are chords of the circle of radius d, each within (3/2)² × the arc tolerance of it
      // (clipper-lib rounds the chord count per corner), so the area falls short by less than a band of that
      // width along the corner arcs (total length 2πd);
      // one grid step (1/CLIPPER_SCALE) along the perimeter covers the rounding of the coordinates.
      const roundingBound = (polygonPerimeter(ring) + 2 * Math.PI * d) / CLIPPER_SCALE;
      expect(area).toBeLessThanOrEqual(steiner + roundingBound);
      expect(area).toBeGreaterThanOrEqual(steiner - 2 * Math.PI * d * 2.25 * CHORD_TOLERANCE_IN - roundingBound);
    }
  });

  it('agrees with jsts (JTS port) mitre buffers on random orthogonal polygons within 1e-4 sq in.', () => {
    // Reference: jsts BufferOp, JOIN_MITRE with the same mitre limit. Every corner is 90° or 270°, so the
    // offset corners fall on the 1/16 in. grid shifted by d and both libraries represent them exactly.
    fc.assert(
      fc.property(skylinePolygon, fc.constantFrom(0.25, 0.375, 0.5), (ring, d) => {
        const ours = polygonArea(offsetPolygon(ring, d, 'mitre'));
        const theirs = jstsBufferArea(ring, d, jstsBufferParameters('mitre', MITRE_LIMIT));
        expect(Math.abs(ours - theirs)).toBeLessThanOrEqual(1e-4);
      }),
      { numRuns: 200 },
    );
  });

  it('agrees with jsts (JTS port) mitre buffers on random star-shaped polygons, up to coordinate rounding', () => {
    // Reference: jsts BufferOp, JOIN_MITRE with the same mitre limit, input on the same integer grid.
    // clipper-lib rounds to its grid (1/CLIPPER_SCALE in.) twice: the offset edge ends, then the points
    // where offset edges cross (at concave corners). Each rounding moves a point by up to √2/2 grid steps,
    // and a crossing of two nearly parallel edges can move further; we allow 3 grid steps (3e-4 in.) per
    // vertex and that displacement times the perimeter for the area. (On polygons a few inches across the
    // median area difference measured here is about 1e-4 sq in.; 1e-4 sq in. for every polygon is only
    // reachable where the corners fall on the grid, as in the orthogonal case above.)
    fc.assert(
      fc.property(starPolygon, fc.constantFrom(0.25, 0.375, 0.5), (ring, d) => {
        fc.pre(mitresWithin(ring, MITRE_LIMIT * 0.9));
        const params = jstsBufferParameters('mitre', MITRE_LIMIT);
        const ours = offsetPolygon(ring, d, 'mitre');
        const theirs = jstsBufferRing(ring, d, params);
        for (const p of ours) expect(distanceToRing(p, theirs)).toBeLessThanOrEqual(3 / CLIPPER_SCALE);
        const bound = (polygonPerimeter(ours) * 3) / CLIPPER_SCALE;
        expect(Math.abs(polygonArea(ours) - jstsBufferArea(ring, d, params))).toBeLessThanOrEqual(bound);
      }),
      { numRuns: 200 },
    );
  });

  it('every outward offset contains the original, at least d from each of its vertices', () => {
    fc.assert(
      fc.property(starPolygon, fc.double({ min: 0.05, max: 1, noNaN: true }), fc.constantFrom('mitre' as const, 'round' as const), (ring, d, join) => {
        const out = offsetPolygon(ring, d, join);
        for (const p of ring) {
          expect(pointInPolygon(p, out)).toBe(true);
          // Each original vertex keeps at least d to the cutting line, less the grid rounding and, for round
          // joins, the chords' sagitta. clipper-lib rounds the number of chords per corner to the nearest whole
          // number, so a chord's angle can be up to 3/2 of the one the tolerance asks for and its sagitta up to
          // (3/2)² times the tolerance (read from ClipperOffset.DoRound in clipper-lib 6.4.2). The grid rounding
          // is up to two steps: each point moves by up to √2/2 step, and at a corner turning by less than
          // 1/d rad (d in grid steps) ClipperOffset.OffsetPoint keeps the earlier edge's offset point, up to one
          // step off the next edge's offset line.
          const slack = 2 / CLIPPER_SCALE + (join === 'round' ? 2.25 * CHORD_TOLERANCE_IN : 0);
          expect(distanceToRing(p, out)).toBeGreaterThanOrEqual(d - slack);
        }
        expect(polygonArea(out)).toBeGreaterThan(polygonArea(ring));
      }),
      { numRuns: 200 },
    );
  });

  it('rejects a distance that is not a finite number', () => {
    expect(() => offsetPolygon(square3, Number.NaN)).toThrow(RangeError);
  });
});

describe('sectionSeamAllowance', () => {
  const arcSection: Pick<Section, 'geometry'> = {
    geometry: { kind: 'arc', centre: { x: 13, y: 13 }, innerRadiusIn: 5, outerRadiusIn: 8, startAngleDeg: -112.5, sweepDeg: 45 },
  };
  const wedgeSection: Pick<Section, 'geometry'> = {
    geometry: { kind: 'wedge', centre: { x: 13, y: 13 }, radiusIn: 5, startAngleDeg: 10, sweepDeg: 45 },
  };

  it.each([0.25, 0.375, 0.75 / 2.54])('cutting line of an arc section stays within the chord tolerance of r ± %f in.', (d) => {
    // Reference: the exact offset of an arc of radius r by d is the arc of radius r ± d (concentric
    // circles); the cutting line may stray from it by at most the chord tolerance (docs/design-notes.md#seam-allowance).
    const g = arcSection.geometry as Extract<Section['geometry'], { kind: 'arc' }>;
    const { cuttingLine } = sectionSeamAllowance(arcSection, d);
    let outer = 0;
    let inner = 0;
    for (const p of cuttingLine) {
      const a = angleFrom(p, g.centre, g.startAngleDeg - 90);
      // Vertices beside the arcs (not the corner mitres, which lie outside the sweep).
      if (a <= g.startAngleDeg || a >= g.startAngleDeg + g.sweepDeg) continue;
      const r = Math.hypot(p.x - g.centre.x, p.y - g.centre.y);
      const target = r > (g.innerRadiusIn + g.outerRadiusIn) / 2 ? g.outerRadiusIn + d : g.innerRadiusIn - d;
      if (target > g.innerRadiusIn) outer++;
      else inner++;
      expect(Math.abs(r - target)).toBeLessThanOrEqual(CHORD_TOLERANCE_IN);
    }
    // Both arcs were really checked, with many vertices each.
    expect(outer).toBeGreaterThan(10);
    expect(inner).toBeGreaterThan(10);
  });

  it('cutting line of a wedge stays within the chord tolerance of r + d on its arc', () => {
    const g = wedgeSection.geometry as Extract<Section['geometry'], { kind: 'wedge' }>;
    const d = 0.25;
    let checked = 0;
    for (const p of sectionCuttingLine(wedgeSection, d)) {
      const a = angleFrom(p, g.centre, g.startAngleDeg - 90);
      const r = Math.hypot(p.x - g.centre.x, p.y - g.centre.y);
      if (a <= g.startAngleDeg || a >= g.startAngleDeg + g.sweepDeg || r < g.radiusIn) continue;
      checked++;
      expect(Math.abs(r - (g.radiusIn + d))).toBeLessThanOrEqual(CHORD_TOLERANCE_IN);
    }
    expect(checked).toBeGreaterThan(10);
  });

  it('the sewing line is the outline and lies inside the cutting line', () => {
    const result = sectionSeamAllowance(arcSection, 0.25);
    for (const p of result.sewingLine) expect(pointInPolygon(p, result.cuttingLine)).toBe(true);
    // Annular sector area θ(R² − r²)/2 (CRC Standard Mathematical Tables), less the chord segments.
    const exact = ((Math.PI / 4) * (64 - 25)) / 2;
    expect(polygonArea(result.sewingLine)).toBeLessThan(exact);
    expect(polygonArea(result.sewingLine)).toBeGreaterThan(exact - CHORD_TOLERANCE_IN * (Math.PI / 4) * 13);
  });

  it('a full ring (annulus) gets a cutting line outside and a hole cutting line inside', () => {
    const ring: Pick<Section, 'geometry'> = {
      geometry: { kind: 'arc', centre: { x: 0, y: 0 }, innerRadiusIn: 4, outerRadiusIn: 6, startAngleDeg: 0, sweepDeg: 360 },
    };
    const result = sectionSeamAllowance(ring, 0.25);
    expect(result.holes).toHaveLength(1);
    for (const p of result.cuttingLine) expect(Math.abs(Math.hypot(p.x, p.y) - 6.25)).toBeLessThanOrEqual(CHORD_TOLERANCE_IN);
    for (const p of result.holes[0].cuttingLine) expect(Math.abs(Math.hypot(p.x, p.y) - 3.75)).toBeLessThanOrEqual(CHORD_TOLERANCE_IN);
  });

  it('returns the same lines from its cache without sharing arrays', () => {
    const a = sectionSeamAllowance(arcSection, 0.25);
    a.cuttingLine[0].x = 999;
    const b = sectionSeamAllowance(arcSection, 0.25);
    expect(b.cuttingLine[0].x).not.toBe(999);
    expect(sectionSeamAllowance(arcSection, 0.375).cuttingLine).not.toEqual(b.cuttingLine);
  });

  it('rejects a negative allowance', () => {
    expect(() => sectionSeamAllowance(arcSection, -0.25)).toThrow(RangeError);
  });
});
