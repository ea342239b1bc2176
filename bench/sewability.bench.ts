/**
 * Sewability benchmark: the order search with its work budget, from 20 patches to the schema's 500
 * (docs/design-notes.md#sewability). Medians over repeated runs;
 * nothing here fails on a time.
 */
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Point, Section } from '../projects/piecing/src/public-api';
import { checkSewability, derivePatches, findSewableOrder } from '../projects/piecing/src/public-api';
import { OrderSearch, preparePatches, type SewabilityPatch } from '../projects/piecing/src/testing';
import { seededRandom } from '../tests/support/random';
import { interleavedRounds, ms, ratio, timeRuns, type BenchSection } from './bench-kit';

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

/**
 * The hard case: a Y-seam core (a regular polygon cut into three by seams from its centre to
 * three corners; no order of the three works) with one thin ear on each side of the polygon.
 * Unsewable; the ears come off in any order, so a plain search meets 2^ears sets before it can say so.
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
    // Low enough that the line of each side passes outside its neighbours' ears.
    const h = 0.25 * Math.hypot(b.x - a.x, b.y - a.y) * Math.sin((2 * Math.PI) / m);
    polygons.push([a, b, { x: mid.x + ((mid.x - c.x) / out) * h, y: mid.y + ((mid.y - c.y) / out) * h }]);
  }
  return polygons.map((polygon, i) => ({ number: i + 1, label: `Y${i + 1}`, polygon }));
}

/** A square crossed by `lines` random seams from edge to edge (seeded): grids and crossings, mostly unsewable. */
function randomGrid(lines: number, rnd: () => number): SewabilityPatch[] {
  const edge = () => {
    const side = Math.floor(rnd() * 4);
    const t = 0.5 + rnd() * 7;
    return side === 0 ? { x: t, y: -0.5 } : side === 1 ? { x: 8.5, y: t } : side === 2 ? { x: t, y: 8.5 } : { x: -0.5, y: t };
  };
  const section: Section = { id: 'g', label: 'R', geometry: { kind: 'straight', vertices: rect(0, 0, 8, 8) }, seams: Array.from({ length: lines }, (_, k) => ({ id: `s${k}`, a: edge(), b: edge() })), patches: [] };
  return derivePatches(section).patches;
}

type FindSewableOrder = typeof findSewableOrder;

/**
 * Median and largest CPU time of this process over `runs` calls (ms): on a shared machine the wall
 * time also holds the time other processes had the core; CPU time is the work the call did.
 */
function cpuRuns(fn: () => unknown, runs: number): { medianMs: number; maxMs: number } {
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const c0 = process.cpuUsage();
    fn();
    const c = process.cpuUsage(c0);
    times.push((c.user + c.system) / 1000);
  }
  times.sort((a, b) => a - b);
  return { medianMs: times[Math.floor(times.length / 2)], maxMs: times[times.length - 1] };
}

/** The order search of an earlier commit, for a same-run comparison: SEWABILITY_BEFORE=<a worktree of it>. */
async function loadBefore(): Promise<FindSewableOrder | null> {
  const dir = process.env['SEWABILITY_BEFORE'];
  if (!dir) return null;
  const mod = (await import(pathToFileURL(join(dir, 'projects/piecing/src/public-api.ts')).href)) as { findSewableOrder: FindSewableOrder };
  return mod.findSewableOrder;
}

function verdictOf(r: ReturnType<FindSewableOrder>): string {
  return r.found ? 'sewable' : (r as { status?: string }).status ?? (r.reason === 'none' ? 'unsewable' : 'undecided');
}

export default async function sewabilityBench(): Promise<BenchSection> {
  const rows: BenchSection['rows'] = [];
  const notes: string[] = [];
  const before = await loadBefore();
  if (before) {
    // Before and after in the same process, interleaved (A B, A B …). The old search takes seconds on the
    // larger Y cases, so they get fewer rounds.
    for (const [size, rounds] of [[12, 5], [16, 3], [20, 1]] as const) {
      const patches = yCoreWithEars(size);
      const result = await interleavedRounds(
        [
          { name: 'before', run: () => before(patches) },
          { name: 'after', run: () => findSewableOrder(patches) },
        ],
        { rounds, warmup: size >= 20 ? 0 : 1 },
      );
      for (const v of result.variants) {
        rows.push({
          section: `Y-seam core + ${size - 3} ears, ${size} patches: ${v.name}`,
          rounds,
          'median ms': ms(v.medianMs),
          'min–max ms': `${ms(v.minMs)}–${ms(v.maxMs)}`,
          'after ÷ before': v.name === 'after' ? `${ratio(v.ratioMedian)} (${v.ratioMin.toFixed(4)}–${v.ratioMax.toFixed(4)})` : '',
          verdict: verdictOf(v.name === 'before' ? before(patches) : findSewableOrder(patches)),
        });
      }
    }
    notes.push(`Before = the search of the worktree at ${process.env['SEWABILITY_BEFORE']} (SEWABILITY_BEFORE), run in the same process, interleaved with after.`);
  }

  // findSewableOrder at every size up to the schema's 500 patches per section: the Y case, and the
  // search with its self-blocking check turned off, so it must spend its whole budget (the slowest path).
  for (const size of [20, 30, 40, 100, 200, 500]) {
    const patches = yCoreWithEars(size);
    const prepared = preparePatches(patches);
    const all = patches.map((_, i) => i);
    const full = await timeRuns(() => findSewableOrder(patches), 7, 1);
    const fullCpu = cpuRuns(() => findSewableOrder(patches), 5);
    const exhaustCpu = cpuRuns(() => new OrderSearch(prepared, undefined, false).search(all), 5);
    const spent = new OrderSearch(prepared);
    spent.search(all);
    const exhaust = await timeRuns(() => new OrderSearch(prepared, undefined, false).search(all), 5, 1);
    const probe = new OrderSearch(prepared, undefined, false);
    const probed = probe.search(all);
    rows.push({
      section: `Y-seam core + ${size - 3} ears, ${size} patches`,
      'median ms': ms(full.medianMs),
      'min–max ms': `${ms(full.minMs)}–${ms(full.maxMs)}`,
      'CPU median / max ms': `${ms(fullCpu.medianMs)} / ${ms(fullCpu.maxMs)}`,
      verdict: verdictOf(findSewableOrder(patches)),
      'work units': spent.steps,
      'budget spent (no self-blocking check): median ms': ms(exhaust.medianMs),
      'its min–max ms': `${ms(exhaust.minMs)}–${ms(exhaust.maxMs)}`,
      'its CPU median / max ms': `${ms(exhaustCpu.medianMs)} / ${ms(exhaustCpu.maxMs)}`,
      'its verdict': probed.found ? 'sewable' : probed.limitHit ? 'undecided' : 'unsewable',
    });
  }

  // The earlier 20-patch cases.
  const cases: Array<{ name: string; patches: SewabilityPatch[] }> = [
    { name: 'log cabin, 20 patches (sewable)', patches: logCabin(20) },
    { name: 'arc section fan, 20 patches (sewable)', patches: derivePatches(arcFan()).patches },
    { name: 'pinwheel + 15 strips, 20 patches (unsewable)', patches: stuckSection() },
    { name: 'Y-seam hexagon + 17 strips, 20 patches (unsewable)', patches: hexagonWithStrips() },
  ];
  for (const c of cases) {
    const full = await timeRuns(() => findSewableOrder(c.patches), 9, 2);
    const s = new OrderSearch(preparePatches(c.patches));
    s.search(c.patches.map((_, i) => i));
    rows.push({ section: c.name, 'median ms': ms(full.medianMs), 'min–max ms': `${ms(full.minMs)}–${ms(full.maxMs)}`, verdict: verdictOf(findSewableOrder(c.patches)), 'work units': s.steps });
  }

  // Random crossings (seeded): the slowest of 20 sections per seam count.
  const rnd = seededRandom(16);
  for (const lines of [6, 12, 20, 30]) {
    let worst = 0;
    let worstPatches = 0;
    const verdicts: Record<string, number> = {};
    for (let i = 0; i < 20; i++) {
      const patches = randomGrid(lines, rnd);
      findSewableOrder(patches);
      const t = await timeRuns(() => findSewableOrder(patches), 3, 0);
      if (t.maxMs > worst) [worst, worstPatches] = [t.maxMs, patches.length];
      const v = verdictOf(findSewableOrder(patches));
      verdicts[v] = (verdicts[v] ?? 0) + 1;
    }
    rows.push({ section: `20 random sections of ${lines} crossing seams: slowest (${worstPatches} patches)`, 'median ms': '', 'min–max ms': `max ${ms(worst)}`, verdict: Object.entries(verdicts).map(([k, n]) => `${n} ${k}`).join(', ') });
  }

  const fan = arcFan();
  const fanPatches = derivePatches(fan).patches;
  const check = await timeRuns(() => checkSewability(fanPatches), 9, 2);
  rows.push({ section: 'checkSewability, arc fan, given order', 'median ms': ms(check.medianMs), 'min–max ms': `${ms(check.minMs)}–${ms(check.maxMs)}`, verdict: checkSewability(fanPatches).sewable ? 'sewable' : 'not sewable' });
  // A large section for scale: a 360° wedge of radius 199 in. cut by 500 parallel seams (501 patches).
  const strips: Section = {
    id: 'big',
    label: 'Z',
    geometry: { kind: 'wedge', centre: { x: 0, y: 0 }, radiusIn: 199, startAngleDeg: 0, sweepDeg: 360 },
    seams: Array.from({ length: 500 }, (_, i) => ({ id: `s${i}`, a: { x: -199 + (i + 0.5) * (398 / 500), y: -200 }, b: { x: -199 + (i + 0.5) * (398 / 500), y: 200 } })),
    patches: [],
  };
  const bigPatches = derivePatches(strips).patches;
  const bigSearch = await timeRuns(() => findSewableOrder(bigPatches), 5, 1);
  const bigCheck = await timeRuns(() => checkSewability(bigPatches), 5, 1);
  const bigCpu = cpuRuns(() => findSewableOrder(bigPatches), 5);
  rows.push({ section: `findSewableOrder, 500 seams across a 199 in. circle (${bigPatches.length} patches)`, 'median ms': ms(bigSearch.medianMs), 'min–max ms': `${ms(bigSearch.minMs)}–${ms(bigSearch.maxMs)}`, 'CPU median / max ms': `${ms(bigCpu.medianMs)} / ${ms(bigCpu.maxMs)}`, verdict: verdictOf(findSewableOrder(bigPatches)) });
  rows.push({ section: `checkSewability, those ${bigPatches.length} patches`, 'median ms': ms(bigCheck.medianMs), 'min–max ms': `${ms(bigCheck.minMs)}–${ms(bigCheck.maxMs)}`, verdict: checkSewability(bigPatches).sewable ? 'sewable' : 'not sewable' });
  return {
    title: 'Sewability: order search with a work budget',
    rows,
    notes: [
      ...notes,
      'Targets (issue 16): the 20-patch Y-seam case ≤ 100 ms; no findSewableOrder call over 250 ms at any size up to the schema\'s 500 patches per section.',
      'One search per call with a work budget counted in units (patches tried + sets expanded, weighted by mask words), not time: the answer is the same on every machine; past the budget it is "undecided", never a guess.',
      'A set holding a self-blocking group (each patch of it meets the others along two lines, or along a line they cross) is ruled out at once; "budget spent" times the search with that check off, so it tries sets until its budget is gone: the slowest path a call can take.',
      'The split advice asks the same search object: the failed search\'s remembered sets, its self-blocking group and its budget carry over.',
      'Times include preparing the contacts. "CPU" is this process\'s CPU time per call (process.cpuUsage), apart from the wall time, which on this shared 2-core machine also holds other processes\' turns. Medians of 7 runs after 1 warm-up (9 after 2 for the 20-patch cases, 3 per random section); min–max over those runs. The machine is a shared 2-core one: maxima include other processes.',
    ],
  };
}
