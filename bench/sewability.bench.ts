/**
 * Sewability benchmark: order search on 20-patch sections (docs/design-notes.md#sewability). Medians over repeated runs;
 * nothing here fails on a time.
 */
import type { Point, Section } from '../projects/piecing/src/public-api';
import { checkSewability, derivePatches, findSewableOrder } from '../projects/piecing/src/public-api';
import { preparePatches, searchSubset, type SewabilityPatch } from '../projects/piecing/src/testing';
import { ms, timeRuns, type BenchSection } from './bench-kit';

const rect = (x0: number, y0: number, x1: number, y1: number): Point[] => [{ x: x0, y: y0 }, { x: x1, y: y0 }, { x: x1, y: y1 }, { x: x0, y: y1 }];

/** A log cabin: each strip covers one whole side of all before it. Sewable; numbers shuffled. */
function logCabin(count: number, label = 'A'): SewabilityPatch[] {
  let box = { x0: 0, y0: 0, x1: 1, y1: 1 };
  const polygons: Point[][] = [rect(0, 0, 1, 1)];
  for (let i = 1; i < count; i++) {
    const w = 0.5;
    const next = { ...box };
    if (i % 4 === 1) { polygons.push(rect(box.x1, box.y0, box.x1 + w, box.y1)); next.x1 += w; }
    if (i % 4 === 2) { polygons.push(rect(box.x0, box.y1, box.x1, box.y1 + w)); next.y1 += w; }
    if (i % 4 === 3) { polygons.push(rect(box.x0 - w, box.y0, box.x0, box.y1)); next.x0 -= w; }
    if (i % 4 === 0) { polygons.push(rect(box.x0, box.y0 - w, box.x1, box.y0)); next.y0 -= w; }
    box = next;
  }
  return polygons.map((polygon, i) => {
    const number = ((i * 7) % count) + 1;
    return { number, label: `${label}${number}`, polygon };
  });
}

/** 20 patches: a pinwheel (unsewable) beside 15 strips: the search must rule out every order. */
function stuckSection(): SewabilityPatch[] {
  const pinwheel = [rect(0, 0, 2, 1), rect(2, 0, 3, 2), rect(1, 2, 3, 3), rect(0, 1, 1, 3), rect(1, 1, 2, 2)].map((p) => p.map((q) => ({ x: q.x - 10, y: q.y })));
  const strips = Array.from({ length: 15 }, (_, i) => rect(-7 + i * 0.5, 0, -6.5 + i * 0.5, 3));
  return [...pinwheel, ...strips].map((polygon, i) => ({ number: i + 1, label: `B${i + 1}`, polygon }));
}

/**
 * 20 patches: a hexagon of three rhombi meeting in a Y (unsewable) with stacks of strips on its sides.
 * The strips can come off in very many orders, so the search visits thousands of subsets before it
 * can say that no order exists.
 */
function hexagonWithStrips(): SewabilityPatch[] {
  const c = { x: 12, y: 12 };
  const v = Array.from({ length: 6 }, (_, i) => ({ x: c.x + 3 * Math.cos((i * Math.PI) / 3), y: c.y + 3 * Math.sin((i * Math.PI) / 3) }));
  const polygons: Point[][] = [
    [c, v[0], v[1], v[2]],
    [c, v[2], v[3], v[4]],
    [c, v[4], v[5], v[0]],
  ];
  const stacks = [3, 3, 3, 3, 3, 2];
  stacks.forEach((height, i) => {
    const a = v[i];
    const b = v[(i + 1) % 6];
    const mid = { x: (a.x + b.x) / 2 - c.x, y: (a.y + b.y) / 2 - c.y };
    const len = Math.hypot(mid.x, mid.y);
    const n = { x: mid.x / len, y: mid.y / len };
    for (let k = 0; k < height; k++) {
      const d0 = k * 0.5;
      const d1 = (k + 1) * 0.5;
      polygons.push([
        { x: a.x + n.x * d0, y: a.y + n.y * d0 },
        { x: a.x + n.x * d1, y: a.y + n.y * d1 },
        { x: b.x + n.x * d1, y: b.y + n.y * d1 },
        { x: b.x + n.x * d0, y: b.y + n.y * d0 },
      ]);
    }
  });
  return polygons.map((polygon, i) => ({ number: i + 1, label: `D${i + 1}`, polygon }));
}

/** A 20-patch fan of a wedge: 19 radial seams across an arc section (sewable in fan order). */
function arcFan(): Section {
  const centre = { x: 12, y: 12 };
  const seams = Array.from({ length: 19 }, (_, i) => {
    const a = ((i + 1) * 45) / 20 * (Math.PI / 180);
    return { id: `s${i + 1}`, a: { x: centre.x + 4.9 * Math.cos(a), y: centre.y + 4.9 * Math.sin(a) }, b: { x: centre.x + 8.1 * Math.cos(a), y: centre.y + 8.1 * Math.sin(a) } };
  });
  return { id: 'c', label: 'C', geometry: { kind: 'arc', centre, innerRadiusIn: 5, outerRadiusIn: 8, startAngleDeg: 0, sweepDeg: 45 }, seams, patches: [] };
}

/** Subsets the search visits: the smallest state cap under which it still reaches its answer. */
function countStates(prepared: ReturnType<typeof preparePatches>, all: number[]): number {
  let lo = 0;
  let hi = 1;
  while (searchSubset(prepared, all, hi).found === false && (searchSubset(prepared, all, hi) as { limitHit: boolean }).limitHit) hi *= 2;
  while (lo + 1 < hi) {
    const mid = Math.floor((lo + hi) / 2);
    const r = searchSubset(prepared, all, mid);
    if (r.found || !r.limitHit) hi = mid;
    else lo = mid;
  }
  return hi;
}

export default async function sewabilityBench(): Promise<BenchSection> {
  const cabin = logCabin(20);
  const stuck = stuckSection();
  const fan = arcFan();
  const fanPatches = derivePatches(fan).patches;
  const cases: Array<{ name: string; patches: SewabilityPatch[] }> = [
    { name: 'log cabin, 20 patches (sewable)', patches: cabin },
    { name: 'arc section fan, 20 patches (sewable)', patches: fanPatches },
    { name: 'pinwheel + 15 strips, 20 patches (unsewable)', patches: stuck },
    { name: 'Y-seam hexagon + 17 strips, 20 patches (unsewable)', patches: hexagonWithStrips() },
  ];
  const rows: BenchSection['rows'] = [];
  for (const c of cases) {
    const prepared = preparePatches(c.patches);
    const all = c.patches.map((_, i) => i);
    const prepare = await timeRuns(() => preparePatches(c.patches), 9, 2);
    const search = await timeRuns(() => searchSubset(prepared, all), 9, 2);
    const full = await timeRuns(() => findSewableOrder(c.patches), 9, 2);
    const result = findSewableOrder(c.patches);
    const visited = countStates(prepared, all);
    rows.push({
      section: c.name,
      'contacts median ms': ms(prepare.medianMs),
      'search median ms': ms(search.medianMs),
      'findSewableOrder median ms': ms(full.medianMs),
      'p95 ms': ms(full.p95Ms),
      verdict: result.found ? 'sewable' : result.reason,
      'subsets visited': visited,
    });
  }
  const derive = await timeRuns(() => derivePatches(fan), 9, 2);
  const check = await timeRuns(() => checkSewability(fanPatches), 9, 2);
  rows.push({ section: 'derivePatches, arc fan (19 seams)', 'findSewableOrder median ms': ms(derive.medianMs), verdict: `${fanPatches.length} patches` });
  rows.push({ section: 'checkSewability, arc fan, given order', 'findSewableOrder median ms': ms(check.medianMs), verdict: checkSewability(fanPatches).sewable ? 'sewable' : 'not sewable' });
  // A large section for scale: a 360° wedge of radius 199 in. cut by 500 parallel seams (501 patches).
  const strips: Section = {
    id: 'big',
    label: 'Z',
    geometry: { kind: 'wedge', centre: { x: 0, y: 0 }, radiusIn: 199, startAngleDeg: 0, sweepDeg: 360 },
    seams: Array.from({ length: 500 }, (_, i) => ({ id: `s${i}`, a: { x: -199 + (i + 0.5) * (398 / 500), y: -200 }, b: { x: -199 + (i + 0.5) * (398 / 500), y: 200 } })),
    patches: [],
  };
  const bigDerive = await timeRuns(() => derivePatches(strips), 3, 1);
  const bigPatches = derivePatches(strips).patches;
  const bigSearch = await timeRuns(() => findSewableOrder(bigPatches), 3, 1);
  rows.push({ section: 'derivePatches, 500 seams across a 199 in. circle', 'findSewableOrder median ms': ms(bigDerive.medianMs), verdict: `${bigPatches.length} patches` });
  rows.push({ section: 'findSewableOrder, those 501 patches', 'findSewableOrder median ms': ms(bigSearch.medianMs), verdict: findSewableOrder(bigPatches).found ? 'sewable' : 'not sewable' });
  return {
    title: 'Sewability: order search on 20-patch sections',
    rows,
    notes: [
      'Remove-last-patch search with memo over subsets (docs/design-notes.md#sewability); the unsewable case has to rule out every order.',
      '"contacts" is the precomputation of shared edges and sides between all pairs of patches; findSewableOrder includes it.',
      'Medians of 9 runs after 2 warm-up runs (3 after 1 for the 501-patch rows), one process.',
    ],
  };
}
