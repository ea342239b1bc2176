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
 * document order; but first a join after which no other touching part would need an inset), each seam pressed toward the unit grown from the centre. When the unit at the centre
 * cannot grow without an inset, the other parts that can be joined with one seam are joined first (the
 * longest seam first); only when nothing else can be sewn in one go does the plan take an inset, which
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

  let current = units.reduce((best, u) => (u.fromCentreIn < best.fromCentreIn - 1e-9 ? u : best));
  let joinCount = 0;
  const join = (a: Candidate, b: Candidate): Candidate => {
    const id = newId(`join-${++joinCount}`);
    steps.push({ id, kind: 'join', a: a.id, b: b.id, press: 'a' });
    const merged: Candidate = { id, instances: [...a.instances, ...b.instances], fromCentreIn: Math.min(a.fromCentreIn, b.fromCentreIn), order: Math.min(a.order, b.order) };
    units = [...units.filter((u) => u !== a && u !== b), merged];
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
    for (const u of units) {
      if (u === current || !unitsNear(ctx, current, u)) continue;
      const c = ctx.contacts.contact(current.instances, u.instances);
      if (c.paths.length === 0) continue;
      const entry = { length: c.lengthIn, u };
      if (better(entry, touching)) touching = entry;
      if (!c.continuous) continue;
      const trapped = lookAhead ? trappedBy(ctx, units, current, u) : 0;
      if (!best || trapped < best.trapped || (trapped === best.trapped && better(entry, best))) best = { ...entry, trapped };
    }
    if (best) {
      current = join(current, best.u);
      continue;
    }
    // 2. Join two other parts that meet along one seam, so the centre can grow onto the unit they make.
    let pair: { length: number; u: Candidate; v: Candidate } | undefined;
    for (let i = 0; i < units.length; i++) {
      for (let j = i + 1; j < units.length; j++) {
        const [u, v] = [units[i], units[j]];
        if (u === current || v === current || !unitsNear(ctx, u, v)) continue;
        const c = ctx.contacts.contact(u.instances, v.instances);
        const inner = u.fromCentreIn <= v.fromCentreIn ? u : v;
        if (c.continuous && better({ length: c.lengthIn, u: inner }, pair)) pair = { length: c.lengthIn, u: inner, v: inner === u ? v : u };
      }
    }
    if (pair) {
      join(pair.u, pair.v);
      continue;
    }
    // 3. Nothing joins with one seam: take the longest inset onto the centre unit, else the nearest part.
    const next = touching?.u ?? units.filter((u) => u !== current).reduce((b, u) => (u.fromCentreIn < b.fromCentreIn ? u : b));
    current = join(current, next);
  }
  return { steps };
}

const LOOK_AHEAD_MAX_UNITS = 400;

/** How many other parts would meet the unit of `a` and `b` only along a broken or cornered seam (an inset). */
function trappedBy(ctx: JoiningContext, units: readonly Candidate[], a: Candidate, b: Candidate): number {
  const merged: Candidate = { ...a, instances: [...a.instances, ...b.instances] };
  let trapped = 0;
  for (const u of units) {
    if (u === a || u === b || !unitsNear(ctx, merged, u)) continue;
    const c = ctx.contacts.contact(merged.instances, u.instances);
    if (c.paths.length > 0 && !c.continuous) trapped++;
  }
  return trapped;
}

function unitsNear(ctx: JoiningContext, a: Candidate, b: Candidate): boolean {
  return a.instances.some((i) => b.instances.some((j) => ctx.contacts.near(i, j)));
}

/** Distance from `p` to the outline (0 when inside), in inches. */
function distanceFromPoint(ring: readonly Point[], p: Point): number {
  if (locatePoint(p, ring) !== 'outside') return 0;
  let d = Infinity;
  for (let i = 0; i < ring.length; i++) d = Math.min(d, distanceToSegment(p, ring[i], ring[(i + 1) % ring.length]));
  return d;
}
