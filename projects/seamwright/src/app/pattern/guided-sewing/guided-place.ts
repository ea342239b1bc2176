import type { SewingStage } from '../../core/api-types';
import { JOINS_PART, type GuidedPlace, type SewingGuide } from './sewing-guide-types';

/** How many steps a part has: a section's piecing steps and trim, or the joins. */
export function stepCount(guide: SewingGuide, part: string): number {
  if (part === JOINS_PART) return guide.joins.length;
  return guide.sections.find((s) => s.id === part)?.steps.length ?? 0;
}

/** How many copies (or, for the joins, blocks) a part has. */
export function copyCount(guide: SewingGuide, part: string): number {
  if (part === JOINS_PART) return guide.blockCount;
  return guide.sections.find((s) => s.id === part)?.copies ?? 0;
}

/** The parts in the order they are sewn: sections in joining order, then the joins. */
export function partOrder(guide: SewingGuide): string[] {
  return [...guide.sections.map((s) => s.id), ...(guide.joins.length > 0 ? [JOINS_PART] : [])].filter((p) => stepCount(guide, p) > 0);
}

/** Where guided sewing starts: the first step of the first copy of the first section. */
export function firstPlace(guide: SewingGuide): GuidedPlace | null {
  const part = partOrder(guide)[0];
  return part === undefined ? null : { part, copy: 1, step: 0 };
}

/** The step after `place`: the next step, else the next copy, else the next part; null at the very end. */
export function nextPlace(guide: SewingGuide, place: GuidedPlace): GuidedPlace | null {
  if (place.step + 1 < stepCount(guide, place.part)) return { ...place, step: place.step + 1 };
  if (place.copy < copyCount(guide, place.part)) return { part: place.part, copy: place.copy + 1, step: 0 };
  const parts = partOrder(guide);
  const next = parts[parts.indexOf(place.part) + 1];
  return next === undefined ? null : { part: next, copy: 1, step: 0 };
}

/** The step before `place`; null at the very start. */
export function previousPlace(guide: SewingGuide, place: GuidedPlace): GuidedPlace | null {
  if (place.step > 0) return { ...place, step: place.step - 1 };
  if (place.copy > 1) return { part: place.part, copy: place.copy - 1, step: stepCount(guide, place.part) - 1 };
  const parts = partOrder(guide);
  const before = parts[parts.indexOf(place.part) - 1];
  return before === undefined ? null : { part: before, copy: copyCount(guide, before), step: stepCount(guide, before) - 1 };
}

/** A place read back from storage, if it still fits the pattern; else null. */
export function placeIfValid(guide: SewingGuide, value: unknown): GuidedPlace | null {
  if (typeof value !== 'object' || value === null) return null;
  const { part, copy, step } = value as Record<string, unknown>;
  if (typeof part !== 'string' || !Number.isInteger(copy) || !Number.isInteger(step)) return null;
  const c = copy as number;
  const s = step as number;
  if (!partOrder(guide).includes(part) || c < 1 || c > copyCount(guide, part) || s < 0 || s >= stepCount(guide, part)) return null;
  return { part, copy: c, step: s };
}

/** A stage the sewing log records for one copy of a section. */
export interface LogTick {
  sectionId: string;
  copy: number;
  stage: SewingStage;
}

/**
 * What finishing the step at `place` records in the sewing log: the last piecing step of a copy ticks
 * it pieced, trimming ticks it trimmed, a join ticks the copies it joins, in that block, joined.
 */
export function ticksOnFinishing(guide: SewingGuide, place: GuidedPlace): LogTick[] {
  if (place.part === JOINS_PART) {
    const join = guide.joins[place.step];
    if (!join) return [];
    return guide.sections
      .filter((s) => join.sectionIds.includes(s.id))
      .flatMap((s) => {
        // Copies of block b are the ring copies (b − 1) × ring + 1 … b × ring (docs/api.md).
        const first = (place.copy - 1) * s.ringCount + 1;
        return Array.from({ length: s.ringCount }, (_, i) => ({ sectionId: s.id, copy: first + i, stage: 'joined' as const }));
      });
  }
  const section = guide.sections.find((s) => s.id === place.part);
  if (!section) return [];
  const step = section.steps[place.step];
  if (step?.kind === 'trim') return [{ sectionId: section.id, copy: place.copy, stage: 'trimmed' }];
  if (place.step === section.steps.length - 2) return [{ sectionId: section.id, copy: place.copy, stage: 'pieced' }];
  return [];
}
