import { ChangeDetectionStrategy, Component, HostListener, computed, effect, inject, signal, untracked, viewChild } from '@angular/core';
import { DatePipe } from '@angular/common';
import { Router } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { PatternDocument } from '@seamwright/piecing';
import { setReferenceImage } from '@seamwright/template-editor';
import { PatternContext } from '../pattern-context.service';
import { PatternsService } from '../../resources/patterns.service';
import { NotifyService } from '../../core/notify.service';
import { BoardAutosave } from './board-autosave';
import { HasUnsavedChanges } from './unsaved-changes.guard';
import { DraftBackup, clearDraft, readDraft } from './draft-backup';
import { BoardHostComponent } from './board-host.component';
import { SaveVersionButtonComponent } from './save-version-button.component';
import { PatternFileMenuComponent } from './pattern-file-menu.component';
import { MAX_REFERENCE_IMAGE_BYTES, REFERENCE_IMAGE_TYPES, UploadsService } from '../../resources/uploads.service';

/** The Drafting board part of the pattern page: the editor, autosave, and what to do on a conflict. */
@Component({
  selector: 'sw-board-page',
  imports: [DatePipe, MatButtonModule, MatIconModule, BoardHostComponent, PatternFileMenuComponent, SaveVersionButtonComponent],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './board-page.component.html',
  styleUrl: './board-page.component.scss',
})
export class BoardPageComponent implements HasUnsavedChanges {
  protected readonly ctx = inject(PatternContext);
  private readonly patterns = inject(PatternsService);
  private readonly notify = inject(NotifyService);
  private readonly router = inject(Router);
  private readonly uploads = inject(UploadsService);
  protected readonly imageTypes = REFERENCE_IMAGE_TYPES.join(',');
  protected readonly uploading = signal(false);
  /** The traced image's address, when the drawing has one. */
  protected readonly referenceImageUrl = computed(() => {
    const ref = this.working()?.referenceImage;
    return ref ? this.uploads.fileUrl(this.ctx.id(), ref.uploadId) : null;
  });
  protected readonly autosave = new BoardAutosave((doc, rev, settled) => {
    this.ctx.adopt(doc, rev);
    if (settled) this.host()?.markSaved();
  });
  private readonly host = viewChild(BoardHostComponent);
  /** The document the editor opened (set on load, on taking another revision, on restoring a draft). */
  protected readonly opened = signal<PatternDocument | null>(null);
  /** The document on the board, with edits not yet saved. */
  protected readonly working = signal<PatternDocument | null>(null);
  /** A drawing kept in this browser from an earlier visit that never reached the server. */
  protected readonly leftover = signal<DraftBackup | null>(null);
  protected readonly readOnly = computed(() => !this.ctx.canEdit());
  protected readonly statusText = this.autosave.statusText;

  constructor() {
    // Take the server's document whenever a revision is loaded from outside the board (first load, reload).
    effect(() => {
      const doc = this.ctx.document();
      const rev = this.ctx.revision();
      untracked(() => {
        if (!doc || this.autosave.dirty()) return;
        if (rev === this.autosave.lastSavedRevision() && this.working()) return;
        this.working.set(doc);
        this.opened.set(doc);
        this.autosave.reset(this.ctx.id(), rev);
        const draft = readDraft(this.ctx.id());
        this.leftover.set(draft && this.ctx.canEdit() && JSON.stringify(draft.document) !== JSON.stringify(doc) ? draft : null);
      });
    });
  }

  hasUnsavedChanges(): boolean {
    return this.autosave.dirty();
  }

  @HostListener('window:beforeunload', ['$event'])
  protected beforeUnload(event: BeforeUnloadEvent): void {
    if (!this.hasUnsavedChanges()) return;
    this.autosave.flush();
    event.preventDefault();
  }

  protected onChange(doc: PatternDocument): void {
    if (this.readOnly()) return;
    this.working.set(doc);
    this.autosave.change(doc);
  }

  /** Uploads an image to trace and puts it under the drawing, as wide as the drawing area (an undoable step). */
  protected traceImage(input: HTMLInputElement): void {
    const file = input.files?.[0];
    input.value = '';
    const doc = this.working();
    if (!file || !doc) return;
    if (!REFERENCE_IMAGE_TYPES.includes(file.type)) {
      this.notify.error(new Error('Choose a PNG, JPEG or WebP image'));
      return;
    }
    if (file.size > MAX_REFERENCE_IMAGE_BYTES) {
      this.notify.error(new Error('The image is larger than 10 MB'));
      return;
    }
    this.uploading.set(true);
    this.uploads.upload(this.ctx.id(), file).subscribe({
      next: (upload) => {
        this.uploading.set(false);
        // One undo step in the editor (its change reaches autosave like any other); the history stays.
        if (!this.host()?.apply('Trace image', (d) => setReferenceImage(d, upload.id))) return;
        this.notify.info(`Tracing “${upload.fileName}”`);
      },
      error: (err: unknown) => {
        this.uploading.set(false);
        this.notify.error(err, 'Image not uploaded');
      },
    });
  }

  protected saveNow(): void {
    this.autosave.flush();
  }

  /** Conflict: keep the user's drawing as a new pattern of their own, then show the other revision here. */
  protected keepCopy(): void {
    const mine = this.autosave.pending() ?? this.working();
    const theirs = this.autosave.conflict();
    if (!mine || !theirs) return;
    this.patterns.create({ ...mine, title: `${mine.title} (my copy)`.slice(0, 120) }).subscribe({
      next: (copy) => {
        this.autosave.discard();
        this.ctx.adopt(theirs.document, theirs.number);
        this.notify.info(`Your drawing is saved as “${copy.pattern.title}”`);
        void this.router.navigate(['/patterns', copy.pattern.id, 'board']);
      },
      error: (err: unknown) => this.notify.error(err, 'Could not keep a copy (your drawing is still here)'),
    });
  }

  /** Conflict: show the other revision; the user's drawing stays in this browser until they choose. */
  protected loadTheirs(): void {
    const theirs = this.autosave.conflict();
    if (!theirs) return;
    if (!confirm('Load the other revision? Your unsaved drawing will be dropped from the board.')) return;
    this.autosave.discard();
    this.working.set(theirs.document);
    this.opened.set(theirs.document);
    this.autosave.reset(this.ctx.id(), theirs.number);
    this.ctx.adopt(theirs.document, theirs.number);
  }

  /** Conflict: save the user's drawing as the newest revision; the other one stays in History. */
  protected saveMineOnTop(): void {
    const theirs = this.autosave.conflict();
    if (theirs) this.autosave.saveOnTopOf(theirs.number);
  }

  protected restoreLeftover(): void {
    const draft = this.leftover();
    if (!draft) return;
    this.leftover.set(null);
    this.opened.set(draft.document);
    this.onChange(draft.document);
  }

  protected dropLeftover(): void {
    clearDraft(this.ctx.id());
    this.leftover.set(null);
  }
}
