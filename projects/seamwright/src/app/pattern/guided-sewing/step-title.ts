import { JOINS_PART, type GuidedPlace, type SewingGuide } from './sewing-guide-types';

/** The heading of a step: "Step 3 of 4: add B3", "Step 4 of 4: trim section B", "Join 1 of 3: …". */
export function stepTitle(guide: SewingGuide, place: GuidedPlace): string {
  if (place.part === JOINS_PART) {
    const join = guide.joins[place.step];
    return join ? `Join ${place.step + 1} of ${guide.joins.length}: ${join.label}` : '';
  }
  const section = guide.sections.find((s) => s.id === place.part);
  const step = section?.steps[place.step];
  if (!section || !step) return '';
  const of = `Step ${place.step + 1} of ${section.steps.length}`;
  return step.kind === 'trim' ? `${of}: trim section ${section.label}` : `${of}: add ${step.patchLabel}`;
}
