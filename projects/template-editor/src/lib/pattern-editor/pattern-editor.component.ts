import { ChangeDetectionStrategy, Component, DestroyRef, effect, inject, input, output, signal, untracked } from '@angular/core';
import type { PatternDocument } from '@seamwright/piecing';
import { DraftingBoardComponent } from '../board/drafting-board.component';
import { diffValues, type BoardHighlight } from '../core/public-api';
import { JoiningPlanPanelComponent } from '../joining-plan/joining-plan-panel.component';
import { FourBlockViewComponent } from '../four-block/four-block-view.component';
import { PatternSettingsPanelComponent } from '../pattern-settings/pattern-settings-panel.component';
import { PiecingOrderComponent } from '../piecing-order/piecing-order.component';
import { PropertiesPanelComponent } from '../properties/properties-panel.component';
import { SectionsOutlineComponent } from '../outline/sections-outline.component';
import { EditorSession } from '../session/editor-session';
import { TypedEntryPanelComponent } from '../typed-entry/typed-entry-panel.component';
import { BoardStatusComponent } from '../status/board-status.component';
import { BoardToolbarComponent } from '../toolbar/board-toolbar.component';

/**
 * The whole pattern editor for the app: toolbar, Drafting board, status line, properties panel and
 * piecing-order list around one editing session.
 *
 * - `[document]` opens a pattern. A different drawing is loaded (never recorded in undo, history
 *   cleared); the same drawing again (the object it emitted, or an equal copy from the server after a
 *   save) keeps the history and only marks the document saved.
 * - `(documentChange)` emits the new document after every change (command, end of a drag, undo, redo).
 * - `(dirtyChange)` emits whether there are changes since the last load or {@link markSaved}.
 * - Call {@link markSaved} after a save succeeded.
 */
@Component({
  selector: 'sw-pattern-editor',
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [EditorSession],
  imports: [BoardToolbarComponent, DraftingBoardComponent, BoardStatusComponent, PropertiesPanelComponent, PiecingOrderComponent, PatternSettingsPanelComponent, SectionsOutlineComponent, TypedEntryPanelComponent, JoiningPlanPanelComponent, FourBlockViewComponent],
  template: `
    <sw-board-toolbar class="toolbar" />
    <div class="body">
      <div class="board-column">
        <sw-drafting-board class="board" [referenceImageUrl]="referenceImageUrl()" [highlight]="joinHighlight()" />
        <sw-board-status />
      </div>
      <aside class="side" aria-label="Section details">
        <sw-sections-outline />
        <sw-properties-panel />
        <sw-piecing-order />
        <sw-joining-plan-panel (highlightChange)="joinHighlight.set($event)" />
        <sw-four-block-view />
        @if (!readOnly()) {
          <details class="settings">
            <summary>Add by values</summary>
            <sw-typed-entry-panel />
          </details>
          <details class="settings">
            <summary>Pattern settings</summary>
            <sw-pattern-settings-panel />
          </details>
        }
      </aside>
    </div>
  `,
  styles: `
    /*
     * The board has a size of its own: the editor takes a definite height (the app may set another),
     * the board fills what the toolbar, status line and side column leave, and the side column
     * scrolls. Nothing in the side column can change the board's size, so the view never moves
     * under the pointer when a panel grows.
     */
    :host {
      display: grid;
      grid-template-rows: auto minmax(0, 1fr);
      height: calc(100vh - 240px);
      min-height: 480px;
      background: #fbfaf7;
    }
    .body { display: grid; grid-template-columns: minmax(0, 1fr) 360px; min-height: 0; }
    .board-column { display: grid; grid-template-rows: minmax(0, 1fr) auto; min-width: 0; min-height: 0; }
    .board { min-height: 0; }
    .side { min-height: 0; overflow-y: auto; border-left: 1px solid #d3cabb; background: #fffdf8; }
    .settings { border-top: 1px solid #d3cabb; }
    .settings > summary { cursor: pointer; padding: 12px 16px; font-weight: 500; }
    .settings > summary:focus-visible { outline: 2px solid var(--mat-sys-primary, #1f7a8c); outline-offset: -2px; }
  `,
  host: { '(keydown)': 'onKeyDown($event)' },
})
export class PatternEditorComponent {
  /** The pattern to edit (a validated document, e.g. from `parsePatternDocument`). */
  readonly document = input<PatternDocument | null | undefined>(null);
  /** Whether the user may only look (quilters, shared patterns): no drawing tools, no changes. */
  readonly readOnly = input(false);
  /** URL of the reference image to trace (served by the server), or null. */
  readonly referenceImageUrl = input<string | null | undefined>(null);
  /** The document after each change the user made. Loading never emits. */
  readonly documentChange = output<PatternDocument>();
  /** Whether there are changes since the last load or save. */
  readonly dirtyChange = output<boolean>();

  private readonly session = inject(EditorSession);
  /** The seam of the join chosen in the joining plan, pointed at on the board. */
  protected readonly joinHighlight = signal<BoardHighlight | null>(null);
  private lastDirty = false;

  constructor() {
    effect(() => {
      const doc = this.document();
      untracked(() => {
        const store = this.session.editor.store;
        if (!doc || doc === store.document) return;
        // The same drawing coming back (e.g. the stored copy after a save) keeps the undo history.
        if (diffValues(doc, store.document).length === 0) store.markSaved();
        else this.session.load(doc);
      });
    });
    effect(() => {
      const ro = this.readOnly();
      untracked(() => this.session.editor.setReadOnly(ro));
    });
    const stop = this.session.editor.store.subscribe((s) => {
      // Drags emit once, at their end; loads never.
      if (s.origin !== 'load' && s.origin !== 'gesture' && !this.session.editor.store.inGesture && s.document !== this.lastEmitted) {
        this.lastEmitted = s.document;
        this.documentChange.emit(s.document);
      }
      if (s.origin === 'load') this.lastEmitted = s.document;
      if (s.dirty !== this.lastDirty) {
        this.lastDirty = s.dirty;
        this.dirtyChange.emit(s.dirty);
      }
    });
    inject(DestroyRef).onDestroy(stop);
  }

  private lastEmitted: PatternDocument | null = null;

  /** Tells the editor the document (default: the current one) is saved; dirty becomes false. */
  markSaved(document?: PatternDocument): void {
    this.session.editor.store.markSaved(document ?? this.session.editor.store.document);
  }

  /** The document as it is now. */
  currentDocument(): PatternDocument {
    return this.session.editor.store.document;
  }

  protected onKeyDown(e: KeyboardEvent): void {
    if (e.defaultPrevented) return;
    const t = e.target as HTMLElement | null;
    if (t && (t.closest('input, textarea, select, [contenteditable="true"], mat-select, .mat-mdc-select') !== null)) return;
    // Arrows, Delete and Escape act on the selection only from the board itself.
    if (this.session.editor.keyDown(e, { selectionKeys: false })) e.preventDefault();
  }
}
