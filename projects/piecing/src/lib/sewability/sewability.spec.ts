import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Point, Section } from '../document/pattern-schema';
import { derivePatches } from '../geometry/derive-patches';
import type { SewabilityPatch } from './check-sewability';
import { lineChords, splitRingAtChord } from '../geometry/split-polygon';
import { polygonArea, polygonCentroid } from '../geometry/polygon';

import { checkSewability } from './check-sewability';
import { findSewableOrder } from './find-sewable-order';

const rect = (x0: number, y0: number, x1: number, y1: number): Point[] => [{ x: x0, y: y0 }, { x: x1, y: y0 }, { x: x1, y: y1 }, { x: x0, y: y1 }];
const patchesOf = (label: string, polygons: Point[][]): SewabilityPatch[] => polygons.map((polygon, i) => ({ number: i + 1, label: `${label}${i + 1}`, polygon }));

/** 6 × 6 square: seam x = 2 first, then y = 3 across the right part. Patches A1 left, A2 top right, A3 bottom right. */
const ell: Section = {
  id: 'a',
  label: 'A',
  geometry: { kind: 'straight', vertices: rect(0, 0, 6, 6) },
  seams: [{ id: 's1', a: { x: 2, y: 0 }, b: { x: 2, y: 6 } }, { id: 's2', a: { x: 2, y: 3 }, b: { x: 6, y: 3 } }],
  patches: [{ number: 1, anchor: { x: 1, y: 1 } }, { number: 2, anchor: { x: 4, y: 1 } }, { number: 3, anchor: { x: 4, y: 5 } }],
};

/** Two squares whose horizontal seams do not line up: no patch can be sewn last (offset seams). */
const offsetSeams = patchesOf('C', [rect(0, 0, 2, 1), rect(0, 1, 2, 2), rect(2, 0, 4, 1.5), rect(2, 1.5, 4, 2)]);

/** Four bars turning round a centre square (a pinwheel): unsewable, and no straight cut runs through it. */
const pinwheel = patchesOf('D', [rect(0, 0, 2, 1), rect(2, 0, 3, 2), rect(1, 2, 3, 3), rect(0, 1, 1, 3), rect(1, 1, 2, 2)]);

describe('checkSewability', () => {
  it('accepts a sewable order and gives each seam', () => {
    const verdict = checkSewability(ell, [2, 3, 1]);
    expect(verdict.sewable).toBe(true);
    expect(verdict.labels).toEqual(['A2', 'A3', 'A1']);
    // A3 is sewn to A2 along y = 3 (x 2 … 6), then A1 to both along x = 2 (y 0 … 6).
    expect(verdict.steps.map((s) => s.label)).toEqual(['A3', 'A1']);
    const [s3, s1] = verdict.steps;
    expect([s3.from.y, s3.to.y]).toEqual([3, 3]);
    expect([Math.min(s3.from.x, s3.to.x), Math.max(s3.from.x, s3.to.x)]).toEqual([2, 6]);
    expect([s1.from.x, s1.to.x]).toEqual([2, 2]);
    expect([Math.min(s1.from.y, s1.to.y), Math.max(s1.from.y, s1.to.y)]).toEqual([0, 6]);
  });

  it('names the first failing patch: not one straight seam', () => {
    const verdict = checkSewability(ell); // default order 1, 2, 3
    expect(verdict.sewable).toBe(false);
    expect(verdict.failure).toMatchObject({ patchNumber: 3, label: 'A3', position: 3, reason: 'not-one-straight-seam' });
    expect(verdict.failure!.message).toContain('A3 meets the patches sewn before it (A1–A2) along more than one straight stretch');
  });

  it('names the first failing patch: no shared seam', () => {
    const strips = patchesOf('B', [rect(0, 0, 1, 3), rect(1, 0, 2, 3), rect(2, 0, 3, 3)]);
    expect(checkSewability(strips, [2, 1, 3]).sewable).toBe(true);
    const verdict = checkSewability(strips, [1, 3, 2]);
    expect(verdict.failure).toMatchObject({ label: 'B3', position: 2, reason: 'no-shared-seam' });
  });

  it('names the first failing patch: earlier patches on both sides of the seam line', () => {
    // T spans the top; L sits under its left half; the triangle R meets only L, along x = 3, whose line crosses T.
    const patches = patchesOf('E', [rect(0, 0, 6, 3), rect(0, 3, 3, 6), [{ x: 3, y: 4 }, { x: 5, y: 6 }, { x: 3, y: 6 }]]);
    const verdict = checkSewability(patches);
    expect(verdict.failure).toMatchObject({ label: 'E3', reason: 'earlier-patches-both-sides' });
    expect(verdict.failure!.message).toContain('E1 crosses it');
  });

  it('names the first failing patch: a patch that reaches across its own seam line', () => {
    // The L-shaped second patch meets the square only along y = 1 but wraps down past its right side.
    const patches = patchesOf('F', [rect(0, 0, 1, 1), [{ x: 0, y: 1 }, { x: 1, y: 1 }, { x: 1.5, y: 1 }, { x: 1.5, y: 0 }, { x: 2, y: 0 }, { x: 2, y: 2 }, { x: 0, y: 2 }]]);
    expect(checkSewability(patches).failure).toMatchObject({ label: 'F2', reason: 'patch-crosses-seam-line' });
  });

  it('reports an order that does not list each patch once', () => {
    expect(checkSewability(ell, [1, 2]).failure).toMatchObject({ reason: 'order-mismatch', patchNumber: 3 });
    expect(checkSewability(ell, [1, 1, 2]).failure?.message).toBe('the order lists patch 1 twice');
    expect(checkSewability(ell, [1, 2, 9]).failure?.message).toBe('the order lists patch 9, which the section does not have');
  });
});

describe('findSewableOrder', () => {
  it('finds an order for a sewable section', () => {
    const result = findSewableOrder(ell);
    expect(result.found).toBe(true);
    if (!result.found) return;
    expect(checkSewability(ell, result.order).sewable).toBe(true);
    expect(result.labels[result.labels.length - 1]).toBe('A1'); // A1's seam runs the full height: it goes last
  });

  it('says when no order exists and suggests a cut into two sewable sections', () => {
    const result = findSewableOrder(offsetSeams);
    expect(result.found).toBe(false);
    if (result.found) return;
    expect(result.reason).toBe('none');
    expect(result.suggestion).toBeDefined();
    const s = result.suggestion!;
    expect([s.from.x, s.to.x]).toEqual([2, 2]);
    expect([Math.min(s.from.y, s.to.y), Math.max(s.from.y, s.to.y)]).toEqual([0, 2]);
    expect(s.parts.map((p) => [...p].sort()).sort()).toEqual([[1, 2], [3, 4]]);
    for (const part of s.parts) expect(checkSewability(offsetSeams.filter((p) => part.includes(p.number)), part).sewable).toBe(true);
    expect(result.message).toMatch(/^section C cannot be sewn in any order; cut it along the seam from \(2, [02]\) to \(2, [02]\)/);
  });

  it('says when no single straight cut helps', () => {
    const result = findSewableOrder(pinwheel);
    expect(result).toMatchObject({ found: false, reason: 'none' });
    if (result.found) return;
    expect(result.suggestion).toBeUndefined();
    expect(result.message).toContain('no single straight cut');
  });

  it('handles a 20-patch section (log-cabin style: each patch sewn along the whole side of the ones before)', () => {
    const patches = logCabin(20);
    const result = findSewableOrder(patches);
    expect(result.found).toBe(true);
    if (result.found) {
      expect(result.order).toHaveLength(20);
      expect(checkSewability(patches, result.order).sewable).toBe(true);
    }
    // With a pinwheel at its heart the same section cannot be sewn; the search must still finish.
    const stuck = findSewableOrder([...pinwheel.map((p) => ({ ...p, polygon: p.polygon.map((q) => ({ x: q.x - 10, y: q.y - 10 })) })), ...logCabin(15).map((p, i) => ({ ...p, number: 6 + i, label: `D${6 + i}` }))]);
    expect(stuck.found).toBe(false);
  });

  it('property: every order the search returns passes the check, and it finds one whenever brute force does', () => {
    fc.assert(
      fc.property(fc.oneof(randomSection(6), randomGridSection(3)), (patches) => {
        const result = findSewableOrder(patches);
        const bruteForce = someSewableOrder(patches, []);
        expect(result.found).toBe(bruteForce);
        if (result.found) expect(checkSewability(patches, result.order).sewable).toBe(true);
      }),
      { numRuns: 200 },
    );
  });

  it('property: larger random sections never hang or throw, and found orders pass the check', () => {
    fc.assert(
      fc.property(fc.oneof(randomSection(16), randomGridSection(6)), (patches) => {
        const result = findSewableOrder(patches, { maxSearchStates: 20_000 });
        if (result.found) expect(checkSewability(patches, result.order).sewable).toBe(true);
        else expect(result.message.length).toBeGreaterThan(0);
      }),
      { numRuns: 60 },
    );
  });
});

/** Patches of a log cabin: each new strip covers one whole side of everything before it. */
function logCabin(count: number): SewabilityPatch[] {
  let box = { x0: 0, y0: 0, x1: 1, y1: 1 };
  const polygons: Point[][] = [rect(0, 0, 1, 1)];
  for (let i = 1; i < count; i++) {
    const w = 0.5;
    const side = i % 4;
    const next = { ...box };
    if (side === 1) { polygons.push(rect(box.x1, box.y0, box.x1 + w, box.y1)); next.x1 += w; }
    if (side === 2) { polygons.push(rect(box.x0, box.y1, box.x1, box.y1 + w)); next.y1 += w; }
    if (side === 3) { polygons.push(rect(box.x0 - w, box.y0, box.x0, box.y1)); next.x0 -= w; }
    if (side === 0) { polygons.push(rect(box.x0, box.y0 - w, box.x1, box.y0)); next.y0 -= w; }
    box = next;
  }
  // Shuffle the numbers so the search cannot just read them off.
  const numbers = polygons.map((_, i) => ((i * 7) % count) + 1);
  return polygons.map((polygon, i) => ({ number: numbers[i], label: `G${numbers[i]}`, polygon }));
}

/** A square cut by up to `maxCuts` seams, each across one random patch (through its centroid). */
function randomSection(maxCuts: number) {
  return fc.array(fc.tuple(fc.nat(), fc.double({ min: 0, max: Math.PI, noNaN: true })), { maxLength: maxCuts }).map((cuts) => {
    let polygons: Point[][] = [rect(0, 0, 8, 8)];
    for (const [pick, angle] of cuts) {
      const target = polygons[pick % polygons.length];
      const c = polygonCentroid(target);
      const chords = lineChords(target, c, { x: c.x + Math.cos(angle), y: c.y + Math.sin(angle) });
      if (chords.length === 0) continue;
      const ch = chords[0];
      polygons = polygons.flatMap((p) => p === target ? splitAt(p, ch.from.point, ch.to.point) : [p]);
    }
    return patchesOf('R', polygons);
  });
}

function splitAt(ring: Point[], a: Point, b: Point): Point[][] {
  const chords = lineChords(ring, a, b);
  if (chords.length === 0) return [ring];
  const [p, q] = splitRingAtChord(ring, chords[0]);
  return p.length >= 3 && q.length >= 3 && polygonArea(p) > 1e-3 && polygonArea(q) > 1e-3 ? [p, q] : [ring];
}

/** Brute force, independent of the search: extends sewable prefixes one patch at a time. */
function someSewableOrder(patches: SewabilityPatch[], prefix: number[]): boolean {
  if (prefix.length === patches.length) return true;
  return patches.some((p) => {
    if (prefix.includes(p.number)) return false;
    const order = [...prefix, p.number];
    return checkSewability(patches.filter((q) => order.includes(q.number)), order).sewable && someSewableOrder(patches, order);
  });
}

/** A square cut by up to `maxLines` seams running right across it (grids and crossings, often unsewable). */
function randomGridSection(maxLines: number) {
  const edgePoint = fc.tuple(fc.integer({ min: 0, max: 3 }), fc.double({ min: 0.5, max: 7.5, noNaN: true })).map(([side, t]) =>
    side === 0 ? { x: t, y: -0.5 } : side === 1 ? { x: 8.5, y: t } : side === 2 ? { x: t, y: 8.5 } : { x: -0.5, y: t },
  );
  return fc.array(fc.tuple(edgePoint, edgePoint), { minLength: 1, maxLength: maxLines }).map((lines) => {
    const section: Section = {
      id: 'g',
      label: 'R',
      geometry: { kind: 'straight', vertices: rect(0, 0, 8, 8) },
      seams: lines.map(([a, b], i) => ({ id: `s${i}`, a, b })),
      patches: [],
    };
    return derivePatches(section).patches;
  });
}
