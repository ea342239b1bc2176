import { ChangeDetectionStrategy, Component, computed, effect, inject, signal, untracked } from '@angular/core';
import { LiveAnnouncer } from '@angular/cdk/a11y';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAX_SIZE_IN, formatLength, resizeFactor, resizePattern, type PatternDocument } from '@seamwright/piecing';
import { resizeDesign } from '../core/public-api';
import { NumberFieldComponent } from '../properties/number-field.component';
import { EditorSession } from '../session/editor-session';

/** Largest number of problems a refused resize lists (the rest are counted). */
const ISSUES_SHOWN = 4;

/**
 * Resizes the whole design to a new finished size: width and height (linked while "Keep proportions" is
 * on), a preview of the scale factor, and Apply, one undoable step. The design scales by one factor
 * about the drawing's top-left corner; the seam allowance, piecing margin and usable widths keep their
 * values, so the cutting list is worked out afresh for the new size.
 */
@Component({
  selector: 'sw-resize-design',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatCheckboxModule, NumberFieldComponent],
  template: `
    <p class="muted">Finished size now: {{ show(canvas().widthIn) }} × {{ show(canvas().heightIn) }}</p>
    <div class="grid">
      <sw-number-field label="New finished width" [value]="width()" [unit]="unit()" [min]="0.5" [max]="maxSize" [readOnly]="ro()" (valueChange)="setWidth($event)" />
      <sw-number-field label="New finished height" [value]="height()" [unit]="unit()" [min]="0.5" [max]="maxSize" [readOnly]="ro()" (valueChange)="setHeight($event)" />
    </div>
    <mat-checkbox [checked]="keep()" (change)="keep.set($event.checked)" [disabled]="ro()">Keep proportions</mat-checkbox>
    <p class="preview" data-testid="resize-preview">
      @if (factor() === 1) {
        Type a new width or height to resize.
      } @else {
        Everything scales by <strong>k = {{ factorText() }}</strong> (lengths × {{ factorText() }}, areas × {{ areaText() }}){{ fitText() }}
      }
    </p>
    <p class="muted hint">
      Strip widths of strip sets scale with the design. The seam allowance ({{ show(allowance()) }}), piecing margin and usable widths of fabric keep their values.
    </p>
    @if (issues(); as list) {
      <div class="error" role="alert">
        <p>This size cannot be applied:</p>
        <ul>
          @for (i of list.shown; track $index) {
            <li>{{ i }}</li>
          }
        </ul>
        @if (list.more > 0) {
          <p>and {{ list.more }} more.</p>
        }
      </div>
    }
    @if (!ro()) {
      <button mat-flat-button type="button" [disabled]="factor() === 1 && sameSize()" (click)="apply()">Apply new size</button>
    }
  `,
  styles: `
    :host { display: block; }
    .grid { display: grid; grid-template-columns: repeat(2, minmax(0, 1fr)); gap: 8px; align-items: start; }
    .muted { color: var(--mat-sys-on-surface-variant); font: var(--mat-sys-body-small); margin: 4px 0 8px; }
    .preview { font: var(--mat-sys-body-medium); margin: 4px 0; }
    .error { color: var(--mat-sys-error); font: var(--mat-sys-body-small); }
    .error ul { margin: 0; padding-left: 18px; }
  `,
})
export class ResizeDesignComponent {
  private readonly session = inject(EditorSession);
  private readonly announcer = inject(LiveAnnouncer);
  protected readonly ro = this.session.readOnly;
  protected readonly unit = computed(() => this.session.settings().unit);
  protected readonly maxSize = MAX_SIZE_IN;
  protected readonly canvas = computed(() => this.session.document().canvas, { equal: (a, b) => a.widthIn === b.widthIn && a.heightIn === b.heightIn });
  protected readonly allowance = computed(() => this.session.document().seamAllowanceIn);
  /** The size typed, in inches. */
  protected readonly width = signal(12);
  protected readonly height = signal(12);
  /** Whether width and height change together. */
  protected readonly keep = signal(true);
  protected readonly issues = signal<{ shown: string[]; more: number } | null>(null);
  protected readonly factor = computed(() => resizeFactor(this.canvas(), { widthIn: this.width(), heightIn: this.height() }));
  protected readonly proportional = computed(() => Math.abs(this.width() / this.canvas().widthIn - this.height() / this.canvas().heightIn) < 1e-9);
  protected readonly sameSize = computed(() => this.width() === this.canvas().widthIn && this.height() === this.canvas().heightIn);
  protected readonly factorText = computed(() => trim(this.factor(), 4));
  protected readonly areaText = computed(() => trim(this.factor() ** 2, 4));
  /** The end of the preview: a full stop, or how a size out of proportion is met. */
  protected readonly fitText = computed(() => {
    if (this.proportional()) return '.';
    const text = `, to fit inside the new size; the drawing area becomes ${this.show(this.width())} × ${this.show(this.height())}`;
    return text.endsWith('.') ? text : `${text}.`;
  });

  constructor() {
    // A new drawing area (opened, resized, undone) starts the form from it.
    effect(() => {
      const c = this.canvas();
      untracked(() => {
        this.width.set(c.widthIn);
        this.height.set(c.heightIn);
        this.issues.set(null);
      });
    });
  }

  protected show(inches: number): string {
    return formatLength(inches, this.unit(), { style: 'unicode', denominator: 32 });
  }

  protected setWidth(widthIn: number): void {
    if (this.keep()) this.height.set(round9((widthIn * this.canvas().heightIn) / this.canvas().widthIn));
    this.width.set(widthIn);
    this.issues.set(null);
  }

  protected setHeight(heightIn: number): void {
    if (this.keep()) this.width.set(round9((heightIn * this.canvas().widthIn) / this.canvas().heightIn));
    this.height.set(heightIn);
    this.issues.set(null);
  }

  protected apply(): void {
    const target = { widthIn: this.width(), heightIn: this.height() };
    const result = resizePattern(this.session.document(), target);
    if (!result.ok) {
      const all = result.issues.map((i) => (i.path ? `${describePath(i.path, this.session.document())}: ${i.message}` : i.message));
      this.issues.set({ shown: all.slice(0, ISSUES_SHOWN), more: Math.max(0, all.length - ISSUES_SHOWN) });
      return;
    }
    this.issues.set(null);
    this.session.apply('Resize design', (d) => resizeDesign(d, target));
    this.announcer.announce(`Design resized to ${this.show(target.widthIn)} by ${this.show(target.heightIn)}; the cutting list follows the new size.`);
  }
}

/** A document path in words: `sections.2.seams.0.a.x` → "section C, seam 1"; `sections.0.patches.1.anchor` → "section A, patch A3". */
function describePath(path: string, document: PatternDocument): string {
  const parts = path.split('.');
  if (parts[0] === 'sections' && parts[1] !== undefined) {
    const section = document.sections[Number(parts[1])];
    if (!section) return path;
    const index = Number(parts[3]);
    if (parts[2] === 'seams' && Number.isInteger(index)) return `section ${section.label}, seam ${index + 1}`;
    const patch = parts[2] === 'patches' && Number.isInteger(index) ? section.patches[index] : undefined;
    return patch ? `section ${section.label}, patch ${section.label}${patch.number}` : `section ${section.label}`;
  }
  if (parts[0] === 'canvas') return 'drawing area';
  if (parts[0] === 'referenceImage') return 'trace image';
  return path;
}

function trim(v: number, decimals: number): string {
  return String(Math.round(v * 10 ** decimals) / 10 ** decimals);
}

function round9(v: number): number {
  return Math.round(v * 1e9) / 1e9;
}
