import { describe, expect, it } from 'vitest';
import type { Point, Section, StraightGeometry } from '../document/pattern-schema';
import { CHORD_TOLERANCE_IN } from '../tolerance';
import { bulgeToSweepRad, edgeArc, flattenStraightEdges, sectionEdges, straightSectionSignedArea, sweepRadToBulge } from './curved-edge';
import { circlesOfSections, circlesThrough, edgesOnCircles, fitEdgeToCircle } from './edge-circles';
import { polygonArea, signedArea } from './polygon';
import { expandRingRepeat } from './ring-repeat';
import { exactSectionArea, flattenSectionOutline } from './section-outline';
import { distance } from './vector';

const QUARTER_TURN_BULGE = Math.tan(Math.PI / 8); // tan(90°/4)

/**
 * A square of side s, top-left at the origin, with its top-left corner cut by a quarter circle of radius
 * r about the origin, curving into the square (concave). With r = s the curve runs corner to corner.
 * Vertices wind clockwise on screen (positive signed area), so the concave edge has a negative bulge.
 */
function squareWithConcaveCorner(s: number, r: number): StraightGeometry {
  if (r === s) return { kind: 'straight', vertices: [{ x: s, y: 0 }, { x: s, y: s }, { x: 0, y: s }], bulges: [0, 0, -QUARTER_TURN_BULGE] };
  return {
    kind: 'straight',
    vertices: [{ x: r, y: 0 }, { x: s, y: 0 }, { x: s, y: s }, { x: 0, y: s }, { x: 0, y: r }],
    bulges: [0, 0, 0, 0, -QUARTER_TURN_BULGE],
  };
}

/** The same outline wound the other way: vertices reversed, each edge's bulge negated. */
function reversed(g: StraightGeometry): StraightGeometry {
  const n = g.vertices.length;
  const vertices = [...g.vertices].reverse();
  // Reversed edge k runs from old vertex n−1−k to old vertex n−2−k: it is old edge n−2−k, walked backwards.
  const bulges = vertices.map((_, k) => -(g.bulges?.[(2 * n - 2 - k) % n] ?? 0));
  return { kind: 'straight', vertices, bulges };
}

function maxDistanceFromCircle(points: readonly Point[], centre: Point, radiusIn: number): number {
  return Math.max(...points.map((p) => Math.abs(distance(p, centre) - radiusIn)));
}

describe('curved edges of straight sections', () => {
  it('bulge and sweep convert both ways: b = tan(θ/4)', () => {
    expect(bulgeToSweepRad(1)).toBeCloseTo(Math.PI, 15);
    expect(bulgeToSweepRad(-QUARTER_TURN_BULGE)).toBeCloseTo(-Math.PI / 2, 15);
    expect(sweepRadToBulge(Math.PI / 3)).toBeCloseTo(Math.tan(Math.PI / 12), 15);
  });

  it('the arc of an edge passes through both ends and turns the signed way', () => {
    const from = { x: 0, y: 4 };
    const to = { x: 4, y: 0 };
    const arc = edgeArc(from, to, -QUARTER_TURN_BULGE)!;
    expect(arc.centre.x).toBeCloseTo(0, 12);
    expect(arc.centre.y).toBeCloseTo(0, 12);
    expect(arc.radiusIn).toBeCloseTo(4, 12);
    expect(arc.sweepRad).toBeCloseTo(-Math.PI / 2, 12);
    // From 90° (pointing down the screen) back to 0°.
    expect(arc.startRad).toBeCloseTo(Math.PI / 2, 12);
    // The other sign puts the centre on the other side of the chord, at (4, 4).
    const other = edgeArc(from, to, QUARTER_TURN_BULGE)!;
    expect(other.centre.x).toBeCloseTo(4, 12);
    expect(other.centre.y).toBeCloseTo(4, 12);
    expect(edgeArc(from, to, 0)).toBeNull();
  });

  it.each([
    [4, 4],
    [4, 2.5],
    [6.5, 6.5],
  ])('a %s in. square with a concave quarter circle of radius %s in. has area s² − πr²/4', (s, r) => {
    // Standard mensuration: a square less a quarter disc, s² − πr²/4 (a quarter of the circle area πr²).
    const g = squareWithConcaveCorner(s, r);
    const expected = s * s - (Math.PI * r * r) / 4;
    expect(exactSectionArea(g)).toBeCloseTo(expected, 12);
    expect(straightSectionSignedArea(g)).toBeCloseTo(expected, 12);
    // Wound the other way, the same shape: negative signed area, same size.
    expect(straightSectionSignedArea(reversed(g))).toBeCloseTo(-expected, 12);
    expect(exactSectionArea(reversed(g))).toBeCloseTo(expected, 12);
    // The flattened outline's chords cut a little less off the square (they run inside the circle), at
    // most the chord tolerance times the arc length πr/2.
    const flat = flattenSectionOutline(g);
    const area = polygonArea(flat);
    expect(area).toBeGreaterThan(expected);
    expect(area - expected).toBeLessThan(CHORD_TOLERANCE_IN * ((Math.PI * r) / 2));
    expect(signedArea(flat)).toBeGreaterThan(0);
    expect(polygonArea(flattenSectionOutline(reversed(g)))).toBeCloseTo(area, 12);
    // Every point of the outline not on the square's sides lies on the quarter circle.
    const onCurve = flat.filter((p) => p.x < s - 1e-9 && p.y < s - 1e-9 && (p.x > 1e-9 || p.y > 1e-9) && !(p.y === 0 && p.x >= r) && !(p.x === 0 && p.y >= r));
    expect(onCurve.length).toBeGreaterThan(10);
    expect(maxDistanceFromCircle(onCurve, { x: 0, y: 0 }, r)).toBeLessThan(1e-12);
  });

  it('a square with a convex half circle on one side has area s² + π(s/2)²/2', () => {
    // Standard mensuration: square plus a half disc of diameter s. Top edge (0,0)→(4,0), bulge 1 (upward).
    const s = 4;
    const g: StraightGeometry = { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: s, y: 0 }, { x: s, y: s }, { x: 0, y: s }], bulges: [1, 0, 0, 0] };
    const expected = s * s + (Math.PI * (s / 2) ** 2) / 2;
    expect(exactSectionArea(g)).toBeCloseTo(expected, 12);
    const flat = flattenSectionOutline(g);
    expect(Math.min(...flat.map((p) => p.y))).toBeCloseTo(-s / 2, 5);
    expect(expected - polygonArea(flat)).toBeGreaterThan(0);
    expect(expected - polygonArea(flat)).toBeLessThan(CHORD_TOLERANCE_IN * Math.PI * (s / 2));
  });

  it('a square with a convex quarter-circle side adds the segment r²(θ − sin θ)/2', () => {
    // Standard mensuration: circular segment of a 90° arc on chord s: r = s/√2, area r²(π/2 − 1)/2.
    const s = 3;
    const g: StraightGeometry = { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: s, y: 0 }, { x: s, y: s }, { x: 0, y: s }], bulges: [0, QUARTER_TURN_BULGE, 0, 0] };
    const r = s / Math.SQRT2;
    expect(exactSectionArea(g)).toBeCloseTo(s * s + (r * r * (Math.PI / 2 - 1)) / 2, 12);
    const arc = sectionEdges(g)[1].arc!;
    expect(arc.centre.x).toBeCloseTo(s / 2, 12);
    expect(arc.centre.y).toBeCloseTo(s / 2, 12);
    // The square's corners are on that circle too (it is the square's circumcircle), and so is every chord end.
    expect(maxDistanceFromCircle(flattenStraightEdges(g), arc.centre, r)).toBeLessThan(1e-12);
  });

  it('flattens a curved edge into as many chords as an arc of the same radius and sweep', () => {
    const g = squareWithConcaveCorner(4, 4);
    // n = ceil(θ / (2·acos(1 − ε/r))) (docs/design-notes.md#arc-flattening): θ = π/2, r = 4, ε = 0.002.
    const n = Math.ceil(Math.PI / 2 / (2 * Math.acos(1 - CHORD_TOLERANCE_IN / 4)) - 1e-9);
    expect(flattenStraightEdges(g)).toHaveLength(3 + n - 1);
    expect(flattenStraightEdges(g, 0.1).length).toBeLessThan(3 + n - 1);
  });

  it('ring-repeat copies keep their curves', () => {
    const section: Section = { id: 'corner', label: 'A', geometry: squareWithConcaveCorner(4, 4), seams: [], patches: [], ringRepeat: { count: 4, centre: { x: 0, y: 0 } } };
    const copies = expandRingRepeat(section);
    for (const copy of copies) {
      expect(exactSectionArea(copy.geometry)).toBeCloseTo(16 - 4 * Math.PI, 12);
      expect(copy.geometry.kind === 'straight' && copy.geometry.bulges).toEqual(section.geometry.kind === 'straight' && section.geometry.bulges);
    }
  });
});

describe('fitting an edge to a circle', () => {
  const ringCentre = { x: 0, y: 0 };

  it('gives a straight corner the bulge that puts its edge on the ring', () => {
    const square: StraightGeometry = { kind: 'straight', vertices: [{ x: 4, y: 0 }, { x: 4, y: 4 }, { x: 0, y: 4 }] };
    const fit = fitEdgeToCircle(square, 2, { centre: ringCentre, radiusIn: 4 });
    if (!fit.ok) throw new Error(fit.message);
    expect(fit.geometry.bulges![2]).toBeCloseTo(-QUARTER_TURN_BULGE, 12);
    expect(fit.geometry.bulges!.slice(0, 2)).toEqual([0, 0]);
    expect(exactSectionArea(fit.geometry)).toBeCloseTo(16 - 4 * Math.PI, 12);
    const arc = sectionEdges(fit.geometry)[2].arc!;
    expect(distance(arc.centre, ringCentre)).toBeLessThan(1e-12);
    expect(square.bulges).toBeUndefined();
  });

  it('moves ends within the tolerance onto the circle and refuses ends farther off, saying how far', () => {
    const near: StraightGeometry = { kind: 'straight', vertices: [{ x: 4.004, y: 0 }, { x: 4, y: 4 }, { x: 0, y: 3.997 }] };
    const fit = fitEdgeToCircle(near, 2, { centre: ringCentre, radiusIn: 4 });
    if (!fit.ok) throw new Error(fit.message);
    expect(fit.geometry.vertices[0]).toEqual({ x: 4, y: 0 });
    expect(fit.geometry.vertices[2].y).toBeCloseTo(4, 12);
    const far: StraightGeometry = { kind: 'straight', vertices: [{ x: 4.5, y: 0 }, { x: 4, y: 4 }, { x: 0, y: 4 }] };
    const refused = fitEdgeToCircle(far, 2, { centre: ringCentre, radiusIn: 4 });
    expect(refused).toEqual({
      ok: false,
      offByIn: 0.5,
      message: 'edge 2 does not end on the circle of radius 4 in. about (0, 0): its end (4.5, 0) is 0.5 in. off (at most 0.01 in. is allowed)',
    });
    expect(fitEdgeToCircle(far, 3, { centre: ringCentre, radiusIn: 4 })).toMatchObject({ ok: false, message: 'there is no edge 3: the outline has edges 0 to 2' });
  });

  it('lists the circles of arc, wedge and curved edges, ring copies included, and finds the one an edge lies on', () => {
    const centre = { x: 10, y: 10 };
    const sections: Section[] = [
      { id: 'hub', label: 'A', geometry: { kind: 'wedge', centre, radiusIn: 3, startAngleDeg: 0, sweepDeg: 90 }, seams: [], patches: [], ringRepeat: { count: 4, centre } },
      { id: 'band', label: 'B', geometry: { kind: 'arc', centre, innerRadiusIn: 3, outerRadiusIn: 5, startAngleDeg: 0, sweepDeg: 90 }, seams: [], patches: [] },
      // A petal turned about another centre: each copy's arc has its own circle.
      { id: 'petal', label: 'C', geometry: { kind: 'arc', centre: { x: 20, y: 10 }, innerRadiusIn: 1, outerRadiusIn: 2, startAngleDeg: 0, sweepDeg: 45 }, seams: [], patches: [], ringRepeat: { count: 2, centre } },
    ];
    const circles = circlesOfSections({ sections });
    expect(circles.map((c) => [c.instanceId, c.edge, c.radiusIn, Math.round(c.centre.x * 1e9) / 1e9])).toEqual([
      ['hub', 'outer', 3, 10],
      ['band', 'outer', 5, 10],
      ['petal', 'outer', 2, 20],
      ['petal', 'inner', 1, 20],
      ['petal_r2', 'outer', 2, 0],
      ['petal_r2', 'inner', 1, 0],
    ]);
    const on = circlesThrough(circles, { x: 15, y: 10 }, { x: 10, y: 15 });
    expect(on.map((c) => c.instanceId)).toEqual(['band']);
    expect(circlesThrough(circles, { x: 15.1, y: 10 }, { x: 10, y: 15 })).toEqual([]);
    // A corner drawn outside the band: its edge from (10, 15) to (15, 10) has both ends on the r = 5 circle.
    const corner: StraightGeometry = { kind: 'straight', vertices: [{ x: 15, y: 10 }, { x: 15, y: 15 }, { x: 10, y: 15 }] };
    const found = edgesOnCircles(corner, circles);
    expect(found.map((f) => [f.edgeIndex, f.circle.instanceId])).toEqual([[2, 'band']]);
    const fit = fitEdgeToCircle(corner, found[0].edgeIndex, found[0].circle);
    if (!fit.ok) throw new Error(fit.message);
    // Standard mensuration: the 5 in. square less a quarter disc of radius 5, 25 − 25π/4.
    expect(exactSectionArea(fit.geometry)).toBeCloseTo(25 - (25 * Math.PI) / 4, 12);
    expect(edgesOnCircles(fit.geometry, circles)).toEqual([]);
  });
});
