/*
 * The joining plan (docs/pattern-format.md#joining-plan): how pieced sections are joined into units and
 * units into the block, the default plan, its check, and how the seams inside a section are pressed.
 */
import type { PatternDocument } from '../document/pattern-schema';
import { buildDefaultJoiningPlan } from './default-joining-plan';
import { JoiningContext } from './joining-context';
import type { JoiningPlan, JoiningProblem, ResolvedJoiningPlan } from './joining-types';
import { evaluateJoiningPlan } from './resolve-joining-plan';

export type { JoiningPlan, JoinPart, JoinSeam, JoinPress, ResolvedJoinStep, ResolvedJoiningPlan, JoiningProblem, JoiningProblemKind, SeamPressing } from './joining-types';
export { seamPressing, sectionSeamPressing } from './seam-pressing';
export { JOIN_TOLERANCES } from './part-contacts';
export { withRingEdgesAsCurves } from './follow-ring-edges';

/** What the joining functions read of a document. */
export type JoiningDocument = Pick<PatternDocument, 'sections' | 'canvas'> & Partial<Pick<PatternDocument, 'joiningPlan'>>;

/**
 * The library's joining plan for a document (docs/design-notes.md and docs/pattern-format.md#joining-plan):
 * ring copies into rings, then from the centre of the block outward, along the longest shared seam first.
 * Step ids are `ring-<section id>` and `join-<n>` (made unique against the section ids).
 */
export function defaultJoiningPlan(doc: JoiningDocument): JoiningPlan {
  return buildDefaultJoiningPlan(new JoiningContext(doc));
}

/**
 * The joining plan to show and print: the designer's (`doc.joiningPlan`) when there is one, else the
 * default; every step resolved (parts, seam, pressing, matching marks) with the plan's problems.
 */
export function resolveJoiningPlan(doc: JoiningDocument): ResolvedJoiningPlan {
  const ctx = new JoiningContext(doc);
  const isDefault = !doc.joiningPlan;
  const plan = doc.joiningPlan ?? buildDefaultJoiningPlan(ctx);
  const { steps, problems } = evaluateJoiningPlan(ctx, plan);
  return { steps, problems, isDefault };
}

/**
 * Checks a joining plan against the document: every part named exists and is used once, every join is
 * one continuous seam (else an inset, with the parts and the point to pivot at), parts that are joined
 * touch, curved seams carry matching marks on both sides, and every section ends in one final unit.
 * Messages are plain words naming the parts (section letters, `the B ring`, `unit 3 (A, B)`).
 */
export function checkJoiningPlan(doc: JoiningDocument, plan: JoiningPlan): JoiningProblem[] {
  return evaluateJoiningPlan(new JoiningContext(doc), plan).problems;
}
