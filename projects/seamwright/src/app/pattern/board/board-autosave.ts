import { DestroyRef, computed, inject, signal } from '@angular/core';
import { Observable, Subject, Subscription, debounceTime } from 'rxjs';
import type { PatternDocument } from '@seamwright/piecing';
import { PatternsService, StaleSaveError } from '../../resources/patterns.service';
import { RevisionHistoryService } from '../../resources/revision-history.service';
import { NotifyService } from '../../core/notify.service';
import type { PatternWithRevision, Revision, StaleSaveDetails } from '../../core/api-types';
import { clearDraft, writeDraft } from './draft-backup';

/** How long after the last change the drawing is saved. */
export const AUTOSAVE_DELAY_MS = 2500;

export type SaveStatus = 'saved' | 'pending' | 'saving' | 'conflict' | 'error';

/** A random id for one opening of the board (getRandomValues works outside secure contexts too). */
export function newEditSessionId(): string {
  const bytes = crypto.getRandomValues(new Uint8Array(16));
  return Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('');
}

/**
 * Saves the board's document as a new revision a few seconds after the last change. Saves run one
 * at a time on top of the last revision saved; a stale base stops autosave and reports the conflict.
 * Every unsaved document is also kept in the browser until the server has it. Every save carries
 * this board's editing session, so History shows them as one row (docs/api.md, "Revisions").
 */
export class BoardAutosave {
  private readonly patterns = inject(PatternsService);
  private readonly history = inject(RevisionHistoryService);
  private readonly notify = inject(NotifyService);
  private readonly edits = new Subject<void>();
  private readonly sub: Subscription;
  private latest: PatternDocument | null = null;
  private inFlight = false;
  /** Work waiting for the save in flight (a named version asked for meanwhile). */
  private queued: Array<() => void> = [];
  private patternId = '';
  private base = 0;

  /** This opening of the board; sent with every save. */
  readonly editSession = newEditSessionId();

  readonly status = signal<SaveStatus>('saved');
  /** The other person's revision when a save was refused as stale. */
  readonly conflict = signal<StaleSaveDetails['latest'] | null>(null);
  readonly lastSavedRevision = signal(0);
  /** Whether edits exist that the server does not hold. */
  readonly dirty = computed(() => this.status() !== 'saved');
  /** The save state in words, for the status line of every page that saves through this autosave. */
  readonly statusText = computed(() => {
    switch (this.status()) {
      case 'saved':
        return `All changes saved · revision ${this.lastSavedRevision()}`;
      case 'pending':
        return 'Unsaved changes — saving shortly';
      case 'saving':
        return 'Saving…';
      case 'conflict':
        return 'Not saved: someone else saved first';
      case 'error':
        return 'Not saved — a copy is kept in this browser';
    }
  });

  constructor(private readonly onSaved: (document: PatternDocument, revision: number, settled: boolean) => void) {
    this.sub = this.edits.pipe(debounceTime(AUTOSAVE_DELAY_MS)).subscribe(() => this.flush());
    inject(DestroyRef).onDestroy(() => this.sub.unsubscribe());
  }

  /** Starts from a document the server holds as `revision`. */
  reset(patternId: string, revision: number): void {
    this.patternId = patternId;
    this.base = revision;
    this.latest = null;
    this.lastSavedRevision.set(revision);
    this.conflict.set(null);
    this.status.set('saved');
  }

  /** Records a change on the board; the save follows after a pause. */
  change(document: PatternDocument): void {
    this.latest = document;
    writeDraft(this.patternId, { baseRevision: this.base, savedAt: Date.now(), document });
    if (this.status() === 'conflict') return;
    this.status.set('pending');
    this.edits.next();
  }

  /** Saves now what is pending (on leaving, or from a "save" button). */
  flush(): void {
    const doc = this.latest;
    if (!doc || this.inFlight || this.status() === 'conflict') return;
    this.send(doc, this.patterns.save(this.patternId, { baseRevision: this.base, document: doc, editSession: this.editSession }));
  }

  /**
   * Stores the board as a named version: with the unsaved drawing when there is one (so it is not
   * saved twice), else the last saved revision's document. Waits for a save in flight; refused while
   * a conflict is open. Resolves with the new revision.
   */
  saveVersion(version: { name: string; note?: string }): Promise<Revision> {
    return new Promise<Revision>((resolve, reject) => {
      const run = () => {
        if (this.status() === 'conflict') {
          reject(new Error('Someone else saved first: choose what to do with your drawing, then save the version'));
          return;
        }
        const doc = this.latest;
        const note = version.note?.trim();
        this.send(
          doc,
          this.history.saveVersion(this.patternId, {
            baseRevision: this.base,
            name: version.name,
            ...(note ? { note } : {}),
            ...(doc ? { document: doc } : {}),
            editSession: this.editSession,
          }),
          resolve,
          reject,
        );
      };
      if (this.inFlight) this.queued.push(run);
      else run();
    });
  }

  /** Sends one save of `doc` (null: the server's latest document) and moves the base on. */
  private send(
    doc: PatternDocument | null,
    request: Observable<PatternWithRevision>,
    done?: (revision: Revision) => void,
    failed?: (err: unknown) => void,
  ): void {
    this.inFlight = true;
    this.status.set('saving');
    request.subscribe({
      next: (saved) => {
        const number = saved.revision.number;
        this.inFlight = false;
        this.base = number;
        this.lastSavedRevision.set(number);
        const settled = this.latest === doc;
        this.onSaved(saved.revision.document, number, settled);
        if (settled) {
          this.latest = null;
          clearDraft(this.patternId);
          this.status.set('saved');
        } else {
          this.status.set('pending');
          this.edits.next();
        }
        done?.(saved.revision);
        this.queued.shift()?.();
      },
      error: (err: unknown) => {
        this.inFlight = false;
        if (err instanceof StaleSaveError) {
          this.conflict.set(err.latest);
          this.status.set('conflict');
        } else {
          this.status.set(this.latest ? 'error' : 'saved');
          // A failed named version has its own message in its dialog.
          if (!failed) this.notify.error(err, 'Not saved (a copy is kept in this browser)');
        }
        failed?.(err);
        this.queued.shift()?.();
      },
    });
  }

  /** The unsaved document, if any. */
  pending(): PatternDocument | null {
    return this.latest;
  }

  /** After a conflict: save the user's drawing on top of the other revision (theirs stays in History). */
  saveOnTopOf(revision: number): void {
    this.base = revision;
    this.conflict.set(null);
    this.status.set('pending');
    this.flush();
  }

  /** After a conflict or on reload: forget the pending edits (the browser copy goes too). */
  discard(): void {
    this.latest = null;
    clearDraft(this.patternId);
    this.conflict.set(null);
    this.status.set('saved');
  }
}
