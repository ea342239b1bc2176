/**
 * Geometry and cutting benchmark (docs/design-notes.md#seam-allowance and #cutting-list): seam-allowance
 * offsets by ¼ in. with mitre joins (limit {@link MITRE_LIMIT}) of 10,000 flattened arc sections and
 * 10,000 quads, by clipper-lib (the product's offsets), jsts buffers (JTS port, our second opinion) and,
 * for reference only, js-angusj-clipper (the same Clipper compiled to WebAssembly). Each library takes
 * points in inches and gives points back, as the product uses it. The libraries run in interleaved
 * rounds (clipper-lib, jsts, wasm, clipper-lib, …); each round's time is divided by clipper-lib's in
 * the same round, and the report gives the median and min–max of those ratios.
 *
 * Shapes are split by their sharpest convex corner: inside the mitre limit (every corner's mitre at
 * most 4 × the offset) the libraries draw the same outline and are compared on time; corners sharper
 * than that are cut off by design differently (Clipper squares a corner at 1 × the offset, JTS bevels it
 * at the limit), so those shapes are timed and reported apart with their area disagreement.
 * Targets: offsets ≥ 1.5× faster than jsts on shapes inside the limit; cutting list < 200 ms. Nothing
 * here fails on a time.
 */
import os from 'node:os';
import { loadNativeClipperLibInstanceAsync, NativeClipperLibRequestedFormat, JoinType, EndType, type ClipperLibWrapper } from 'js-angusj-clipper';
import type { Point } from '../projects/piecing/src/public-api';
import { buildCuttingList, flattenSectionOutline, polygonArea } from '../projects/piecing/src/public-api';
import { buildStressPattern, jstsBufferParameters, jstsBufferRing, MITRE_LIMIT, PolygonOffsetter } from '../projects/piecing/src/testing';
import { interleavedRounds, ms, ratioNote, roundsRows, timeRuns, type BenchSection, type RoundsResult } from './bench-kit';
import { seededRandom } from '../tests/support/random';

const COUNT = 10_000;
const ALLOWANCE_IN = 0.25;
const ROUNDS = 7;
/** The integer scale of the WebAssembly offsets: the product's CLIPPER_SCALE (10,000 units per inch). */
const WASM_SCALE = 10_000;
/**
 * The interior angle below which a convex corner's mitre is longer than MITRE_LIMIT × the offset: a
 * mitre at a corner of interior angle θ reaches 1 / sin(θ / 2) × the offset from the corner.
 */
const SHARP_BELOW_DEG = (2 * Math.asin(1 / MITRE_LIMIT) * 180) / Math.PI;

function arcSections(count: number): Point[][] {
  const rnd = seededRandom(1);
  return Array.from({ length: count }, () => {
    const inner = 2 + rnd() * 8;
    return flattenSectionOutline({
      kind: 'arc',
      centre: { x: 50 + rnd() * 10, y: 50 + rnd() * 10 },
      innerRadiusIn: inner,
      outerRadiusIn: inner + 1 + rnd() * 3,
      startAngleDeg: rnd() * 360,
      sweepDeg: 15 + rnd() * 45,
    });
  });
}

function quads(count: number): Point[][] {
  const rnd = seededRandom(2);
  return Array.from({ length: count }, () => {
    const x = rnd() * 40;
    const y = rnd() * 40;
    // Quads 1–4 in. across; some of their corners are sharper than the mitre limit's angle.
    return [
      { x, y },
      { x: x + 1 + rnd() * 3, y: y + rnd() * 0.5 },
      { x: x + 1 + rnd() * 3, y: y + 1 + rnd() * 3 },
      { x: x + rnd() * 0.5, y: y + 1 + rnd() * 3 },
    ];
  });
}

/** The smallest interior angle (degrees) of the ring's convex corners. */
export function sharpestConvexCornerDeg(ring: readonly Point[]): number {
  const orientation = Math.sign(signed(ring));
  let min = 180;
  for (let i = 0; i < ring.length; i++) {
    const a = ring[(i + ring.length - 1) % ring.length];
    const b = ring[i];
    const c = ring[(i + 1) % ring.length];
    const ux = a.x - b.x, uy = a.y - b.y, vx = c.x - b.x, vy = c.y - b.y;
    const cross = (b.x - a.x) * (c.y - b.y) - (b.y - a.y) * (c.x - b.x);
    if (Math.sign(cross) !== orientation) continue; // a concave (or straight) corner has no mitre
    const angle = (Math.acos(Math.max(-1, Math.min(1, (ux * vx + uy * vy) / (Math.hypot(ux, uy) * Math.hypot(vx, vy))))) * 180) / Math.PI;
    min = Math.min(min, angle);
  }
  return min;
}

function signed(ring: readonly Point[]): number {
  let s = 0;
  for (let i = 0; i < ring.length; i++) {
    const p = ring[i], q = ring[(i + 1) % ring.length];
    s += p.x * q.y - q.x * p.y;
  }
  return s / 2;
}

/** Offsets with js-angusj-clipper: inches to integers, the largest result ring back to inches. */
function wasmOffset(clipper: ClipperLibWrapper, ring: readonly Point[], distanceIn: number): Point[] {
  const data = ring.map((p) => ({ x: Math.round(p.x * WASM_SCALE), y: Math.round(p.y * WASM_SCALE) }));
  const out = clipper.offsetToPaths({ delta: distanceIn * WASM_SCALE, miterLimit: MITRE_LIMIT, offsetInputs: [{ data, joinType: JoinType.Miter, endType: EndType.ClosedPolygon }] }) ?? [];
  let best: Array<{ x: number; y: number }> | undefined;
  let bestArea = 0;
  for (const path of out) {
    const area = Math.abs(clipper.area(path));
    if (area > bestArea) {
      bestArea = area;
      best = path;
    }
  }
  return best ? best.map((p) => ({ x: p.x / WASM_SCALE, y: p.y / WASM_SCALE })) : [];
}

/** Largest relative area difference between two libraries' offsets of the same shapes. */
function areaDisagreement(a: Point[][], b: Point[][]): number {
  let worst = 0;
  for (let i = 0; i < a.length; i++) {
    const x = Math.abs(polygonArea(a[i]));
    const y = Math.abs(polygonArea(b[i]));
    worst = Math.max(worst, Math.abs(x - y) / Math.max(x, y));
  }
  return worst;
}

const pct = (v: number) => `${(v * 100).toFixed(v < 0.001 ? 4 : 2)} %`;

export default async function geometryBench(): Promise<BenchSection> {
  const loadBefore = os.loadavg()[0];
  const clipper = await loadNativeClipperLibInstanceAsync(NativeClipperLibRequestedFormat.WasmWithAsmJsFallback);
  const params = jstsBufferParameters('mitre', MITRE_LIMIT);
  const allQuads = quads(COUNT);
  const arcs = arcSections(COUNT);
  const sets: Array<{ name: string; shapes: Point[][]; insideLimit: boolean }> = [
    { name: 'arc sections', shapes: arcs.filter((r) => sharpestConvexCornerDeg(r) >= SHARP_BELOW_DEG), insideLimit: true },
    { name: 'quads', shapes: allQuads.filter((r) => sharpestConvexCornerDeg(r) >= SHARP_BELOW_DEG), insideLimit: true },
    { name: 'quads with a corner sharper than the limit', shapes: allQuads.filter((r) => sharpestConvexCornerDeg(r) < SHARP_BELOW_DEG), insideLimit: false },
    { name: 'arc sections with a corner sharper than the limit', shapes: arcs.filter((r) => sharpestConvexCornerDeg(r) < SHARP_BELOW_DEG), insideLimit: false },
  ];
  const rows: BenchSection['rows'] = [];
  const notes: string[] = [];
  const results: Array<{ set: (typeof sets)[number]; result: RoundsResult }> = [];
  for (const set of sets) {
    if (set.shapes.length === 0) continue;
    const variants = [
      // One offsetter for the batch, as the cutting list and print sets use it.
      { name: 'clipper-lib', run: () => { const o = new PolygonOffsetter(); for (const p of set.shapes) o.offsetPolygon(p, ALLOWANCE_IN, 'mitre'); } },
      { name: 'jsts', run: () => { for (const p of set.shapes) jstsBufferRing(p, ALLOWANCE_IN, params); } },
      { name: 'js-angusj-clipper (wasm)', run: () => { for (const p of set.shapes) wasmOffset(clipper, p, ALLOWANCE_IN); } },
    ];
    const result = await interleavedRounds(variants, { rounds: ROUNDS, warmup: 1, baseline: 'clipper-lib' });
    results.push({ set, result });
    const o = new PolygonOffsetter();
    const ours = set.shapes.map((p) => o.offsetPolygon(p, ALLOWANCE_IN, 'mitre'));
    const theirs = set.shapes.map((p) => jstsBufferRing(p, ALLOWANCE_IN, params));
    const wasm = set.shapes.map((p) => wasmOffset(clipper, p, ALLOWANCE_IN));
    const vertices = set.shapes.reduce((s, p) => s + p.length, 0) / set.shapes.length;
    rows.push(
      ...roundsRows(result, { shapes: `${set.shapes.length.toLocaleString('en')} ${set.name}, ${vertices.toFixed(1)} vertices on average` }).map((row) => ({
        ...row,
        'area apart from clipper-lib (largest)': row['variant'] === 'jsts' ? pct(areaDisagreement(ours, theirs)) : row['variant'] === 'clipper-lib' ? '' : pct(areaDisagreement(ours, wasm)),
      })),
    );
  }

  // Everything inside the mitre limit: per round, the sum of the sets' times.
  const inside = results.filter((r) => r.set.insideLimit);
  const total = (name: string, round: number) => inside.reduce((s, r) => s + r.result.variants.find((v) => v.name === name)!.timesMs[round], 0);
  const perRound = (name: string) => Array.from({ length: ROUNDS }, (_, i) => total(name, i) / total('clipper-lib', i));
  const jstsRatios = perRound('jsts');
  const wasmRatios = perRound('js-angusj-clipper (wasm)');
  const med = (v: number[]) => [...v].sort((a, b) => a - b)[Math.floor(v.length / 2)];
  const range = (v: number[]) => `${Math.min(...v).toFixed(2)}–${Math.max(...v).toFixed(2)}`;
  const insideCount = inside.reduce((s, r) => s + r.set.shapes.length, 0);
  notes.push(
    `All ${insideCount.toLocaleString('en')} shapes inside the mitre limit, per round: jsts ÷ clipper-lib = ${med(jstsRatios).toFixed(2)}× (${range(jstsRatios)} over ${ROUNDS} rounds), ` +
      `i.e. clipper-lib is ${med(jstsRatios).toFixed(2)}× as fast as jsts; js-angusj-clipper (wasm) ÷ clipper-lib = ${med(wasmRatios).toFixed(2)}× (${range(wasmRatios)}). Target ≥ 1.5×: ${med(jstsRatios) >= 1.5 ? 'met' : 'NOT met'}.`,
  );
  const none = sets.filter((s) => s.shapes.length === 0).map((s) => s.name);
  if (none.length > 0) notes.push(`No shapes in this run: ${none.join('; ')}.`);
  for (const r of results) notes.push(`${r.set.name}: ${ratioNote(r.result, 'jsts')}; ${ratioNote(r.result, 'js-angusj-clipper (wasm)')}.`);
  notes.push(
    `Corner split: a convex corner sharper than ${SHARP_BELOW_DEG.toFixed(1)}° has a mitre longer than ${MITRE_LIMIT} × the offset (1 / sin(θ/2), plane geometry). There Clipper squares the corner off at 1 × the offset and JTS bevels it at the limit, so their areas differ by design; inside the limit they differ only by Clipper's rounding to 1/10,000 in.`,
  );
  notes.push(
    'clipper-lib is timed through the product\'s PolygonOffsetter: ClipperOffset\'s offset formulas and rounding, with the loop it leaves at every concave vertex (every vertex of an arc section\'s inner arc) replaced by the crossing of the two offset edges, and its closing union left out when a check shows nothing else overlaps (ClipperOffset runs in full otherwise; docs/design-notes.md#seam-allowance). jsts buffers and js-angusj-clipper offsets (with its union) the same rings in inches. js-angusj-clipper is for reference only; the product keeps clipper-lib.',
  );

  const pattern = buildStressPattern(1000);
  const list = buildCuttingList(pattern);
  const cutting = await timeRuns(() => buildCuttingList(pattern), 9, 2);
  rows.push({ shapes: `cutting list, ${list.patches.length.toLocaleString('en')} patches in ${pattern.sections.length} sections`, variant: 'clipper-lib', rounds: 9, 'median ms': ms(cutting.medianMs), 'min–max ms': `${ms(cutting.minMs)}–${ms(cutting.maxMs)}` });
  notes.push(`Machine load average (1 min) ${loadBefore.toFixed(1)} before and ${os.loadavg()[0].toFixed(1)} after on ${os.cpus().length} cores: load lengthens every time; the interleaved rounds keep the ratios comparable.`);
  notes.push(`Cutting list of a 1,000-patch pattern: median ${ms(cutting.medianMs)} ms, p95 ${ms(cutting.p95Ms)} ms (target < 200 ms), splitting the sections into patches included.`);
  return { title: 'Geometry: seam-allowance offsets (clipper-lib, jsts, js-angusj-clipper) and the cutting list', rows, notes };
}
