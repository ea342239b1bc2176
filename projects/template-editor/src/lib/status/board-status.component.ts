import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { EditorSession } from '../session/editor-session';
import { cursorReadout } from './cursor-readout';

/** The status line under the board: what the tool wants next and where the pointer is. */
@Component({
  selector: 'sw-board-status',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (session.readOnly()) {
      <span class="hint">Read-only: drag with the middle button or the Pan tool (H) to move, the wheel or + and − to zoom, 0 to fit.</span>
    } @else {
      <span class="hint" aria-live="polite">{{ session.toolHint() }}</span>
    }
    @if (readout(); as r) {
      <span class="cursor" aria-label="Pointer position"
        ><span class="quilter">{{ r.quilter }}</span> <span class="exact">({{ r.exact }})</span></span
      >
    }
  `,
  styles: `
    :host { display: flex; justify-content: space-between; gap: 12px; padding: 4px 10px; font-size: 12px; background: var(--mat-sys-surface-container-low, #f6f3ee); border-top: 1px solid var(--mat-sys-outline-variant, #d3cabb); min-height: 22px; }
    .exact { margin-left: 6px; opacity: 0.7; font-variant-numeric: tabular-nums; }
    .quilter { font-weight: 500; }
  `,
})
export class BoardStatusComponent {
  protected readonly session = inject(EditorSession);
  protected readonly readout = computed(() => cursorReadout(this.session.cursor(), this.session.settings().unit));
}
