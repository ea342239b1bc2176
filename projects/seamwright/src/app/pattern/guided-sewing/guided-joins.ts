import { formatInches, resolveJoiningPlan, type PatternDocument, type ResolvedJoinStep } from '@seamwright/piecing';
import type { JoinGuideStep } from './sewing-guide-types';

/** The joining plan as guided sewing walks it: the joins, the sections in the order they are first joined, and the plan's problems. */
export interface GuidedJoins {
  joins: JoinGuideStep[];
  /** Section ids in joining order: as the joins first take them, then any the plan leaves out. */
  sectionOrder: string[];
  problems: string[];
  /** Whether the plan is the library's default (the designer has set none). */
  isDefault: boolean;
}

const inches = (n: number) => formatInches(n, { style: 'unicode', denominator: 8 });

/** How to sew the seam of one join, in words. */
function seamWords(step: ResolvedJoinStep): string {
  const length = `${inches(step.seam.lengthIn)} of seam`;
  if (step.kind === 'ring') {
    return `Sew the ${step.ringCount ?? ''} copies side by side, each to the next; the last seam closes the ring (${length} in all).`.replace('  ', ' ');
  }
  return step.seam.kind === 'curved'
    ? `A curved seam, ${length}: pin at the matching marks and ease the curve as you sew.`
    : `A straight seam, ${length}: pin the ends and any seams that meet it.`;
}

/** Guided sewing's joins from the piecing library's joining plan (the designer's, or the default one). */
export function guidedJoins(doc: PatternDocument): GuidedJoins {
  const plan = resolveJoiningPlan(doc);
  const order: string[] = [];
  const joins = plan.steps.map((step): JoinGuideStep => {
    const sectionIds = [...new Set([...step.partA.sectionIds, ...step.partB.sectionIds])];
    for (const id of sectionIds) if (!order.includes(id)) order.push(id);
    return {
      number: step.number,
      kind: step.kind,
      label: step.label,
      partA: step.partA.label,
      partB: step.partB.label,
      sectionIds,
      seamPaths: step.seam.paths,
      seamText: seamWords(step),
      press: step.pressLabel,
      marks: step.marks,
    };
  });
  for (const s of doc.sections) if (!order.includes(s.id)) order.push(s.id);
  return { joins, sectionOrder: order, problems: plan.problems.map((p) => p.message), isDefault: plan.isDefault };
}
