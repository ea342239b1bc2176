import { describe, expect, it } from 'vitest';
import type { ArcGeometry, WedgeGeometry } from '../document/pattern-schema';
import { CHORD_TOLERANCE_IN } from '../tolerance';
import { exactSectionArea, flattenSectionOutline, flattenSectionRings } from './section-outline';
import { locatePoint, polygonArea, signedArea } from './polygon';
import { distance } from './vector';

const centre = { x: 13, y: 13 };
const arc: ArcGeometry = { kind: 'arc', centre, innerRadiusIn: 5, outerRadiusIn: 8, startAngleDeg: -90, sweepDeg: 45 };
const wedge: WedgeGeometry = { kind: 'wedge', centre, radiusIn: 5, startAngleDeg: 0, sweepDeg: 45 };

describe('flattenSectionOutline', () => {
  it('cleans a straight outline', () => {
    const ring = flattenSectionOutline({ kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 2, y: 0 }, { x: 2, y: 2 }, { x: 0, y: 2 }, { x: 0, y: 0 }] });
    expect(ring).toEqual([{ x: 0, y: 0 }, { x: 2, y: 0 }, { x: 2, y: 2 }, { x: 0, y: 2 }]);
  });

  it('walks the outer arc, then the inner arc back', () => {
    const ring = flattenSectionOutline(arc);
    // Outer start at −90° (straight up on screen), inner end where the ring closes.
    expect(ring[0].x).toBeCloseTo(13, 12);
    expect(ring[0].y).toBeCloseTo(5, 12);
    const last = ring[ring.length - 1];
    expect(last.x).toBeCloseTo(13, 12);
    expect(last.y).toBeCloseTo(8, 12);
    const onOuter = ring.filter((p) => Math.abs(distance(p, centre) - 8) < 1e-9).length;
    const onInner = ring.filter((p) => Math.abs(distance(p, centre) - 5) < 1e-9).length;
    expect(onOuter + onInner).toBe(ring.length);
    expect(signedArea(ring)).toBeGreaterThan(0);
  });

  it('comes within the chord tolerance of the annular sector area θ(R² − r²)/2 (CRC Standard Mathematical Tables)', () => {
    const exact = ((Math.PI / 4) * (64 - 25)) / 2; // 15.315… sq in
    expect(exactSectionArea(arc)).toBeCloseTo(exact, 12);
    const flattened = polygonArea(flattenSectionOutline(arc));
    // Each chord cuts off less than chord × sagitta, so the loss is below ε·(R + r)·θ.
    expect(flattened).toBeLessThan(exact);
    expect(exact - flattened).toBeLessThan(CHORD_TOLERANCE_IN * (8 + 5) * (Math.PI / 4));
  });

  it('makes a wedge of the centre and its arc; circular sector area θr²/2 (CRC Standard Mathematical Tables)', () => {
    const ring = flattenSectionOutline(wedge);
    expect(ring[0]).toEqual(centre);
    expect(ring[1]).toEqual({ x: 18, y: 13 });
    const exact = ((Math.PI / 4) * 25) / 2;
    expect(exactSectionArea(wedge)).toBeCloseTo(exact, 12);
    expect(exact - polygonArea(ring)).toBeGreaterThan(0);
    expect(exact - polygonArea(ring)).toBeLessThan(CHORD_TOLERANCE_IN * 5 * (Math.PI / 4));
  });

  it('makes a full 360° wedge a circle without its centre', () => {
    const ring = flattenSectionOutline({ ...wedge, sweepDeg: 360 });
    for (const p of ring) expect(distance(p, centre)).toBeCloseTo(5, 12);
    expect(Math.PI * 25 - polygonArea(ring)).toBeLessThan(CHORD_TOLERANCE_IN * 5 * 2 * Math.PI);
  });

  it('makes a full 360° arc section a keyhole ring with the annulus area, or a ring with a hole', () => {
    const full: ArcGeometry = { ...arc, sweepDeg: 360 };
    const ring = flattenSectionOutline(full);
    const annulus = Math.PI * (64 - 25);
    expect(annulus - polygonArea(ring)).toBeGreaterThan(0);
    expect(annulus - polygonArea(ring)).toBeLessThan(CHORD_TOLERANCE_IN * 13 * 2 * Math.PI);
    expect(locatePoint(centre, ring)).toBe('outside'); // the hole is not part of the section
    expect(locatePoint({ x: 13 + 6.5, y: 13.5 }, ring)).toBe('inside');
    const rings = flattenSectionRings(full);
    expect(rings.holes).toHaveLength(1);
    expect(polygonArea(rings.outer) - polygonArea(rings.holes[0])).toBeCloseTo(polygonArea(ring), 9);
    expect(Math.sign(signedArea(rings.outer))).toBe(-Math.sign(signedArea(rings.holes[0])));
    expect(flattenSectionRings(arc).holes).toEqual([]);
  });
});

describe('outline winding', () => {
  it('gives every outline positive signed area, whatever the winding of the document', () => {
    const clockwiseInMath = [{ x: 0, y: 0 }, { x: 0, y: 2 }, { x: 3, y: 2 }, { x: 3, y: 0 }];
    expect(signedArea(clockwiseInMath)).toBe(-6);
    const ring = flattenSectionOutline({ kind: 'straight', vertices: clockwiseInMath });
    expect(signedArea(ring)).toBe(6);
    expect(ring).toEqual([{ x: 3, y: 0 }, { x: 3, y: 2 }, { x: 0, y: 2 }, { x: 0, y: 0 }]);
    expect(signedArea(flattenSectionOutline(wedge))).toBeGreaterThan(0);
    expect(signedArea(flattenSectionOutline({ ...arc, sweepDeg: 360 }))).toBeGreaterThan(0);
    expect(signedArea(flattenSectionOutline({ ...wedge, sweepDeg: 300 }))).toBeGreaterThan(0);
  });
});
