import { SEWING_STAGES, type SewingStage } from '../../core/api-types';

/** How far one stage is along the way from uncut (0) to trimmed (1). */
export function stageFraction(stage: SewingStage | null | undefined): number {
  return stage ? (SEWING_STAGES.indexOf(stage) + 1) / SEWING_STAGES.length : 0;
}

/** Progress of the whole pattern, 0…1: each section counts equally, by the stage it has reached. */
export function patternProgress(sectionIds: readonly string[], stages: ReadonlyMap<string, SewingStage>): number {
  if (sectionIds.length === 0) return 0;
  return sectionIds.reduce((sum, id) => sum + stageFraction(stages.get(id)), 0) / sectionIds.length;
}

/** How many sections have reached at least `stage`. */
export function countAtLeast(sectionIds: readonly string[], stages: ReadonlyMap<string, SewingStage>, stage: SewingStage): number {
  const min = SEWING_STAGES.indexOf(stage);
  return sectionIds.filter((id) => {
    const s = stages.get(id);
    return s !== undefined && SEWING_STAGES.indexOf(s) >= min;
  }).length;
}
