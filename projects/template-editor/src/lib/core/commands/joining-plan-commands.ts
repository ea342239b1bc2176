import { checkJoiningPlan, defaultJoiningPlan, type PatternDocument } from '@seamwright/piecing';

/*
 * The designer's joining plan as named commands: take the library's default plan as one's own, move a
 * join earlier or later, set how a join is pressed, go back to the default. Each is a pure function of
 * the document (one undo step in the store); one that cannot be done returns the document it was given.
 * Moving or pressing a join of the default plan first makes the default the designer's plan, in the same
 * step. The plan's soundness is piecing's `checkJoiningPlan` (docs/pattern-format.md#joining-plan).
 */

/** A joining plan as the document holds it. */
export type DocumentJoiningPlan = NonNullable<PatternDocument['joiningPlan']>;
/** One step of it: a ring of copies, or a join of two parts. */
export type DocumentJoinStep = DocumentJoiningPlan['steps'][number];
/** How a ring's seams are pressed: all one way round, or open. */
export type RingPress = Extract<DocumentJoinStep, { kind: 'ring' }>['press'];
/** How a join's seam is pressed: toward part a, toward part b, or open. */
export type JoinPress = Extract<DocumentJoinStep, { kind: 'join' }>['press'];

/** The plan the designer sees: their own, else a copy of the library's default. */
export function currentJoiningPlan(document: PatternDocument): DocumentJoiningPlan {
  if (document.joiningPlan) return document.joiningPlan;
  return { steps: defaultJoiningPlan(document).steps.map((s) => ({ ...s })) };
}

/** Takes the default plan as the designer's own (nothing happens when there is one already or no join at all). */
export function adoptDefaultJoiningPlan(document: PatternDocument): PatternDocument {
  if (document.joiningPlan) return document;
  const plan = currentJoiningPlan(document);
  return plan.steps.length === 0 ? document : { ...document, joiningPlan: plan };
}

/** Drops the designer's plan: the library's default applies again. */
export function resetJoiningPlan(document: PatternDocument): PatternDocument {
  if (!document.joiningPlan) return document;
  const { joiningPlan: _old, ...rest } = document;
  return rest;
}

/** The plan with one step moved by `delta` places, or null when it would leave the list. */
function movedPlan(plan: DocumentJoiningPlan, stepId: string, delta: -1 | 1): DocumentJoiningPlan | null {
  const i = plan.steps.findIndex((s) => s.id === stepId);
  const j = i + delta;
  if (i < 0 || j < 0 || j >= plan.steps.length) return null;
  const steps = plan.steps.slice();
  [steps[i], steps[j]] = [steps[j], steps[i]];
  return { steps };
}

/**
 * Why a join cannot move one place earlier (`-1`) or later (`1`), in words, or null when it can: it is
 * first or last, or the move makes the plan wrong where it was right (a join before the unit it needs
 * is made), checked with piecing's `checkJoiningPlan`.
 */
export function joiningStepMoveProblem(document: PatternDocument, stepId: string, delta: -1 | 1): string | null {
  const plan = currentJoiningPlan(document);
  const i = plan.steps.findIndex((s) => s.id === stepId);
  if (i < 0) return 'there is no such join in the plan';
  const moved = movedPlan(plan, stepId, delta);
  if (!moved) return delta < 0 ? 'it is the first join already' : 'it is the last join already';
  const key = (p: { kind: string; stepId: string | null }) => `${p.kind}|${p.stepId ?? ''}`;
  const before = new Set(checkJoiningPlan(document, plan).map(key));
  const added = checkJoiningPlan(document, moved).find((p) => !before.has(key(p)));
  return added ? added.message : null;
}

/** Moves a join one place earlier (`-1`) or later (`1`) when {@link joiningStepMoveProblem} finds nothing against it. */
export function moveJoiningStep(document: PatternDocument, stepId: string, delta: -1 | 1): PatternDocument {
  if (joiningStepMoveProblem(document, stepId, delta) !== null) return document;
  const moved = movedPlan(currentJoiningPlan(document), stepId, delta);
  return moved ? { ...document, joiningPlan: moved } : document;
}

/** Sets how a join is pressed: a ring `clockwise`, `anticlockwise` or `open`; a join `a`, `b` or `open`. */
export function setJoiningStepPress(document: PatternDocument, stepId: string, press: RingPress | JoinPress): PatternDocument {
  const plan = currentJoiningPlan(document);
  const i = plan.steps.findIndex((s) => s.id === stepId);
  if (i < 0) return document;
  const step = plan.steps[i];
  const allowed: readonly string[] = step.kind === 'ring' ? ['clockwise', 'anticlockwise', 'open'] : ['a', 'b', 'open'];
  if (!allowed.includes(press)) return document;
  if (step.press === press && document.joiningPlan) return document;
  const steps = plan.steps.slice();
  steps[i] = { ...step, press } as DocumentJoinStep;
  return { ...document, joiningPlan: { steps } };
}
