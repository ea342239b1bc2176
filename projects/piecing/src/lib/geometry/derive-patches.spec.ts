import 'jsts/org/locationtech/jts/monkey.js';
import GeometryFactory from 'jsts/org/locationtech/jts/geom/GeometryFactory.js';
import Coordinate from 'jsts/org/locationtech/jts/geom/Coordinate.js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Point, Section } from '../document/pattern-schema';
import { derivePatches, rememberingDeriver, splitSection } from './derive-patches';
import { flattenSectionOutline } from './section-outline';
import { locatePoint, polygonArea, polygonCentroid } from './polygon';
import { findSelfCrossing } from './self-crossing';
import { distanceToSegment } from './vector';

// jsts (a port of the JTS Topology Suite) as an independent reference for areas of cut-off pieces.
const factory = new GeometryFactory();
const jstsPolygon = (ring: Point[]) =>
  factory.createPolygon(factory.createLinearRing([...ring, ring[0]].map((p) => new Coordinate(p.x, p.y))));
/** Area of `ring` on the left of the directed line a → b (cross(b − a, p − a) > 0), by jsts. */
function jstsAreaLeftOf(ring: Point[], a: Point, b: Point): number {
  const len = Math.hypot(b.x - a.x, b.y - a.y);
  const u = { x: ((b.x - a.x) / len) * 1000, y: ((b.y - a.y) / len) * 1000 };
  const n = { x: -u.y, y: u.x };
  const half = [
    { x: a.x - u.x, y: a.y - u.y },
    { x: a.x + u.x, y: a.y + u.y },
    { x: a.x + u.x + n.x, y: a.y + u.y + n.y },
    { x: a.x - u.x + n.x, y: a.y - u.y + n.y },
  ];
  return jstsPolygon(ring).intersection(jstsPolygon(half)).getArea();
}

const square = (sizeIn: number): Section['geometry'] => ({
  kind: 'straight',
  vertices: [{ x: 0, y: 0 }, { x: sizeIn, y: 0 }, { x: sizeIn, y: sizeIn }, { x: 0, y: sizeIn }],
});
const section = (over: Partial<Section>): Section => ({ id: 'a', label: 'A', geometry: square(6), seams: [], patches: [], ...over });

describe('derivePatches', () => {
  it('splits in document order and numbers by anchors', () => {
    const { patches, problems } = derivePatches(
      section({
        seams: [
          { id: 's1', a: { x: 2, y: 0 }, b: { x: 2, y: 6 } },
          { id: 's2', a: { x: 2, y: 3 }, b: { x: 6, y: 3 } },
        ],
        patches: [
          { number: 1, anchor: { x: 1, y: 1 }, fabricId: 'ink' },
          { number: 2, anchor: { x: 4, y: 1 } },
          { number: 3, anchor: { x: 4, y: 5 } },
        ],
      }),
    );
    expect(problems).toEqual([]);
    expect(patches.map((p) => p.label)).toEqual(['A1', 'A2', 'A3']);
    expect(patches.map((p) => polygonArea(p.polygon))).toEqual([12, 12, 12]);
    expect(patches[0].fabricId).toBe('ink');
    expect(locatePoint({ x: 4, y: 5 }, patches[2].polygon)).toBe('inside');
  });

  it('gives the whole outline as one patch when there are no seams', () => {
    const { patches } = derivePatches(section({}));
    expect(patches).toHaveLength(1);
    expect(patches[0]).toMatchObject({ number: 1, label: 'A1' });
    expect(polygonArea(patches[0].polygon)).toBe(36);
  });

  it('reports a seam that stops short with its id and the gap, and does not split that patch', () => {
    const { patches, problems } = derivePatches(section({ seams: [{ id: 'short', a: { x: 3, y: 0 }, b: { x: 3, y: 5 } }] }));
    expect(patches).toHaveLength(1);
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatchObject({ kind: 'seam-stops-short', seamId: 'short', point: { x: 3, y: 5 } });
    expect(problems[0].message).toContain('1.000 in. short');
    expect(problems[0].message).toContain('(3, 5)');
  });

  it('reports a seam that crosses nothing', () => {
    const outside = derivePatches(section({ seams: [{ id: 'far', a: { x: 10, y: 0 }, b: { x: 10, y: 6 } }] }));
    expect(outside.problems.map((p) => [p.kind, p.seamId])).toEqual([['seam-crosses-nothing', 'far']]);
    const alongEdge = derivePatches(section({ seams: [{ id: 'edge', a: { x: 0, y: 0 }, b: { x: 6, y: 0 } }] }));
    expect(alongEdge.problems.map((p) => p.kind)).toEqual(['seam-crosses-nothing']);
    const twice = derivePatches(section({ seams: [{ id: 'x1', a: { x: 3, y: 0 }, b: { x: 3, y: 6 } }, { id: 'x2', a: { x: 3, y: 6 }, b: { x: 3, y: 0 } }] }));
    expect(twice.patches).toHaveLength(2);
    expect(twice.problems.map((p) => p.seamId)).toEqual(['x2']);
  });

  it('accepts seam ends within the reach tolerance (0.01 in.) and overshoots; not beyond', () => {
    const near = derivePatches(section({ seams: [{ id: 's', a: { x: 3, y: 0.009 }, b: { x: 3, y: 5.991 } }] }));
    expect(near.problems).toEqual([]);
    expect(near.patches.map((p) => polygonArea(p.polygon)).sort()).toEqual([18, 18]);
    const over = derivePatches(section({ seams: [{ id: 's', a: { x: 3, y: -2 }, b: { x: 3, y: 9 } }] }));
    expect(over.patches).toHaveLength(2);
    const tooShort = derivePatches(section({ seams: [{ id: 's', a: { x: 3, y: 0.011 }, b: { x: 3, y: 6 } }] }));
    expect(tooShort.patches).toHaveLength(1);
    expect(tooShort.problems[0].kind).toBe('seam-stops-short');
  });

  it('numbers unassigned patches with the lowest free numbers and reports stray anchors', () => {
    const { patches, problems } = derivePatches(
      section({
        seams: [
          { id: 's1', a: { x: 2, y: 0 }, b: { x: 2, y: 6 } },
          { id: 's2', a: { x: 4, y: 0 }, b: { x: 4, y: 6 } },
        ],
        patches: [
          { number: 2, anchor: { x: 5, y: 1 } },
          { number: 7, anchor: { x: 5, y: 2 } },
          { number: 9, anchor: { x: 50, y: 2 } },
        ],
      }),
    );
    expect(patches.map((p) => p.number)).toEqual([1, 2, 3]);
    expect(locatePoint({ x: 5, y: 1 }, patches[1].polygon)).toBe('inside');
    expect(problems.map((p) => [p.kind, p.patchNumber])).toEqual([['anchor-shared', 7], ['anchor-outside', 9]]);
  });

  it('splits corner to corner and along the continuation of an edge', () => {
    const diagonal = derivePatches(section({ seams: [{ id: 'd', a: { x: 0, y: 0 }, b: { x: 6, y: 6 } }] }));
    expect(diagonal.problems).toEqual([]);
    expect(diagonal.patches.map((p) => [p.polygon.length, polygonArea(p.polygon)])).toEqual([[3, 18], [3, 18]]);
    // An L whose inner edge y = 2 is carried on across the inside by the seam.
    const ell: Section['geometry'] = { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 2 }, { x: 2, y: 2 }, { x: 2, y: 4 }, { x: 0, y: 4 }] };
    const along = derivePatches(section({ geometry: ell, seams: [{ id: 'e', a: { x: 4, y: 2 }, b: { x: 0, y: 2 } }] }));
    expect(along.problems).toEqual([]);
    expect(along.patches.map((p) => polygonArea(p.polygon)).sort((a, b) => a - b)).toEqual([4, 8]);
  });

  it('splits a U-shaped patch crossed twice by one seam into three', () => {
    const u: Section['geometry'] = { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 1, y: 3 }, { x: 2, y: 3 }, { x: 2, y: 0 }, { x: 3, y: 0 }, { x: 3, y: 4 }, { x: 0, y: 4 }] };
    const { patches, problems } = derivePatches(section({ geometry: u, seams: [{ id: 's', a: { x: 0, y: 1 }, b: { x: 3, y: 1 } }] }));
    expect(problems).toEqual([]);
    expect(patches.map((p) => polygonArea(p.polygon)).sort((a, b) => a - b)).toEqual([1, 1, 7]); // 3 × 4 less the 1 × 3 notch is 9: two 1 × 1 feet and 7 above
  });

  it('splits an arc section radially; patch areas sum to the section area', () => {
    const centre = { x: 12, y: 12 };
    const arc: Section['geometry'] = { kind: 'arc', centre, innerRadiusIn: 5, outerRadiusIn: 8, startAngleDeg: 0, sweepDeg: 45 };
    const ray = (deg: number, r: number) => ({ x: centre.x + r * Math.cos((deg * Math.PI) / 180), y: centre.y + r * Math.sin((deg * Math.PI) / 180) });
    const { patches, problems } = derivePatches(section({ geometry: arc, seams: [{ id: 'r1', a: ray(15, 4.9), b: ray(15, 8.1) }, { id: 'r2', a: ray(30, 4.9), b: ray(30, 8.1) }] }));
    expect(problems).toEqual([]);
    expect(patches).toHaveLength(3);
    const total = patches.reduce((s, p) => s + polygonArea(p.polygon), 0);
    expect(total).toBeCloseTo(polygonArea(flattenSectionOutline(arc)), 9);
    // Each 15° piece is within the chord tolerance of θ(R² − r²)/2 (CRC Standard Mathematical Tables).
    const exact = ((Math.PI / 12) * (64 - 25)) / 2;
    for (const p of patches) expect(Math.abs(polygonArea(p.polygon) - exact)).toBeLessThan(0.002 * 13 * (Math.PI / 12) + 0.002 * 3);
  });

  it('property: patches partition a convex section and match jsts half-plane areas', () => {
    const point = fc.record({ x: fc.double({ min: 0.5, max: 9.5, noNaN: true }), y: fc.double({ min: 0.5, max: 9.5, noNaN: true }) });
    const angle = fc.double({ min: 0, max: Math.PI, noNaN: true });
    fc.assert(
      fc.property(fc.integer({ min: 3, max: 12 }), fc.array(fc.tuple(point, angle), { minLength: 1, maxLength: 6 }), (sides, cuts) => {
        // A regular polygon of radius 5 centred in a 10 in. square: convex, contains every cut point.
        const ring = Array.from({ length: sides }, (_, i) => ({ x: 5 + 5 * Math.cos((2 * Math.PI * i) / sides), y: 5 + 5 * Math.sin((2 * Math.PI * i) / sides) }));
        const seams = cuts.map(([p, a], i) => ({ id: `s${i}`, a: { x: p.x - 30 * Math.cos(a), y: p.y - 30 * Math.sin(a) }, b: { x: p.x + 30 * Math.cos(a), y: p.y + 30 * Math.sin(a) } }));
        const sec = section({ geometry: { kind: 'straight', vertices: ring }, seams });
        const { polygons } = splitSection(sec);
        const total = polygons.reduce((s, poly) => s + polygonArea(poly), 0);
        expect(total).toBeCloseTo(polygonArea(ring), 9);
        for (const poly of polygons) {
          expect(poly.length).toBeGreaterThanOrEqual(3);
          expect(findSelfCrossing(poly)).toBeNull();
        }
        // The first seam alone: both pieces equal jsts' intersections with the half-planes.
        const first = splitSection({ ...sec, seams: seams.slice(0, 1) }).polygons;
        if (first.length === 2) {
          const { a, b } = seams[0];
          const left = first.find((poly) => {
            const c = polygonCentroid(poly);
            return (b.x - a.x) * (c.y - a.y) - (b.y - a.y) * (c.x - a.x) > 0;
          })!;
          expect(polygonArea(left)).toBeCloseTo(jstsAreaLeftOf(ring, a, b), 9);
        }
      }),
      { numRuns: 200 },
    );
  });

  it('property: random seams and anchors never make it throw; every problem names a seam or a patch', () => {
    const point = fc.record({ x: fc.double({ min: -5, max: 15, noNaN: true }), y: fc.double({ min: -5, max: 15, noNaN: true }) });
    fc.assert(
      fc.property(fc.array(fc.tuple(point, point), { maxLength: 8 }), fc.array(point, { maxLength: 5 }), (segments, anchors) => {
        const sec = section({
          geometry: { kind: 'wedge', centre: { x: 5, y: 5 }, radiusIn: 5, startAngleDeg: 10, sweepDeg: 250 },
          seams: segments.map(([a, b], i) => ({ id: `s${i}`, a, b })),
          patches: anchors.map((anchor, i) => ({ number: i + 1, anchor })),
        });
        const { patches, problems } = derivePatches(sec);
        expect(new Set(patches.map((p) => p.number)).size).toBe(patches.length);
        const total = patches.reduce((s, p) => s + polygonArea(p.polygon), 0);
        expect(total).toBeCloseTo(polygonArea(flattenSectionOutline(sec.geometry)), 6);
        for (const p of problems) expect(p.seamId ?? p.patchNumber).toBeDefined();
      }),
      { numRuns: 200 },
    );
  });

  it('gives patches of a fan from one corner distinct identities and label points inside each', () => {
    // Two seams fanning from (0,0) across an 8 in. square: three triangles-and-quads that share the
    // first point and the last x, which once made two of them look the same.
    const fan = section({
      geometry: square(8),
      seams: [
        { id: 's1', a: { x: 0, y: 0 }, b: { x: 8, y: 2 } },
        { id: 's2', a: { x: 0, y: 0 }, b: { x: 8, y: 4 } },
      ],
    });
    const { patches, problems } = derivePatches(fan);
    expect(problems).toEqual([]);
    expect(patches.map((p) => p.index).sort()).toEqual([0, 1, 2]);
    // Areas by the shoelace formula on the known vertices: 0.5·8·2, 0.5·8·2, 64 − 16.
    const areaByIndex = [...patches].sort((a, b) => a.index - b.index).map((p) => polygonArea(p.polygon));
    expect(areaByIndex.slice().sort((a, b) => a - b)).toEqual([8, 8, 48]);
    for (const p of patches) {
      expect(locatePoint(p.labelPoint, p.polygon)).toBe('inside');
      for (const q of patches) if (q !== p) expect(locatePoint(p.labelPoint, q.polygon)).toBe('outside');
    }
    // The identity is the split order: the same split gives the same index for the same polygon.
    const { polygons } = splitSection(fan);
    for (const p of patches) expect(polygons[p.index]).toEqual(p.polygon);
  });

  it('keeps identities when numbers change, and numbers a given split without splitting again', () => {
    const base = section({ seams: [{ id: 's1', a: { x: 2, y: 0 }, b: { x: 2, y: 6 } }] });
    const split = splitSection(base);
    const renumbered = { ...base, patches: [{ number: 1, anchor: { x: 4, y: 3 } }, { number: 2, anchor: { x: 1, y: 3 } }] };
    const a = derivePatches(base).patches;
    const b = derivePatches(renumbered, { split }).patches;
    const byIndex = (ps: typeof a) => Object.fromEntries(ps.map((p) => [p.index, p.label]));
    const right = split.polygons.findIndex((ring) => locatePoint({ x: 4, y: 3 }, ring) === 'inside');
    // Unassigned patches are numbered in split order; the assignments swap the numbers, not the identities.
    expect(byIndex(a)).toEqual({ 0: 'A1', 1: 'A2' });
    expect(byIndex(b)).toEqual({ [right]: 'A1', [1 - right]: 'A2' });
    expect(b.find((p) => p.label === 'A1')!.polygon).toEqual(a.find((p) => p.index === right)!.polygon);
    expect(b.find((p) => p.index === 1)!.polygon).toBe(split.polygons[1]);
  });

  it('puts the label point of an L-shaped patch inside it, where the centroid is not', () => {
    // An L: 6 × 6 square without its 5 × 5 top-right part. Centroid (by the composite-area formula)
    // lies outside. The pole of inaccessibility is the centre of the largest circle inside: in the corner
    // block, touching x = 0, y = 6 and the reflex corner (1, 5), so r = √2·(1 − r), r = 2 − √2.
    const ell = section({
      geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 1, y: 5 }, { x: 6, y: 5 }, { x: 6, y: 6 }, { x: 0, y: 6 }] },
    });
    const [p] = derivePatches(ell).patches;
    expect(locatePoint(polygonCentroid(p.polygon), p.polygon)).toBe('outside');
    expect(locatePoint(p.labelPoint, p.polygon)).toBe('inside');
    const ring = p.polygon;
    const clearance = Math.min(...ring.map((a, i) => distanceToSegment(p.labelPoint, a, ring[(i + 1) % ring.length])));
    // polylabel's result is within the precision (0.05 in.) of the best clearance.
    expect(clearance).toBeGreaterThan(2 - Math.SQRT2 - 0.05);
    expect(clearance).toBeLessThanOrEqual(2 - Math.SQRT2 + 1e-9);
  });
});

describe('rememberingDeriver', () => {
  const split = section({
    seams: [{ id: 's1', a: { x: 2, y: 0 }, b: { x: 2, y: 6 } }],
    patches: [{ number: 2, anchor: { x: 1, y: 1 } }],
  });

  it('gives what derivePatches gives, deriving each section once', () => {
    const derive = rememberingDeriver();
    const first = derive(split);
    expect(first).toEqual(derivePatches(split));
    expect(first.patches.map((p) => p.label)).toEqual(['A1', 'A2']);
    expect(derive(split)).toBe(first);
  });

  it('derives an equal but separate section afresh, and each deriver keeps its own results', () => {
    const derive = rememberingDeriver();
    const copy = structuredClone(split);
    expect(derive(copy)).not.toBe(derive(split));
    expect(derive(copy)).toEqual(derive(split));
    expect(rememberingDeriver()(split)).not.toBe(derive(split));
  });
});
