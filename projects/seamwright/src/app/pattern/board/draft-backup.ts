import type { PatternDocument } from '@seamwright/piecing';

const key = (patternId: string) => `sw-draft-${patternId}`;

/** What the browser keeps of an unsaved drawing, so a failed save or a closed tab loses nothing. */
export interface DraftBackup {
  baseRevision: number;
  savedAt: number;
  document: PatternDocument;
}

export function writeDraft(patternId: string, draft: DraftBackup): void {
  try {
    localStorage.setItem(key(patternId), JSON.stringify(draft));
  } catch {
    // Storage full or blocked: the edit is still on the board and in the save queue.
  }
}

export function readDraft(patternId: string): DraftBackup | null {
  try {
    const raw = localStorage.getItem(key(patternId));
    return raw ? (JSON.parse(raw) as DraftBackup) : null;
  } catch {
    return null;
  }
}

export function clearDraft(patternId: string): void {
  try {
    localStorage.removeItem(key(patternId));
  } catch {
    // nothing to clear
  }
}
