import { SEWING_STAGES, type SewingLogEntry, type SewingStage } from '../../core/api-types';

/** What the log reads of a section: its id and how many copies of it are sewn. */
export interface SewnSection {
  id: string;
  /** Ring repeats × blocks (docs/api.md#sewing-log-per-user-per-pattern). */
  copies: number;
}

/** Stage reached per copy, keyed by {@link copyKey}. */
export type CopyStages = ReadonlyMap<string, SewingStage>;

/** How many times a section is sewn: once per ring copy, in every block. */
export function copiesOf(section: { ringRepeat?: { count: number } }, blockCount: number): number {
  return (section.ringRepeat?.count ?? 1) * Math.max(1, blockCount);
}

/** The key of one copy of a section in a {@link CopyStages} map. */
export function copyKey(sectionId: string, copy: number): string {
  return `${sectionId}#${copy}`;
}

/** The log's entries as a map of copy → stage. */
export function stagesFromEntries(entries: readonly Pick<SewingLogEntry, 'sectionId' | 'copy' | 'stage'>[]): Map<string, SewingStage> {
  return new Map(entries.map((e) => [copyKey(e.sectionId, e.copy), e.stage]));
}

/** How many of a copy's stages are done, 0 … 3 (stages are reached in order). */
export function stagesDone(stage: SewingStage | null | undefined): number {
  return stage ? SEWING_STAGES.indexOf(stage) + 1 : 0;
}

/** The later of two stages: a step of guided sewing never moves a copy back. */
export function laterStage(a: SewingStage | null | undefined, b: SewingStage): SewingStage {
  return stagesDone(a) >= stagesDone(b) ? (a as SewingStage) : b;
}

/** Every copy of every section times the three stages: the things a quilter does for the pattern. */
export function totalSteps(sections: readonly SewnSection[]): number {
  return sections.reduce((sum, s) => sum + s.copies, 0) * SEWING_STAGES.length;
}

/** Stages done over all copies of the pattern's sections; entries of sections or copies no longer there are ignored. */
export function stepsDone(sections: readonly SewnSection[], stages: CopyStages): number {
  let done = 0;
  for (const s of sections) for (let c = 1; c <= s.copies; c++) done += stagesDone(stages.get(copyKey(s.id, c)));
  return done;
}

/** Progress of the whole pattern, 0…1: the share of all stages of all copies done. */
export function patternProgress(sections: readonly SewnSection[], stages: CopyStages): number {
  const total = totalSteps(sections);
  return total === 0 ? 0 : stepsDone(sections, stages) / total;
}

/** How many copies of one section (or of all, without `sectionId`) have reached at least `stage`. */
export function copiesAtLeast(sections: readonly SewnSection[], stages: CopyStages, stage: SewingStage): number {
  const min = stagesDone(stage);
  let n = 0;
  for (const s of sections) for (let c = 1; c <= s.copies; c++) if (stagesDone(stages.get(copyKey(s.id, c))) >= min) n++;
  return n;
}
