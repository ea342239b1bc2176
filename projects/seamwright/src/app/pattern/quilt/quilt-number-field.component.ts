import { ChangeDetectionStrategy, Component, computed, effect, input, output, signal, untracked } from '@angular/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { formatInches, parseLength } from '@seamwright/piecing';

/** Reads a quilt field: a length as quilters write it (2 1/2, 2½, 2.5, 6 cm) or a whole count, within bounds. */
export function readQuiltNumber(text: string, kind: 'length' | 'count', min: number, max: number): { ok: true; value: number } | { ok: false; message: string } {
  let value: number;
  if (kind === 'length') {
    const r = parseLength(text, 'in');
    if (!r.ok) return { ok: false, message: r.message };
    value = r.inches;
  } else {
    if (!/^\s*\d+\s*$/.test(text)) return { ok: false, message: 'enter a whole number' };
    value = Number(text);
  }
  const show = (v: number) => (kind === 'length' ? formatInches(v, { style: 'unicode', denominator: 8 }) : String(v));
  if (value < min) return { ok: false, message: `must be at least ${show(min)}` };
  if (value > max) return { ok: false, message: `must be at most ${show(max)}` };
  return { ok: true, value };
}

/**
 * One number of the quilt layout. Every keystroke that makes a valid value emits it (the picture and
 * the finished size follow as the designer types); what the designer typed stays in the field while it
 * has focus, and a value changed elsewhere shows once it has not.
 */
@Component({
  selector: 'sw-quilt-number-field',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatFormFieldModule, MatInputModule],
  template: `
    <mat-form-field appearance="outline" subscriptSizing="dynamic">
      <mat-label>{{ label() }}</mat-label>
      <input matInput [value]="text()" (input)="onInput($any($event.target).value)" (focus)="focused.set(true)" (blur)="onBlur()"
        [readonly]="readOnly()" [attr.inputmode]="kind() === 'count' ? 'numeric' : 'decimal'" [attr.aria-invalid]="!!error()" />
      @if (kind() === 'length') { <span matTextSuffix>in.</span> }
      @if (error(); as e) { <mat-hint class="error" role="alert">{{ e }}</mat-hint> }
    </mat-form-field>
  `,
  styles: `:host { display: block; min-width: 0; } mat-form-field { width: 100%; } :host ::ng-deep .mat-mdc-form-field-infix { width: auto; min-width: 0; } .error { color: var(--mat-sys-error); }`,
})
export class QuiltNumberFieldComponent {
  readonly label = input.required<string>();
  /** Inches for lengths, a count for counts. */
  readonly value = input.required<number>();
  readonly kind = input<'length' | 'count'>('length');
  readonly min = input(0);
  readonly max = input(1000);
  readonly readOnly = input(false);
  readonly valueChange = output<number>();
  protected readonly focused = signal(false);
  protected readonly text = signal('');
  private readonly typed = signal<string | null>(null);
  protected readonly error = computed(() => {
    const t = this.typed();
    if (t === null) return null;
    const r = readQuiltNumber(t, this.kind(), this.min(), this.max());
    return r.ok ? null : r.message.charAt(0).toUpperCase() + r.message.slice(1);
  });

  constructor() {
    effect(() => {
      const v = this.value();
      const kind = this.kind();
      untracked(() => {
        if (this.focused()) return;
        this.text.set(kind === 'length' ? formatInches(v, { denominator: 32, withUnit: false }) : String(v));
      });
    });
  }

  protected onInput(text: string): void {
    this.typed.set(text);
    const r = readQuiltNumber(text, this.kind(), this.min(), this.max());
    if (r.ok && r.value !== this.value()) this.valueChange.emit(r.value);
  }

  protected onBlur(): void {
    this.focused.set(false);
    if (!this.error()) {
      this.typed.set(null);
      const v = this.value();
      this.text.set(this.kind() === 'length' ? formatInches(v, { denominator: 32, withUnit: false }) : String(v));
    }
  }
}
