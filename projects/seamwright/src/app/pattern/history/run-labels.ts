import type { RevisionGroup } from '../../core/api-types';

/** "Revision 12" or "Revisions 12–19". */
export function runRangeLabel(run: Pick<RevisionGroup, 'first' | 'last'>): string {
  return run.first === run.last ? `Revision ${run.first}` : `Revisions ${run.first}–${run.last}`;
}

/** "1 save" or "8 saves". */
export function savesLabel(count: number): string {
  return count === 1 ? '1 save' : `${count} saves`;
}

/** Whether a run's first and last saves fall on the same calendar day (in the browser's time zone). */
export function sameDay(run: Pick<RevisionGroup, 'startedAt' | 'endedAt'>): boolean {
  return new Date(run.startedAt).toDateString() === new Date(run.endedAt).toDateString();
}
