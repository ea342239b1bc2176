import type { JoinStepInput, Point } from '../document/pattern-schema';
import { formatPoint } from '../geometry/index';
import { JoiningContext } from './joining-context';
import type { JoiningPlan, JoiningProblem, JoinPart, JoinPress, JoinSeam, ResolvedJoinStep } from './joining-types';
import { isCurved, type ContactPaths } from './part-contacts';

/** A part while the plan is followed: what it is and which section copies it holds. */
export interface PlanUnit {
  part: JoinPart;
  instances: number[];
}

/** The outcome of following a plan step by step. */
export interface EvaluatedPlan {
  steps: ResolvedJoinStep[];
  problems: JoiningProblem[];
}

/**
 * Follows the plan step by step: resolves each step's parts, finds the seam between them, checks that it
 * is one continuous seam with matching marks on both sides where it curves, and at the end that every
 * section is in one final unit (docs/pattern-format.md#joining-plan).
 */
export function evaluateJoiningPlan(ctx: JoiningContext, plan: JoiningPlan): EvaluatedPlan {
  const steps: ResolvedJoinStep[] = [];
  const problems: JoiningProblem[] = [];
  const available = new Map<string, PlanUnit>();
  const usedIn = new Map<string, number>();
  const laterStepIds = new Map(plan.steps.map((s, i) => [s.id, i + 1]));
  for (const [id, entry] of ctx.sections) {
    if (!entry.section.ringRepeat) available.set(id, { part: { id, label: entry.section.label, sectionIds: [id] }, instances: entry.instances.slice() });
  }
  const ringed = new Set<string>();

  plan.steps.forEach((step, i) => {
    const number = i + 1;
    const report = (kind: JoiningProblem['kind'], message: string, point?: Point) =>
      problems.push({ stepId: step.id, kind, message: `Step ${number}: ${message}`, ...(point ? { point } : {}) });
    const resolved = step.kind === 'ring' ? ringStep(ctx, step, number, ringed, report) : joinStep(ctx, step, number, available, usedIn, laterStepIds, report);
    steps.push(resolved.step);
    if (resolved.unit) {
      for (const partId of resolved.consumed) {
        available.delete(partId);
        usedIn.set(partId, number);
      }
      available.set(step.id, resolved.unit);
    }
  });

  // Every section must end up in the block: one final unit.
  const finals = [...available.values()];
  const main = finals.reduce<PlanUnit | undefined>((best, u) => (!best || u.part.sectionIds.length > best.part.sectionIds.length ? u : best), undefined);
  const inMain = new Set(main?.part.sectionIds ?? []);
  for (const [id, entry] of ctx.sections) {
    if (inMain.has(id)) continue;
    const label = entry.section.label;
    const count = entry.section.ringRepeat?.count;
    const message =
      count && !ringed.has(id)
        ? `The ${count} copies of ${label} are never joined into a ring, so ${label} is not in the block.`
        : `${label} is never joined to the rest of the block${main ? ` (${main.part.label})` : ''}.`;
    const b = ctx.instances[entry.instances[0]].bounds;
    problems.push({ stepId: null, kind: 'missing-section', message, point: { x: (b.minX + b.maxX) / 2, y: (b.minY + b.maxY) / 2 } });
  }
  return { steps, problems };
}

type Report = (kind: JoiningProblem['kind'], message: string, point?: Point) => void;

interface StepOutcome {
  step: ResolvedJoinStep;
  unit?: PlanUnit;
  consumed: string[];
}

const EMPTY_SEAM: JoinSeam = { kind: 'straight', paths: [], lengthIn: 0 };

function ringStep(ctx: JoiningContext, step: Extract<JoinStepInput, { kind: 'ring' }>, number: number, ringed: Set<string>, report: Report): StepOutcome {
  const entry = ctx.sections.get(step.sectionId);
  const label = entry?.section.label ?? step.sectionId;
  const count = entry?.section.ringRepeat?.count ?? 0;
  const part: JoinPart = { id: step.sectionId, label, sectionIds: entry ? [step.sectionId] : [] };
  const press: JoinPress = step.press === 'open' ? { open: true } : { ring: step.press };
  const pressLabel = step.press === 'open' ? 'Press the seams open' : `Press the seams all ${step.press} round the ring (as seen from the front)`;
  const resolved: ResolvedJoinStep = {
    id: step.id,
    number,
    kind: 'ring',
    label: count ? `Join the ${count} copies of ${label} into a ring` : `Join ${label} into a ring`,
    partA: part,
    partB: part,
    seam: EMPTY_SEAM,
    press,
    pressLabel,
    marks: [],
    seamMarks: [],
    ...(count ? { ringCount: count } : {}),
    result: { id: step.id, label: `the ${label} ring`, sectionIds: part.sectionIds },
  };
  if (!entry) {
    report('unknown-part', `there is no section "${step.sectionId}" to join into a ring.`);
    return { step: resolved, consumed: [] };
  }
  if (!count) {
    report('unknown-part', `${label} has no ring repeat, so it has no copies to join into a ring.`);
    return { step: resolved, consumed: [] };
  }
  if (ringed.has(step.sectionId)) {
    report('reused-part', `the copies of ${label} are joined into a ring twice.`);
    return { step: resolved, consumed: [] };
  }
  ringed.add(step.sectionId);
  const copies = entry.instances;
  const paths: Point[][] = [];
  let lengthIn = 0;
  const marks: Point[] = [];
  const seamMarks: Point[] = [];
  copies.forEach((k, i) => {
    const next = copies[(i + 1) % copies.length];
    const contact = ctx.contacts.contact([k], [next]);
    const which = i + 1 < copies.length ? `copies ${i + 1} and ${i + 2} of ${label}` : `the last copy of ${label} and the first (closing the ring)`;
    checkContact(ctx, contact, [k], [next], which, report);
    paths.push(...contact.paths);
    lengthIn += contact.lengthIn;
    for (const m of ctx.joinMarks([k], [next])) (m.kind === 'spacing' ? marks : seamMarks).push(m.a);
  });
  resolved.seam = { kind: isCurved(paths) ? 'curved' : 'straight', paths, lengthIn };
  resolved.marks = marks;
  resolved.seamMarks = seamMarks;
  return { step: resolved, unit: { part: resolved.result, instances: copies.slice() }, consumed: [] };
}

function joinStep(
  ctx: JoiningContext,
  step: Extract<JoinStepInput, { kind: 'join' }>,
  number: number,
  available: Map<string, PlanUnit>,
  usedIn: Map<string, number>,
  laterStepIds: Map<string, number>,
  report: Report,
): StepOutcome {
  const lookup = (id: string): PlanUnit | undefined => {
    const unit = available.get(id);
    if (unit) return unit;
    const entry = ctx.sections.get(id);
    const used = usedIn.get(id);
    if (used !== undefined) report('reused-part', `${entry?.section.label ?? `the unit of step ${laterStepIds.get(id) ?? id}`} was already joined in step ${used}.`);
    else if (entry?.section.ringRepeat) report('unknown-part', `${entry.section.label} is a ring repeat: join its copies into a ring first, then join the ring.`);
    else if (laterStepIds.has(id)) report('unknown-part', `it names the unit of step ${laterStepIds.get(id)}, which is not made yet.`);
    else report('unknown-part', `"${id}" is neither a section nor an earlier step.`);
    return undefined;
  };
  const a = lookup(step.a);
  const b = step.a === step.b ? undefined : lookup(step.b);
  if (step.a === step.b) report('reused-part', `it joins ${a?.part.label ?? step.a} to itself.`);
  const partA = a?.part ?? { id: step.a, label: step.a, sectionIds: [] };
  const partB = b?.part ?? { id: step.b, label: step.b, sectionIds: [] };
  const held = new Set([...partA.sectionIds, ...partB.sectionIds]);
  const sectionIds = [...ctx.sections.keys()].filter((id) => held.has(id));
  const labels = sectionIds.map((id) => ctx.sections.get(id)!.section.label);
  const result: JoinPart = { id: step.id, label: `unit ${number} (${labels.join(', ')})`, sectionIds };
  const press: JoinPress = step.press === 'open' ? { open: true } : { toward: step.press === 'a' ? partA.id : partB.id };
  const resolved: ResolvedJoinStep = {
    id: step.id,
    number,
    kind: 'join',
    label: `Join ${partA.label} to ${partB.label}`,
    partA,
    partB,
    seam: EMPTY_SEAM,
    press,
    pressLabel: step.press === 'open' ? 'Press the seam open' : `Press the seam toward ${step.press === 'a' ? partA.label : partB.label}`,
    marks: [],
    seamMarks: [],
    result,
  };
  const instances = [...(a?.instances ?? []), ...(b?.instances ?? [])];
  const consumed = [a ? step.a : null, b ? step.b : null].filter((x): x is string => x !== null);
  if (!a || !b) return { step: resolved, unit: instances.length ? { part: result, instances } : undefined, consumed };
  const contact = ctx.contacts.contact(a.instances, b.instances);
  checkContact(ctx, contact, a.instances, b.instances, `${partA.label} and ${partB.label}`, report);
  const curved = isCurved(contact.paths);
  resolved.seam = { kind: curved ? 'curved' : 'straight', paths: contact.paths, lengthIn: contact.lengthIn };
  const marks = ctx.joinMarks(a.instances, b.instances);
  resolved.marks = marks.filter((m) => m.kind === 'spacing').map((m) => m.a);
  resolved.seamMarks = marks.filter((m) => m.kind !== 'spacing').map((m) => m.a);
  return { step: resolved, unit: { part: result, instances }, consumed };
}

/** Reports a join whose parts do not touch, meet along more than one stretch or round a corner, or whose curve lacks matching marks. */
function checkContact(ctx: JoiningContext, contact: ContactPaths, a: readonly number[], b: readonly number[], parts: string, report: Report): void {
  if (contact.paths.length === 0) {
    const gap = nearestGap(ctx, a, b);
    report('not-touching', `${parts} do not touch (nearest ${gap.distance.toFixed(2)} in. apart near ${formatPoint(gap.point)}), so there is no seam to join them along.`, gap.point);
    return;
  }
  if (!contact.continuous) {
    const where = contact.pivot ? ` at ${formatPoint(contact.pivot)}` : '';
    const how = contact.paths.length > 1 ? `along ${contact.paths.length} separate stretches of edge` : 'along an edge that turns a corner';
    report('inset', `${parts} meet ${how}, so joining them needs an inset (Y) seam, pivoting${where}.`, contact.pivot);
    return;
  }
  if (!isCurved(contact.paths)) return;
  const marks = ctx.joinMarks(a, b).filter((m) => m.kind === 'spacing');
  if (marks.length === 0) {
    report('marks-mismatch', `the curved seam between ${parts} has no matching marks.`, contact.paths[0][0]);
    return;
  }
  const lonely = marks.find((m) => m.b === null)?.a ?? ctx.unmatchedOnB(a, b);
  if (lonely) report('marks-mismatch', `a matching mark on the curved seam between ${parts} at ${formatPoint(lonely)} has no twin on the other side.`, lonely);
}

// Pairs of copies whose outlines are compared point by point when looking for the gap between two parts.
const GAP_PAIRS = 6;

/** Where two parts come nearest (between outline points of the copies whose bounds are nearest), for the message. */
function nearestGap(ctx: JoiningContext, a: readonly number[], b: readonly number[]): { distance: number; point: Point } {
  const boxGap = (i: number, j: number) => {
    const p = ctx.instances[i].bounds;
    const q = ctx.instances[j].bounds;
    return Math.hypot(Math.max(0, p.minX - q.maxX, q.minX - p.maxX), Math.max(0, p.minY - q.maxY, q.minY - p.maxY));
  };
  // The GAP_PAIRS nearest pairs by box gap, in the order a stable sort of all pairs would give (ties in
  // the order met): kept as they come, without listing every pair (two large units have thousands).
  const pairs: Array<[number, number, number]> = [];
  for (const i of a) {
    const p = ctx.instances[i].bounds;
    for (const j of b) {
      if (pairs.length === GAP_PAIRS) {
        // hypot(dx, dy) is never below the larger of dx and dy: a pair whose larger side is already no
        // nearer than the sixth pair kept would be passed over below, so skip the hypot.
        const q = ctx.instances[j].bounds;
        if (Math.max(0, p.minX - q.maxX, q.minX - p.maxX, p.minY - q.maxY, q.minY - p.maxY) >= pairs[GAP_PAIRS - 1][0]) continue;
      }
      const gap = boxGap(i, j);
      if (pairs.length === GAP_PAIRS && gap >= pairs[GAP_PAIRS - 1][0]) continue;
      let k = pairs.length;
      while (k > 0 && pairs[k - 1][0] > gap) k--;
      pairs.splice(k, 0, [gap, i, j]);
      if (pairs.length > GAP_PAIRS) pairs.pop();
    }
  }
  let best = { distance: Infinity, point: { x: 0, y: 0 } };
  for (const [, i, j] of pairs) {
    for (const p of ctx.instances[i].ring) {
      for (const q of ctx.instances[j].ring) {
        const d = Math.hypot(p.x - q.x, p.y - q.y);
        if (d < best.distance) best = { distance: d, point: { x: (p.x + q.x) / 2, y: (p.y + q.y) / 2 } };
      }
    }
  }
  return best;
}

