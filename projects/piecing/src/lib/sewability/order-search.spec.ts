import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Point, Section } from '../document/pattern-schema';
import { derivePatches } from '../geometry/derive-patches';
import { checkSewability, preparePatches, type SewabilityPatch } from './check-sewability';
import { findSewableOrder } from './find-sewable-order';
import { OrderSearch } from './order-search';
import { suggestSplit } from './suggest-split';
import { EXACT_KEY_PATCHES, KeyedMask, SubsetMemo, maskMembers, maskSize } from './subset-memo';

const rect = (x0: number, y0: number, x1: number, y1: number): Point[] => [{ x: x0, y: y0 }, { x: x1, y: y0 }, { x: x1, y: y1 }, { x: x0, y: y1 }];

/**
 * A Y-seam core (a regular polygon cut into three from its centre; no order of the three works) with
 * one thin ear on each side: unsewable, and the ears come off in any order (2^ears sets).
 */
function yCoreWithEars(total: number): SewabilityPatch[] {
  const m = total - 3;
  const c = { x: 50, y: 50 };
  const v = Array.from({ length: m }, (_, i) => ({ x: c.x + 10 * Math.cos((2 * Math.PI * i) / m), y: c.y + 10 * Math.sin((2 * Math.PI * i) / m) }));
  const cuts = [0, Math.round(m / 3), Math.round((2 * m) / 3), m];
  const polygons: Point[][] = [0, 1, 2].map((t) => [c, ...Array.from({ length: cuts[t + 1] - cuts[t] + 1 }, (_, i) => v[(cuts[t] + i) % m])]);
  for (let i = 0; i < m; i++) {
    const a = v[i];
    const b = v[(i + 1) % m];
    const mid = { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 };
    const out = Math.hypot(mid.x - c.x, mid.y - c.y);
    const h = 0.25 * Math.hypot(b.x - a.x, b.y - a.y) * Math.sin((2 * Math.PI) / m);
    polygons.push([a, b, { x: mid.x + ((mid.x - c.x) / out) * h, y: mid.y + ((mid.y - c.y) / out) * h }]);
  }
  return polygons.map((polygon, i) => ({ number: i + 1, label: `Y${i + 1}`, polygon }));
}

/** A log cabin of `count` strips, numbers shuffled (sewable; the search must backtrack to find the order). */
function logCabin(count: number): SewabilityPatch[] {
  let box = { x0: 0, y0: 0, x1: 1, y1: 1 };
  const polygons: Point[][] = [rect(0, 0, 1, 1)];
  for (let i = 1; i < count; i++) {
    const next = { ...box };
    const side = i % 4;
    if (side === 1) { polygons.push(rect(box.x1, box.y0, box.x1 + 0.5, box.y1)); next.x1 += 0.5; }
    if (side === 2) { polygons.push(rect(box.x0, box.y1, box.x1, box.y1 + 0.5)); next.y1 += 0.5; }
    if (side === 3) { polygons.push(rect(box.x0 - 0.5, box.y0, box.x0, box.y1)); next.x0 -= 0.5; }
    if (side === 0) { polygons.push(rect(box.x0, box.y0 - 0.5, box.x1, box.y0)); next.y0 -= 0.5; }
    box = next;
  }
  // 7 and 73 are prime to every count used here, so the numbers are a permutation.
  return polygons.map((polygon, i) => ({ number: ((i * 73) % count) + 1, label: `G${((i * 73) % count) + 1}`, polygon }));
}

describe('order search budget', () => {
  it('a search past its budget says it could not decide, and decides once the budget is enough', () => {
    const patches = yCoreWithEars(9); // 6 ears: 64 sets of ears around the core
    const prepared = preparePatches(patches);
    const all = patches.map((_, i) => i);
    // Without the self-blocking check the search must try the sets one by one.
    const full = new OrderSearch(prepared, 1_000_000, false);
    expect(full.search(all)).toEqual({ found: false, limitHit: false });
    const needed = full.steps;
    expect(needed).toBeGreaterThan(64);
    // The budget is checked as each set is expanded, so a search may finish a little past it.
    for (const budget of [1, 10, Math.floor(needed / 4), Math.floor(needed / 2)]) {
      expect(new OrderSearch(prepared, budget, false).search(all)).toEqual({ found: false, limitHit: true });
    }
    expect(new OrderSearch(prepared, needed, false).search(all)).toEqual({ found: false, limitHit: false });
    // Counted, not timed: the same work every time.
    const again = new OrderSearch(prepared, 1_000_000, false);
    again.search(all);
    expect(again.steps).toBe(needed);
  });

  it('findSewableOrder answers "undecided" with a plain message when the budget is too small, never a wrong verdict', () => {
    const cabin = logCabin(24);
    const tiny = findSewableOrder(cabin, { maxSearchStates: 5 });
    expect(tiny).toMatchObject({ found: false, status: 'undecided', reason: 'search-limit' });
    expect(tiny.message).toMatch(/^the search could not tell in time whether section G can be sewn in some order; /);
    expect(findSewableOrder(cabin)).toMatchObject({ found: true, status: 'sewable' });
  });

  it('property: with any budget the answer is the unbudgeted one or "undecided"', () => {
    let undecided = 0;
    let decided = 0;
    fc.assert(
      fc.property(randomGridSection(7), fc.integer({ min: 1, max: 400 }), (patches, budget) => {
        const small = findSewableOrder(patches, { maxSearchStates: budget });
        const big = findSewableOrder(patches, { maxSearchStates: 10_000_000 });
        if (small.status === 'undecided') {
          undecided++;
          return;
        }
        decided++;
        expect(small.status).toBe(big.status);
        if (small.found) expect(checkSewability(patches, small.order).sewable).toBe(true);
      }),
      { numRuns: 150 },
    );
    // Both outcomes must turn up for the property to say anything.
    expect(undecided).toBeGreaterThan(0);
    expect(decided).toBeGreaterThan(0);
  });

  it('rules out a set holding a self-blocking group at once: the 20-patch Y case costs no search steps', () => {
    const patches = yCoreWithEars(20);
    const search = new OrderSearch(preparePatches(patches));
    expect(search.core()).toEqual([0, 1, 2]); // the three parts of the Y
    const result = findSewableOrder(patches);
    expect(result).toMatchObject({ found: false, status: 'unsewable', reason: 'none' });
    // Parts of the section, as the split advice asks about them: only those holding the whole Y are ruled out.
    expect(search.holdsSelfBlockingGroup(patches.map((_, i) => i))).toBe(true);
    expect(search.holdsSelfBlockingGroup([0, 1, 2])).toBe(true);
    expect(search.holdsSelfBlockingGroup([0, 1])).toBe(false);
    // Two parts of the Y and the ears on their sides: sewable (the two parts first, then the ears).
    const twoParts = [1, 2, ...patches.map((_, i) => i).filter((i) => i >= 3 + 6)];
    expect(search.holdsSelfBlockingGroup(twoParts)).toBe(false);
    const found = search.search(twoParts);
    expect(found.found).toBe(true);
    if (found.found) expect(checkSewability(twoParts.map((i) => patches[i]), found.order.map((i) => patches[i].number)).sewable).toBe(true);
  });
});

describe('bitmask keys', () => {
  it('above 32 patches the exact key is the whole mask (no 32-bit wrap)', () => {
    const a = new KeyedMask(40);
    const b = new KeyedMask(40);
    a.reset([0, 35]);
    b.reset([0, 3]); // 35 and 3 agree modulo 32
    expect(a.exactKeys).toBe(true);
    expect(a.key).toBe(1 + 2 ** 35);
    expect(a.key).not.toBe(b.key);
    const memo = new SubsetMemo();
    memo.add(a);
    expect(memo.has(a)).toBe(true);
    expect(memo.has(b)).toBe(false);
    expect(maskMembers(a.mask)).toEqual([0, 35]);
    expect(maskSize(a.mask)).toBe(2);
  });

  it(`above ${EXACT_KEY_PATCHES} patches keys are hashes, and sets that share a hash are still told apart`, () => {
    // Every patch hashes alike: all keys of sets of the same size collide.
    const collide = () => [7, 7] as [number, number];
    const a = new KeyedMask(70, collide);
    const b = new KeyedMask(70, collide);
    a.reset([1, 66]);
    b.reset([1, 65]);
    expect(a.exactKeys).toBe(false);
    expect(a.key).toBe(b.key);
    const memo = new SubsetMemo();
    memo.add(a);
    expect(memo.has(a)).toBe(true);
    expect(memo.has(b)).toBe(false);
    memo.add(b);
    expect(memo.size).toBe(2);
    expect(memo.has(b)).toBe(true);
    // Toggling back gives the same key and set.
    b.toggle(65);
    b.toggle(66);
    expect(memo.has(b)).toBe(true);
  });

  it('keys are numbers below 2^53 and toggling a patch in and out restores the key', () => {
    for (const n of [20, 52, 53, 70, 500]) {
      const k = new KeyedMask(n);
      k.reset([0, n - 1]);
      const key = k.key;
      expect(Number.isSafeInteger(key)).toBe(true);
      k.toggle(n >> 1);
      expect(k.key).not.toBe(key);
      k.toggle(n >> 1);
      expect(k.key).toBe(key);
    }
  });

  it.each([40, 70])('finds the order of a shuffled %i-patch log cabin (backtracking over remembered sets)', (count) => {
    const patches = logCabin(count);
    const search = new OrderSearch(preparePatches(patches));
    const result = search.search(patches.map((_, i) => i));
    expect(result.found).toBe(true);
    if (!result.found) return;
    const numbers = result.order.map((i) => patches[i].number);
    expect(new Set(numbers).size).toBe(count);
    expect(checkSewability(patches, numbers).sewable).toBe(true);
  });

  it.each([40, 70])('a %i-patch Y case without the self-blocking check remembers sets correctly: undecided within the budget, never sewable', (total) => {
    const patches = yCoreWithEars(total);
    const result = new OrderSearch(preparePatches(patches), 20_000, false).search(patches.map((_, i) => i));
    expect(result).toEqual({ found: false, limitHit: true });
  });
});

describe('split advice reusing the failed search', () => {
  it('property: the advice after the failed search is the advice of fresh, unbudgeted searches of each part', () => {
    let suggested = 0;
    fc.assert(
      fc.property(randomGridSection(5), (patches) => {
        const prepared = preparePatches(patches);
        const search = new OrderSearch(prepared, 10_000_000);
        if (search.search(patches.map((_, i) => i)).found) return;
        const reused = suggestSplit(prepared, search);
        const fresh = suggestSplit(prepared, new OrderSearch(prepared, 10_000_000, false));
        expect(reused).toEqual(fresh);
        if (reused.suggestion) {
          suggested++;
          const [a, b] = reused.suggestion.parts;
          expect([...a, ...b].sort((x, y) => x - y)).toEqual(patches.map((p) => p.number).sort((x, y) => x - y));
          for (const part of [a, b]) expect(checkSewability(patches.filter((p) => part.includes(p.number)), part).sewable).toBe(true);
        }
      }),
      { numRuns: 120 },
    );
    expect(suggested).toBeGreaterThan(0);
  });
});

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
