import type { JoinStepInput, Point } from '../document/pattern-schema';
import { distanceToSegment, locatePoint } from '../geometry/index';
import type { JoiningContext } from './joining-context';
import type { JoiningPlan } from './joining-types';

interface Candidate {
  id: string;
  instances: number[];
  /** How far the part lies from the centre of the block (0 when it covers it), in inches. */
  fromCentreIn: number;
  /** Place in the document of its first section, for ties. */
  order: number;
}

/**
 * The library's joining plan (docs/pattern-format.md#joining-plan): first the copies of every ring repeat
 * into rings (seams pressed clockwise); then, from the part at the centre of the block outward, the
 * touching part sharing the longest seam that can be sewn in one go (ties: nearer the centre, then
 * document order), each seam pressed toward the unit grown from the centre.
 *
 * Looking one join ahead (on patterns of up to 120 parts): a join that would leave a neighbour meeting
 * the grown unit round a corner or in two places (an inset) is put off; other parts that can be joined
 * with one seam are joined first (a row beside a row), those leaving no such neighbour first, then the
 * longest seam. Only when nothing can be sewn in one go does the plan take an inset, which
 * `checkJoiningPlan` then reports. Every section ends up in one unit.
 */
export function buildDefaultJoiningPlan(ctx: JoiningContext): JoiningPlan {
  const steps: JoinStepInput[] = [];
  const taken = new Set(ctx.sections.keys());
  const newId = (base: string): string => {
    const stem = base.slice(0, 58);
    let id = stem;
    for (let k = 2; taken.has(id); k++) id = `${stem}-${k}`;
    taken.add(id);
    return id;
  };
  const centre = ctx.blockCentre;
  let units: Candidate[] = [];
  for (const [sectionId, entry] of ctx.sections) {
    let id = sectionId;
    if (entry.section.ringRepeat) {
      id = newId(`ring-${sectionId}`);
      steps.push({ id, kind: 'ring', sectionId, press: 'clockwise' });
    }
    units.push({ id, instances: entry.instances.slice(), fromCentreIn: Math.min(...entry.instances.map((k) => distanceFromPoint(ctx.instances[k].ring, centre))), order: entry.index });
  }
  if (units.length === 0) return { steps };

  const unitOf = new Map<number, Candidate>();
  for (const u of units) for (const k of u.instances) unitOf.set(k, u);
  let current = units.reduce((best, u) => (u.fromCentreIn < best.fromCentreIn - 1e-9 ? u : best));
  let joinCount = 0;
  const join = (a: Candidate, b: Candidate): Candidate => {
    const id = newId(`join-${++joinCount}`);
    steps.push({ id, kind: 'join', a: a.id, b: b.id, press: 'a' });
    const merged: Candidate = { id, instances: [...a.instances, ...b.instances], fromCentreIn: Math.min(a.fromCentreIn, b.fromCentreIn), order: Math.min(a.order, b.order) };
    units = units.filter((u) => u !== a && u !== b);
    units.push(merged);
    for (const k of merged.instances) unitOf.set(k, merged);
    return merged;
  };
  const better = (x: { length: number; u: Candidate }, y: { length: number; u: Candidate } | undefined) =>
    !y || x.length > y.length + 1e-6 || (Math.abs(x.length - y.length) <= 1e-6 && (x.u.fromCentreIn < y.u.fromCentreIn - 1e-9 || (Math.abs(x.u.fromCentreIn - y.u.fromCentreIn) <= 1e-9 && x.u.order < y.u.order)));

  // Looking one join ahead costs a contact per neighbour per candidate: skipped on very large patterns.
  const lookAhead = units.length <= LOOK_AHEAD_MAX_UNITS;
  while (units.length > 1) {
    // 1. Grow the unit at the centre along its longest seam sewn in one go, preferring joins that leave
    //    no neighbour of the grown unit needing an inset.
    let best: { length: number; u: Candidate; trapped: number } | undefined;
    let touching: { length: number; u: Candidate } | undefined;
    const around = nearUnits(ctx, unitOf, current);
    for (const u of units) {
      if (!around.has(u)) continue;
      const c = ctx.contacts.contact(current.instances, u.instances);
      if (c.paths.length === 0) continue;
      const entry = { length: c.lengthIn, u };
      if (better(entry, touching)) touching = entry;
      if (!c.continuous) continue;
      const trapped = lookAhead ? trappedBy(ctx, unitOf, current, u) : 0;
      if (!best || trapped < best.trapped || (trapped === best.trapped && better(entry, best))) best = { ...entry, trapped };
    }
    if (best && best.trapped === 0) {
      current = join(current, best.u);
      continue;
    }
    // 2. Join two other parts that meet along one seam, so the centre can grow onto the unit they make
    //    (those that leave no neighbour needing an inset first, then the longest seam).
    let pair: { length: number; u: Candidate; v: Candidate; trapped: number } | undefined;
    // Built only when the pair search runs: on larger patterns it would be a map of every part per join.
    const place = units.length <= PAIR_SEARCH_MAX_UNITS ? new Map(units.map((u, i) => [u, i])) : new Map<Candidate, number>();
    for (const u of units.length <= PAIR_SEARCH_MAX_UNITS ? units : []) {
      if (u === current) continue;
      for (const v of nearUnits(ctx, unitOf, u)) {
        if (v === current || place.get(v)! < place.get(u)!) continue;
        const c = ctx.contacts.contact(u.instances, v.instances);
        if (!c.continuous) continue;
        const inner = u.fromCentreIn <= v.fromCentreIn ? u : v;
        const trapped = lookAhead ? trappedBy(ctx, unitOf, u, v) : 0;
        const entry = { length: c.lengthIn, u: inner };
        if (!pair || trapped < pair.trapped || (trapped === pair.trapped && better(entry, pair))) pair = { ...entry, v: inner === u ? v : u, trapped };
      }
    }
    if (pair && (!best || pair.trapped < best.trapped)) {
      join(pair.u, pair.v);
      continue;
    }
    if (best) {
      current = join(current, best.u);
      continue;
    }
    // 3. Nothing joins with one seam: take the longest inset onto the centre unit, else the nearest part.
    const next = touching?.u ?? nearestOther(units, current);
    current = join(current, next);
  }
  return { steps };
}

/** The part nearest the centre other than `current` (the first of equals), without copying the list. */
function nearestOther(units: readonly Candidate[], current: Candidate): Candidate {
  let best: Candidate | undefined;
  for (const u of units) if (u !== current && (!best || u.fromCentreIn < best.fromCentreIn)) best = u;
  return best!;
}

const LOOK_AHEAD_MAX_UNITS = 120;
// Searching all pairs of other parts costs a pass over every part per join: only on patterns up to this many parts.
const PAIR_SEARCH_MAX_UNITS = 300;

/** How many other parts would meet the unit of `a` and `b` only along a broken or cornered seam (an inset). */
function trappedBy(ctx: JoiningContext, unitOf: ReadonlyMap<number, Candidate>, a: Candidate, b: Candidate): number {
  const merged: Candidate = { ...a, instances: [...a.instances, ...b.instances] };
  const around = new Set([...nearUnits(ctx, unitOf, a), ...nearUnits(ctx, unitOf, b)]);
  let trapped = 0;
  for (const u of around) {
    if (u === a || u === b) continue;
    const c = ctx.contacts.contact(merged.instances, u.instances);
    if (c.paths.length > 0 && !c.continuous) trapped++;
  }
  return trapped;
}

/** The units with a copy near a copy of `u` (by the contact finder's neighbour lists). */
function nearUnits(ctx: JoiningContext, unitOf: ReadonlyMap<number, Candidate>, u: Candidate): Set<Candidate> {
  const out = new Set<Candidate>();
  for (const i of u.instances) {
    for (const j of ctx.contacts.neighbours(i)) {
      const v = unitOf.get(j);
      if (v && v !== u) out.add(v);
    }
  }
  return out;
}

/** Distance from `p` to the outline (0 when inside), in inches. */
function distanceFromPoint(ring: readonly Point[], p: Point): number {
  if (locatePoint(p, ring) !== 'outside') return 0;
  let d = Infinity;
  for (let i = 0; i < ring.length; i++) d = Math.min(d, distanceToSegment(p, ring[i], ring[(i + 1) % ring.length]));
  return d;
}
