import { ChangeDetectionStrategy, Component, computed, effect, input, output } from '@angular/core';
import { FormControl, ReactiveFormsModule, type AbstractControl, type ValidationErrors } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { formatCentimetres, formatInches, parseLength } from '@seamwright/piecing';
import type { BoardUnit } from '../core/public-api';

/** What a number field reads: a length (fractions, decimals, cm), an angle in degrees, or a whole count. */
export type NumberFieldKind = 'length' | 'angle' | 'count';

/** Reads the text of a field: the value (inches, degrees or a count) or what is wrong, in words. */
export function readNumberField(text: string, kind: NumberFieldKind, unit: BoardUnit, min: number, max: number): { ok: true; value: number } | { ok: false; message: string } {
  let value: number;
  if (kind === 'length') {
    const r = parseLength(text, unit);
    if (!r.ok) return { ok: false, message: r.message };
    value = r.inches;
  } else {
    const t = text.trim().replace(/°$/, '').replace(',', '.');
    if (!/^[-+]?\d+(\.\d+)?$/.test(t)) return { ok: false, message: kind === 'angle' ? 'enter an angle in degrees, like 22.5' : 'enter a whole number' };
    value = Number(t);
    if (kind === 'count' && !Number.isInteger(value)) return { ok: false, message: 'enter a whole number' };
  }
  const show = (v: number) => (kind === 'length' ? (unit === 'cm' ? formatCentimetres(v) : formatInches(v, { denominator: 32 })) : kind === 'angle' ? `${v}°` : String(v));
  if (value < min) return { ok: false, message: `must be at least ${show(min)}` };
  if (value > max) return { ok: false, message: `must be at most ${show(max)}` };
  return { ok: true, value };
}

/**
 * A Material text field for one number: lengths typed as quilters write them (2 3/4, 2¾, 2.75, 7 cm),
 * angles in degrees, or whole counts. Emits the value (inches for lengths) on Enter or when the field
 * loses focus, and only when it is valid; otherwise it shows what is wrong.
 */
@Component({
  selector: 'sw-number-field',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule],
  template: `
    <mat-form-field appearance="outline" subscriptSizing="dynamic">
      <mat-label>{{ label() }}</mat-label>
      <input matInput [formControl]="control" [attr.aria-label]="label()" (keydown.enter)="commit()" (blur)="commit()" [readonly]="readOnly()" />
      @if (control.hasError('number')) {
        <mat-error>{{ control.getError('number') }}</mat-error>
      }
    </mat-form-field>
  `,
  styles: `:host { display: block; } mat-form-field { width: 100%; }`,
})
export class NumberFieldComponent {
  /** Field label. */
  readonly label = input.required<string>();
  /** The value: inches for lengths, degrees for angles. */
  readonly value = input.required<number>();
  /** What the field reads. */
  readonly kind = input<NumberFieldKind>('length');
  /** The unit lengths without a unit are in, and are shown in. */
  readonly unit = input<BoardUnit>('in');
  /** Smallest value accepted. */
  readonly min = input(-Infinity);
  /** Largest value accepted. */
  readonly max = input(Infinity);
  /** Whether the field only shows the value. */
  readonly readOnly = input(false);
  /** The new value, when a valid one is entered. */
  readonly valueChange = output<number>();

  protected readonly control = new FormControl('', { nonNullable: true, validators: [(c) => this.validate(c)] });
  private readonly shown = computed(() => this.format(this.value()));

  constructor() {
    effect(() => {
      const text = this.shown();
      this.control.setValue(text, { emitEvent: false });
      this.control.markAsPristine();
      this.control.updateValueAndValidity({ emitEvent: false });
    });
  }

  protected commit(): void {
    if (this.readOnly() || this.control.pristine) return;
    this.control.markAsTouched();
    const r = readNumberField(this.control.value, this.kind(), this.unit(), this.min(), this.max());
    if (!r.ok) return;
    this.control.markAsPristine();
    if (Math.abs(r.value - this.value()) > 1e-12) this.valueChange.emit(r.value);
    else this.control.setValue(this.shown(), { emitEvent: false });
  }

  private validate(c: AbstractControl): ValidationErrors | null {
    const r = readNumberField(String(c.value ?? ''), this.kind(), this.unit(), this.min(), this.max());
    return r.ok ? null : { number: r.message };
  }

  private format(v: number): string {
    // At most 3 decimals: 0.001° and 0.001 in. are far below what a quilter can cut or sew. The stored
    // value keeps its precision; the field only shows it rounded (an untouched field never writes back).
    if (this.kind() !== 'length') return String(Math.round(v * 1000) / 1000);
    if (this.unit() === 'cm') return formatCentimetres(v, 2, false);
    // Exact eighths read as quilters write them; anything else keeps its decimals.
    const eighths = v * 8;
    return Math.abs(eighths - Math.round(eighths)) < 1e-9 ? formatInches(v, { withUnit: false }) : String(Math.round(v * 1000) / 1000);
  }
}
