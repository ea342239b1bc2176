import { describe, expect, it } from 'vitest';
import { segmentIntersection } from './segment';
import { cleanRing } from './clean-ring';
import { findSelfCrossing } from './self-crossing';

describe('segmentIntersection', () => {
  it('finds a crossing with its positions along both segments', () => {
    const hit = segmentIntersection({ x: 0, y: 0 }, { x: 4, y: 4 }, { x: 0, y: 4 }, { x: 4, y: 0 });
    expect(hit).toEqual({ kind: 'point', point: { x: 2, y: 2 }, tA: 0.5, tB: 0.5 });
  });
  it('reports none for separate and parallel segments', () => {
    expect(segmentIntersection({ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 2, y: -1 }, { x: 2, y: 1 }).kind).toBe('none');
    expect(segmentIntersection({ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 0, y: 1 }, { x: 4, y: 1 }).kind).toBe('none');
  });
  it('reports a shared end point and a collinear overlap', () => {
    const touch = segmentIntersection({ x: 0, y: 0 }, { x: 2, y: 0 }, { x: 2, y: 0 }, { x: 2, y: 3 });
    expect(touch.kind).toBe('point');
    const overlap = segmentIntersection({ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 3, y: 0 }, { x: 6, y: 0 });
    expect(overlap).toEqual({ kind: 'overlap', from: { x: 3, y: 0 }, to: { x: 4, y: 0 } });
  });
});

describe('cleanRing', () => {
  it('drops the closing point, duplicates and collinear points', () => {
    const ring = [
      { x: 0, y: 0 }, { x: 1, y: 0 }, { x: 1, y: 0 }, { x: 2, y: 0 }, { x: 2, y: 2 }, { x: 0, y: 2 }, { x: 0, y: 1 }, { x: 0, y: 0 },
    ];
    expect(cleanRing(ring)).toEqual([{ x: 0, y: 0 }, { x: 2, y: 0 }, { x: 2, y: 2 }, { x: 0, y: 2 }]);
  });
  it('removes a zero-width spike', () => {
    const ring = [{ x: 0, y: 0 }, { x: 2, y: 0 }, { x: 3, y: 0 }, { x: 2, y: 0 }, { x: 2, y: 2 }, { x: 0, y: 2 }];
    expect(cleanRing(ring)).toEqual([{ x: 0, y: 0 }, { x: 2, y: 0 }, { x: 2, y: 2 }, { x: 0, y: 2 }]);
  });
  it('keeps a point just outside the collinearity tolerance and drops one just inside', () => {
    const ring = (dy: number) => [{ x: 0, y: 0 }, { x: 1, y: dy }, { x: 2, y: 0 }, { x: 1, y: 2 }];
    expect(cleanRing(ring(1e-3), 1e-4)).toHaveLength(4);
    expect(cleanRing(ring(1e-5), 1e-4)).toHaveLength(3);
  });
  it('returns fewer than three points for a ring with no area', () => {
    expect(cleanRing([{ x: 0, y: 0 }, { x: 1, y: 1 }, { x: 2, y: 2 }]).length).toBeLessThan(3);
  });
});

describe('findSelfCrossing', () => {
  it('finds where a bow tie crosses itself', () => {
    const crossing = findSelfCrossing([{ x: 0, y: 0 }, { x: 2, y: 2 }, { x: 2, y: 0 }, { x: 0, y: 2 }]);
    expect(crossing).not.toBeNull();
    expect(crossing!.point.x).toBeCloseTo(1, 12);
    expect(crossing!.point.y).toBeCloseTo(1, 12);
    expect([crossing!.edgeA, crossing!.edgeB]).toEqual([0, 2]);
  });
  it('accepts simple rings, convex or not', () => {
    expect(findSelfCrossing([{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 2 }, { x: 2, y: 2 }, { x: 2, y: 4 }, { x: 0, y: 4 }])).toBeNull();
  });
  it('finds a vertex touching another edge', () => {
    const crossing = findSelfCrossing([{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 2, y: 2 }, { x: 4, y: 4 }, { x: 0, y: 4 }, { x: 2, y: 0 }]);
    expect(crossing).not.toBeNull();
  });
});
