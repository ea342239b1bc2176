import type { PatternDocument } from '@seamwright/piecing';
import { History } from '../history/history';
import { NO_SELECTION, type BoardSelection, type ChangeOrigin, type EditorSnapshot } from './editor-state';

/** A change a command makes: a pure function of the document. */
export type DocumentUpdate = (document: PatternDocument) => PatternDocument;

type Listener = (snapshot: EditorSnapshot) => void;

/**
 * The editor's document store. Every change goes through {@link apply} (one undo step) or a gesture
 * ({@link beginGesture} … {@link endGesture}: one undo step however many updates it makes). Loading a
 * document is never recorded.
 */
export class DocumentStore {
  private doc: PatternDocument;
  private saved: PatternDocument;
  private sel: BoardSelection = NO_SELECTION;
  private readonly history = new History<PatternDocument>();
  private gesture: { label: string; before: PatternDocument; sectionId: string | null } | null = null;
  private readonly listeners = new Set<Listener>();
  private lastOrigin: ChangeOrigin = 'load';
  /** Whether `doc` differed from `saved` when last asked (a drag asks on every move). */
  private dirtyFor: { doc: PatternDocument; saved: PatternDocument; dirty: boolean } | null = null;

  constructor(document: PatternDocument) {
    this.doc = document;
    this.saved = document;
  }

  /** The current document. */
  get document(): PatternDocument {
    return this.doc;
  }

  /** The current selection. */
  get selection(): BoardSelection {
    return this.sel;
  }

  /** Whether a gesture is in progress. */
  get inGesture(): boolean {
    return this.gesture !== null;
  }

  /** Id of the section the gesture in progress changes, if any. */
  get gestureSectionId(): string | null {
    return this.gesture?.sectionId ?? null;
  }

  /** Whether there is a step to undo. */
  get canUndo(): boolean {
    return this.history.canUndo;
  }

  /** Whether there is a step to redo. */
  get canRedo(): boolean {
    return this.history.canRedo;
  }

  /** Name of the step undo would revert (e.g. "Move section B"). */
  get undoLabel(): string | undefined {
    return this.history.undoLabel;
  }

  /** Name of the step redo would re-apply. */
  get redoLabel(): string | undefined {
    return this.history.redoLabel;
  }

  /** Number of undoable steps. */
  get undoDepth(): number {
    return this.history.depth;
  }

  /** Whether the document differs from the last loaded or saved one. */
  get dirty(): boolean {
    if (this.doc === this.saved) return false;
    if (this.dirtyFor?.doc !== this.doc || this.dirtyFor.saved !== this.saved) {
      this.dirtyFor = { doc: this.doc, saved: this.saved, dirty: differs(this.saved, this.doc) };
    }
    return this.dirtyFor.dirty;
  }

  /** The current state as listeners see it. */
  snapshot(): EditorSnapshot {
    return {
      document: this.doc,
      selection: this.sel,
      origin: this.lastOrigin,
      dirty: this.dirty,
      canUndo: this.canUndo,
      canRedo: this.canRedo,
      gestureSectionId: this.gesture?.sectionId ?? null,
    };
  }

  /** Calls `listener` on every change; returns the function that stops it. */
  subscribe(listener: Listener): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  /** Replaces the document without recording it (opening a pattern, applying a server revision). */
  load(document: PatternDocument): void {
    this.gesture = null;
    this.doc = document;
    this.saved = document;
    this.history.clear();
    if (this.sel.sectionId && !document.sections.some((s) => s.id === this.sel.sectionId)) this.sel = NO_SELECTION;
    this.emit('load');
  }

  /** Marks the current document as saved (dirty becomes false until the next change). */
  markSaved(document: PatternDocument = this.doc): void {
    this.saved = document;
    this.emit(this.lastOrigin);
  }

  /** Applies one command as one undo step (inside a gesture, as part of the gesture's step). */
  apply(label: string, update: DocumentUpdate): void {
    const before = this.doc;
    const after = update(before);
    if (after === before) return;
    this.doc = after;
    if (this.gesture) {
      this.emit('gesture');
      return;
    }
    this.history.record(label, before, after);
    this.emit('command');
  }

  /** Starts a gesture: every update until {@link endGesture} is one undo step. */
  beginGesture(label: string, sectionId: string | null = null): void {
    if (this.gesture) this.endGesture();
    this.gesture = { label, before: this.doc, sectionId };
  }

  /** Ends the gesture and records its whole change as one step. */
  endGesture(): void {
    const g = this.gesture;
    if (!g) return;
    this.gesture = null;
    this.history.record(g.label, g.before, this.doc);
    this.emit('command');
  }

  /** Abandons the gesture and restores the document from before it. */
  cancelGesture(): void {
    const g = this.gesture;
    if (!g) return;
    this.gesture = null;
    this.doc = g.before;
    this.emit('command');
  }

  /** Reverts the last step. */
  undo(): boolean {
    if (this.gesture) this.cancelGesture();
    const prev = this.history.undo(this.doc);
    if (!prev) return false;
    this.doc = prev;
    this.fixSelection();
    this.emit('undo');
    return true;
  }

  /** Re-applies the last undone step. */
  redo(): boolean {
    if (this.gesture) return false;
    const next = this.history.redo(this.doc);
    if (!next) return false;
    this.doc = next;
    this.fixSelection();
    this.emit('redo');
    return true;
  }

  /** Changes the selection (not part of the document, never recorded). */
  select(selection: Partial<BoardSelection>): void {
    const next = { ...this.sel, ...selection };
    if (selection.sectionId !== undefined && selection.patchIndex === undefined && selection.sectionId !== this.sel.sectionId) next.patchIndex = null;
    if (next.sectionId === this.sel.sectionId && next.patchIndex === this.sel.patchIndex) return;
    this.sel = next;
    this.emit(this.lastOrigin);
  }

  private fixSelection(): void {
    if (this.sel.sectionId && !this.doc.sections.some((s) => s.id === this.sel.sectionId)) this.sel = NO_SELECTION;
  }

  private emit(origin: ChangeOrigin): void {
    this.lastOrigin = origin;
    if (this.listeners.size === 0) return;
    const snap = this.snapshot();
    for (const l of this.listeners) l(snap);
  }
}

/**
 * Whether two immutable JSON values differ anywhere: stops at the first difference and compares shared
 * branches by reference, so it allocates nothing and costs as little as the change.
 */
export function differs(a: unknown, b: unknown): boolean {
  if (Object.is(a, b)) return false;
  if (typeof a !== 'object' || typeof b !== 'object' || a === null || b === null) return true;
  if (Array.isArray(a) !== Array.isArray(b)) return true;
  if (Array.isArray(a)) {
    const bb = b as unknown[];
    if (a.length !== bb.length) return true;
    for (let i = 0; i < a.length; i++) if (differs(a[i], bb[i])) return true;
    return false;
  }
  const ao = a as Record<string, unknown>;
  const bo = b as Record<string, unknown>;
  let count = 0;
  for (const k in ao) {
    if (!Object.prototype.hasOwnProperty.call(ao, k)) continue;
    if (ao[k] === undefined) {
      if (bo[k] !== undefined) return true;
      continue;
    }
    count++;
    if (!Object.prototype.hasOwnProperty.call(bo, k) || differs(ao[k], bo[k])) return true;
  }
  for (const k in bo) if (Object.prototype.hasOwnProperty.call(bo, k) && bo[k] !== undefined) count--;
  return count !== 0;
}
