import { describe, expect, it } from 'vitest';
import { locatePoint, pointInPolygon, polygonArea, polygonBounds, polygonCentroid, polygonPerimeter, signedArea } from './polygon';

const square = [{ x: 0, y: 0 }, { x: 3, y: 0 }, { x: 3, y: 3 }, { x: 0, y: 3 }];
// An L of a 4 × 2 bar and a 2 × 2 foot: area 12, centroid by splitting into rectangles (8 at (2,1), 4 at (1,3)).
const ell = [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 2 }, { x: 2, y: 2 }, { x: 2, y: 4 }, { x: 0, y: 4 }];

describe('polygon basics', () => {
  it('measures area by the shoelace formula, sign by winding', () => {
    expect(polygonArea(square)).toBe(9);
    // Going +x then +y turns from +x towards +y: positive in the document's convention.
    expect(signedArea(square)).toBe(9);
    expect(signedArea([...square].reverse())).toBe(-9);
    // Triangle with base 5 and height 2: ½·b·h = 5 (elementary geometry).
    expect(polygonArea([{ x: 1, y: 1 }, { x: 6, y: 1 }, { x: 2, y: 3 }])).toBe(5);
    expect(polygonArea(ell)).toBe(12);
  });

  it('finds the area centroid', () => {
    // Triangle centroid is the mean of its vertices (elementary geometry).
    const c = polygonCentroid([{ x: 0, y: 0 }, { x: 6, y: 0 }, { x: 0, y: 3 }]);
    expect(c.x).toBeCloseTo(2, 12);
    expect(c.y).toBeCloseTo(1, 12);
    // L: (8·(2,1) + 4·(1,3)) / 12 = (5/3, 5/3).
    const l = polygonCentroid(ell);
    expect(l.x).toBeCloseTo(5 / 3, 12);
    expect(l.y).toBeCloseTo(5 / 3, 12);
    // Far from the origin the result is still accurate.
    const far = polygonCentroid(square.map((p) => ({ x: p.x + 150, y: p.y - 190 })));
    expect(far.x).toBeCloseTo(151.5, 10);
    expect(far.y).toBeCloseTo(-188.5, 10);
  });

  it('measures perimeter and bounds', () => {
    expect(polygonPerimeter(square)).toBe(12);
    expect(polygonPerimeter(ell)).toBe(16);
    expect(polygonBounds(ell)).toEqual({ minX: 0, minY: 0, maxX: 4, maxY: 4 });
  });

  it('locates points inside, outside and on the boundary', () => {
    expect(locatePoint({ x: 1, y: 1 }, ell)).toBe('inside');
    expect(locatePoint({ x: 3, y: 3 }, ell)).toBe('outside'); // in the notch of the L
    expect(locatePoint({ x: 2, y: 3 }, ell)).toBe('boundary');
    expect(locatePoint({ x: 4, y: 0 }, ell)).toBe('boundary');
    expect(pointInPolygon({ x: 2, y: 3 }, ell)).toBe(true);
    expect(pointInPolygon({ x: -0.001, y: 1 }, ell)).toBe(false);
    // Just inside / just outside the boundary tolerance.
    expect(locatePoint({ x: 3.0000001, y: 1 }, square, 1e-6)).toBe('boundary');
    expect(locatePoint({ x: 3.00001, y: 1 }, square, 1e-6)).toBe('outside');
  });

  it('does not change its input', () => {
    const copy = structuredClone(ell);
    polygonCentroid(ell);
    polygonArea(ell);
    expect(ell).toEqual(copy);
  });
});
