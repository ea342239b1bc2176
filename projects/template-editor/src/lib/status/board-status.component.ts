import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, signal } from '@angular/core';
import { EditorSession } from '../session/editor-session';
import { BoardAnnouncerComponent } from './board-announcer.component';
import { cursorReadout } from './cursor-readout';
import { viewReadout } from './view-readout';

/**
 * The status line under the board: what the tool wants next, what the last key did (the editor's live
 * region), the view (zoom and the point at the board's top-left corner) and where the pointer is.
 */
@Component({
  selector: 'sw-board-status',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [BoardAnnouncerComponent],
  template: `
    @if (session.readOnly()) {
      <span class="hint">Read-only: drag with the middle button or the Pan tool (H) to move, the wheel or + and − to zoom, 0 to fit.</span>
    } @else {
      <span class="hint">{{ session.toolHint() }}</span>
    }
    <sw-board-announcer class="said" />
    <span class="view" aria-label="View">{{ view() }}</span>
    @if (readout(); as r) {
      <span class="cursor" aria-label="Pointer position"
        ><span class="quilter">{{ r.quilter }}</span> <span class="exact">({{ r.exact }})</span></span
      >
    }
  `,
  styles: `
    :host { display: flex; flex-wrap: wrap; align-items: baseline; column-gap: 16px; row-gap: 2px; padding: 4px 10px; font-size: 12px; background: var(--mat-sys-surface-container-low); color: var(--mat-sys-on-surface); border-top: 1px solid var(--mat-sys-outline-variant); min-height: 22px; }
    .said { flex: 1 1 200px; font-weight: 500; }
    .view, .exact { font-variant-numeric: tabular-nums; color: var(--mat-sys-on-surface-variant); }
    .exact { margin-left: 6px; }
    .quilter { font-weight: 500; }
  `,
})
export class BoardStatusComponent {
  protected readonly session = inject(EditorSession);
  protected readonly readout = computed(() => cursorReadout(this.session.cursor(), this.session.settings().unit));
  private readonly viewTick = signal(0);
  protected readonly view = computed(() => (this.viewTick(), viewReadout(this.session.editor.viewport)));

  constructor() {
    const stop = this.session.editor.onViewChange(() => this.viewTick.update((n) => n + 1));
    inject(DestroyRef).onDestroy(stop);
  }
}
