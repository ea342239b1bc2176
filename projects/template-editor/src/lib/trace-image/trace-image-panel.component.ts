import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { formatLength, type Point } from '@seamwright/piecing';
import {
  moveReferenceImage,
  placeReferenceImage,
  removeReferenceImage,
  ReferenceScaleTool,
  setReferenceOpacity,
} from '../core/public-api';
import { NumberFieldComponent } from '../properties/number-field.component';
import { EditorSession } from '../session/editor-session';

/** One nudge of the trace image, inches (Shift: a whole inch). */
export const TRACE_NUDGE_IN = 0.125;

const ARROWS: Readonly<Record<string, Point>> = {
  ArrowLeft: { x: -1, y: 0 },
  ArrowRight: { x: 1, y: 0 },
  ArrowUp: { x: 0, y: -1 },
  ArrowDown: { x: 0, y: 1 },
};

/**
 * The trace image's controls: opacity, moving (nudges, arrow keys, the corner's position), scale
 * from two points picked on the board and their true distance, and removal. Every change is one
 * named command through the editing session, so it is one undo step and autosave sees it.
 *
 * The two-point pick: after "Set scale", the host forwards clicks on the board to {@link pickAt}
 * (document inches) while {@link picking} is true.
 */
@Component({
  selector: 'sw-trace-image-panel',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatIconModule, NumberFieldComponent],
  template: `
    @if (image(); as img) {
      <div class="row">
        <div class="opacity">
          <label for="trace-opacity">Opacity</label>
          <input
            id="trace-opacity"
            type="range"
            min="0"
            max="100"
            step="5"
            [value]="percent()"
            [attr.aria-valuetext]="percent() + ' %'"
            (change)="setOpacity($any($event.target).valueAsNumber)"
          />
          <output for="trace-opacity">{{ percent() }} %</output>
        </div>

        <div class="move" role="group" aria-label="Move trace image" tabindex="0" (keydown)="onMoveKey($event)">
          <span class="caption">Move</span>
          <button mat-icon-button type="button" (click)="nudge(-1, 0)" [attr.aria-label]="'Move left ' + step()"><mat-icon aria-hidden="true">arrow_back</mat-icon></button>
          <button mat-icon-button type="button" (click)="nudge(0, -1)" [attr.aria-label]="'Move up ' + step()"><mat-icon aria-hidden="true">arrow_upward</mat-icon></button>
          <button mat-icon-button type="button" (click)="nudge(0, 1)" [attr.aria-label]="'Move down ' + step()"><mat-icon aria-hidden="true">arrow_downward</mat-icon></button>
          <button mat-icon-button type="button" (click)="nudge(1, 0)" [attr.aria-label]="'Move right ' + step()"><mat-icon aria-hidden="true">arrow_forward</mat-icon></button>
          <sw-number-field class="coord" label="Left edge" [value]="img.origin.x" [unit]="unit()" [min]="-200" [max]="200" (valueChange)="place({ x: $event, y: img.origin.y })" />
          <sw-number-field class="coord" label="Top edge" [value]="img.origin.y" [unit]="unit()" [min]="-200" [max]="200" (valueChange)="place({ x: img.origin.x, y: $event })" />
        </div>

        <div class="scale">
          @if (picking()) {
            <p class="hint" role="status" aria-live="polite">{{ pickHint() }}</p>
            @if (shownDistanceIn(); as shown) {
              <sw-number-field class="distance" label="True distance" [value]="shown" [unit]="unit()" [min]="0.01" [max]="200" (valueChange)="applyScale($event)" />
            }
            <button mat-button type="button" (click)="cancelScale()">Cancel</button>
          } @else {
            <button mat-stroked-button type="button" (click)="startScale()"><mat-icon aria-hidden="true">straighten</mat-icon>Set scale</button>
            <span class="sw-muted">{{ widthText() }} wide</span>
          }
        </div>

        <button mat-button type="button" (click)="remove()"><mat-icon aria-hidden="true">delete</mat-icon>Remove image</button>
      </div>
    }
  `,
  styles: `
    :host { display: block; }
    .row { display: flex; flex-wrap: wrap; align-items: center; gap: 8px 20px; padding: 4px 8px; }
    .opacity, .move, .scale { display: flex; align-items: center; gap: 6px; }
    .move:focus-visible { outline: 2px solid var(--mat-sys-primary); outline-offset: 2px; border-radius: 4px; }
    .caption { font: var(--mat-sys-label-large); }
    .coord { width: 110px; }
    .distance { width: 150px; }
    .hint { margin: 0; font: var(--mat-sys-body-medium); }
    output { min-width: 3.5em; }
  `,
})
export class TraceImagePanelComponent {
  /** The editing session whose document holds the trace image. */
  readonly session = input.required<EditorSession>();

  private readonly tool = signal<ReferenceScaleTool | null>(null);
  /** Bumped after each pick, so views of the tool's (plain) state are read again. */
  private readonly picks = signal(0);

  /** The document's trace image, if any. */
  protected readonly image = computed(() => this.session().document().referenceImage ?? null);
  protected readonly unit = computed(() => this.session().settings().unit);
  protected readonly percent = computed(() => Math.round((this.image()?.opacity ?? 0) * 100));
  protected readonly step = computed(() => formatLength(TRACE_NUDGE_IN, this.unit(), { style: 'unicode' }));
  protected readonly widthText = computed(() => formatLength(this.image()?.widthIn ?? 0, this.unit(), { style: 'unicode' }));
  /** Whether the panel is waiting for points on the board (the host then sends clicks to {@link pickAt}). */
  readonly picking = computed(() => this.tool() !== null);
  protected readonly pickHint = computed(() => (this.picks(), this.tool()?.hint ?? ''));
  protected readonly shownDistanceIn = computed(() => (this.picks(), this.tool()?.shownDistanceIn ?? null));

  protected setOpacity(percent: number): void {
    if (Number.isFinite(percent)) this.session().apply('Trace image opacity', (d) => setReferenceOpacity(d, percent / 100));
  }

  protected nudge(dx: number, dy: number, stepIn = TRACE_NUDGE_IN): void {
    this.session().apply('Move trace image', (d) => moveReferenceImage(d, dx * stepIn, dy * stepIn));
  }

  protected onMoveKey(e: KeyboardEvent): void {
    const dir = ARROWS[e.key];
    if (!dir || e.ctrlKey || e.metaKey || e.altKey) return;
    e.preventDefault();
    this.nudge(dir.x, dir.y, e.shiftKey ? 1 : TRACE_NUDGE_IN);
  }

  protected place(origin: Point): void {
    this.session().apply('Move trace image', (d) => placeReferenceImage(d, origin));
  }

  protected startScale(): void {
    this.tool.set(new ReferenceScaleTool({ store: this.session().editor.store }));
    this.picks.update((n) => n + 1);
  }

  /** A click on the board while picking, in document inches. */
  pickAt(point: Point): void {
    const tool = this.tool();
    if (!tool) return;
    tool.pointerDown({ point });
    this.picks.update((n) => n + 1);
  }

  protected applyScale(distanceIn: number): void {
    const tool = this.tool();
    if (tool?.applyDistance(distanceIn)) this.tool.set(null);
  }

  /** Stops picking points. */
  cancelScale(): void {
    this.tool.set(null);
  }

  protected remove(): void {
    this.tool.set(null);
    this.session().apply('Remove trace image', removeReferenceImage);
  }
}
