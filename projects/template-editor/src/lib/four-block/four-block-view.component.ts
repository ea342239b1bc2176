import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, linkedSignal, signal, untracked } from '@angular/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { applyColourway, type PatternDocument } from '@seamwright/piecing';
import { EditorSession } from '../session/editor-session';
import { renderFourBlockSvg } from '../core/public-api';

/** Quiet time after the last change before the four blocks are drawn again (a drag never waits on them), ms. */
export const FOUR_BLOCK_DELAY_MS = 300;

/**
 * "Four blocks": on request, the block on the board drawn 2 × 2 beside it (a picture, not editable), so
 * secondary patterns show while drafting, in the pattern's fabrics or one of its colourways. Drawn only
 * while open, and only once the drawing has been still for a moment.
 */
@Component({
  selector: 'sw-four-block-view',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatFormFieldModule, MatSelectModule],
  template: `
    <h2 class="title">
      <button type="button" class="disclosure" [attr.aria-expanded]="open()" aria-controls="four-block-body" (click)="open.set(!open())">
        <span class="chevron" aria-hidden="true">{{ open() ? '▾' : '▸' }}</span>Four blocks
      </button>
    </h2>
    @if (open()) {
      <div class="body" id="four-block-body">
        @if (colourways().length) {
          <mat-form-field appearance="outline" subscriptSizing="dynamic" class="colourway">
            <mat-label>Colourway</mat-label>
            <mat-select [value]="colourwayId() ?? ''" (selectionChange)="colourwayId.set($event.value || null)" aria-label="Four blocks colourway" data-testid="four-block-colourway">
              <mat-option value="">Pattern fabrics</mat-option>
              @for (c of colourways(); track c.id) { <mat-option [value]="c.id">{{ c.name }}</mat-option> }
            </mat-select>
          </mat-form-field>
        }
        @if (picture(); as src) {
          <img [src]="src" class="picture" alt="Four copies of the block, two by two, as they meet in a quilt" />
        }
      </div>
    }
  `,
  styles: `
    :host { display: block; border-top: 1px solid var(--mat-sys-outline-variant); }
    .title { margin: 0; font: inherit; }
    .disclosure {
      display: flex; align-items: center; gap: 6px; width: 100%; padding: 12px 16px; border: 0; background: none;
      color: var(--mat-sys-on-surface); font: var(--mat-sys-title-small); text-align: left; cursor: pointer;
    }
    .disclosure:focus-visible { outline: 2px solid var(--mat-sys-primary); outline-offset: -2px; }
    .chevron { width: 1em; }
    .body { padding: 0 12px 12px; }
    .colourway { width: 100%; margin-bottom: 8px; }
    .picture { display: block; width: 100%; height: auto; border: 1px solid var(--mat-sys-outline-variant); }
  `,
})
export class FourBlockViewComponent {
  private readonly session = inject(EditorSession);
  /** Whether the four blocks are shown. */
  protected readonly open = signal(false);
  /**
   * The colourway the four blocks are drawn in, or null for the pattern's own fabrics: the board's
   * choice, until it is changed here (a later choice on the board is followed again).
   */
  protected readonly colourwayId = linkedSignal<string | null>(() => this.session.shownColourway()?.id ?? null);
  protected readonly colourways = computed(() => this.session.document().colourways ?? []);
  /** The picture as a data URL (the app's content policy allows data: images). */
  protected readonly picture = signal<string | null>(null);
  private timer: ReturnType<typeof setTimeout> | null = null;

  constructor() {
    effect(() => {
      if (!this.open()) return;
      const doc = this.session.document();
      const id = this.colourwayId();
      untracked(() => this.schedule(doc, id));
    });
    inject(DestroyRef).onDestroy(() => this.timer !== null && clearTimeout(this.timer));
  }

  private schedule(doc: PatternDocument, colourwayId: string | null): void {
    if (this.timer !== null) clearTimeout(this.timer);
    const draw = () => {
      this.timer = null;
      const known = colourwayId && doc.colourways?.some((c) => c.id === colourwayId) ? colourwayId : null;
      this.picture.set(`data:image/svg+xml;charset=utf-8,${encodeURIComponent(renderFourBlockSvg(applyColourway(doc, known)))}`);
    };
    // The first picture at once; later ones after the drawing has been still for a moment.
    if (this.picture() === null) draw();
    else this.timer = setTimeout(draw, FOUR_BLOCK_DELAY_MS);
  }
}
