import { describe, expect, it } from 'vitest';
import { GRID_SNAP_STEP_IN, snapPoint, snapToEdges, snapToGrid, SnapTargetIndex, type SnapTarget } from './snapping';

describe('snapping', () => {
  it('finds through the spatial index exactly the target a scan of the list finds, ties included', () => {
    // Points on a ⅛ in. lattice spread by two strides, many shared by two sections (as neighbouring corners are).
    const targets: SnapTarget[] = Array.from({ length: 3000 }, (_, i) => ({
      point: { x: ((i * 37) % 81) / 8, y: ((i * 53) % 79) / 8 },
      kind: i % 3 === 0 ? 'seam-end' : 'vertex',
      sectionId: `s${i}`,
    }));
    const index = new SnapTargetIndex(targets);
    const options = { grid: 'off' as const, toPoints: true, radiusIn: 0.2 };
    let snapped = 0;
    // Probes every 0.23 in. across the lattice: between, beside and on targets.
    for (let k = 0; k < 2000; k++) {
      const p = { x: (k % 45) * 0.23, y: Math.floor(k / 45) * 0.23 };
      const fromList = snapPoint(p, targets, options);
      expect(snapPoint(p, index, options)).toEqual(fromList);
      if (fromList.kind !== 'none') snapped++;
    }
    // Most probes land near some target, and the empty index snaps to nothing.
    expect(snapped).toBeGreaterThan(1000);
    expect(snapPoint({ x: 1, y: 1 }, new SnapTargetIndex([]), options).kind).toBe('none');
  });

  it('rounds to ⅛, ¼ and ½ in. and to 0.5 cm', () => {
    const p = { x: 1.3, y: 2.07 };
    expect(snapToGrid(p, 'eighth-in')).toEqual({ x: 1.25, y: 2.125 });
    expect(snapToGrid(p, 'quarter-in')).toEqual({ x: 1.25, y: 2 });
    expect(snapToGrid(p, 'half-in')).toEqual({ x: 1.5, y: 2 });
    // 0.5 cm = 0.19685 in. (1 in. = 2.54 cm exactly, NIST HB 44): 1.3 in. = 3.302 cm → 3.5 cm = 1.37795 in.
    const cm = snapToGrid(p, 'half-cm');
    expect(cm.x * 2.54).toBeCloseTo(3.5, 9);
    expect(cm.y * 2.54).toBeCloseTo(5.5, 9);
    expect(GRID_SNAP_STEP_IN['half-cm']).toBeCloseTo(0.19685, 5);
    expect(snapToGrid(p, 'off')).toEqual(p);
  });

  it('prefers a vertex within the catch radius over the grid, and the nearer of two', () => {
    const targets: SnapTarget[] = [
      { point: { x: 1.31, y: 2.1 }, kind: 'vertex', sectionId: 'a' },
      { point: { x: 1.33, y: 2.1 }, kind: 'centre', sectionId: 'b' },
    ];
    const r = snapPoint({ x: 1.3, y: 2.07 }, targets, { grid: 'eighth-in', toPoints: true, radiusIn: 0.1 });
    expect(r).toEqual({ point: { x: 1.31, y: 2.1 }, kind: 'vertex', sectionId: 'a' });
    const far = snapPoint({ x: 1.6, y: 2.07 }, targets, { grid: 'eighth-in', toPoints: true, radiusIn: 0.1 });
    expect(far).toEqual({ point: { x: 1.625, y: 2.125 }, kind: 'grid' });
    const off = snapPoint({ x: 1.3, y: 2.07 }, targets, { grid: 'off', toPoints: false, radiusIn: 0.1 });
    expect(off).toEqual({ point: { x: 1.3, y: 2.07 }, kind: 'none' });
  });

  it('snaps to the nearest point of an edge within the radius, just inside and just outside it', () => {
    const square = [
      { x: 0, y: 0 },
      { x: 4, y: 0 },
      { x: 4, y: 4 },
      { x: 0, y: 4 },
    ];
    expect(snapToEdges({ x: 2, y: 0.09 }, [square], 0.1)).toEqual({ x: 2, y: 0 });
    expect(snapToEdges({ x: 2, y: 0.11 }, [square], 0.1)).toBeNull();
    const r = snapPoint({ x: 3.95, y: 2.03 }, [], { grid: 'quarter-in', toPoints: true, radiusIn: 0.1 }, [square]);
    expect(r).toEqual({ point: { x: 4, y: 2.03 }, kind: 'edge' });
  });
});
