import { applyDiff, diffValues, type DocumentDiff } from './document-diff';

/** One undoable step: a named diff. */
export interface HistoryStep {
  label: string;
  diff: DocumentDiff;
}

/**
 * Undo/redo by document diffs. The caller records a step with the document before and after; a
 * gesture (a whole drag) is one step because the store records it once, at its end.
 */
export class History<T> {
  private readonly undoStack: HistoryStep[] = [];
  private readonly redoStack: HistoryStep[] = [];

  constructor(private readonly limit = 500) {}

  /** Whether there is a step to undo. */
  get canUndo(): boolean {
    return this.undoStack.length > 0;
  }

  /** Whether there is a step to redo. */
  get canRedo(): boolean {
    return this.redoStack.length > 0;
  }

  /** Label of the step undo would revert. */
  get undoLabel(): string | undefined {
    return this.undoStack[this.undoStack.length - 1]?.label;
  }

  /** Label of the step redo would re-apply. */
  get redoLabel(): string | undefined {
    return this.redoStack[this.redoStack.length - 1]?.label;
  }

  /** Number of steps that can be undone. */
  get depth(): number {
    return this.undoStack.length;
  }

  /** Records the change from `before` to `after`; returns false (and records nothing) when there is none. */
  record(label: string, before: T, after: T): boolean {
    const diff = diffValues(before, after);
    if (diff.length === 0) return false;
    this.undoStack.push({ label, diff });
    if (this.undoStack.length > this.limit) this.undoStack.shift();
    this.redoStack.length = 0;
    return true;
  }

  /** Reverts the last step on `current`, or returns null when there is none. */
  undo(current: T): T | null {
    const step = this.undoStack.pop();
    if (!step) return null;
    this.redoStack.push(step);
    return applyDiff(current, step.diff, 'undo');
  }

  /** Re-applies the last undone step on `current`, or returns null when there is none. */
  redo(current: T): T | null {
    const step = this.redoStack.pop();
    if (!step) return null;
    this.undoStack.push(step);
    return applyDiff(current, step.diff, 'redo');
  }

  /** Forgets every step (after loading a document). */
  clear(): void {
    this.undoStack.length = 0;
    this.redoStack.length = 0;
  }
}
