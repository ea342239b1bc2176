import { ChangeDetectionStrategy, Component, computed, effect, input, output } from '@angular/core';
import { FormControl, ReactiveFormsModule, type AbstractControl, type ValidationErrors } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { formatCentimetres, formatInches } from '@seamwright/piecing';
import type { BoardUnit } from '../core/public-api';
import { readNumberField } from './number-field.component';

/**
 * A Material text field for a length the designer may leave to the program: empty means "computed"
 * (the hint says what the computed value is). Lengths read as the other fields read them (2 3/4, 2¾,
 * 2.75, 7 cm). Emits on Enter or when the field loses focus: the length in inches, or null when the
 * field was emptied; text that is not a length shows what is wrong and emits nothing.
 */
@Component({
  selector: 'sw-optional-length-field',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule],
  template: `
    <mat-form-field appearance="outline" subscriptSizing="dynamic">
      <mat-label>{{ label() }}</mat-label>
      <input matInput [formControl]="control" [attr.aria-label]="label()" [placeholder]="placeholder()" (keydown.enter)="commit()" (blur)="commit()" [readonly]="readOnly()" />
      @if (control.hasError('number')) {
        <mat-error>{{ control.getError('number') }}</mat-error>
      } @else if (hint()) {
        <mat-hint>{{ hint() }}</mat-hint>
      }
    </mat-form-field>
  `,
  styles: `:host { display: block; } mat-form-field { width: 100%; }`,
})
export class OptionalLengthFieldComponent {
  /** Field label. */
  readonly label = input.required<string>();
  /** The length in inches, or null when the program computes it. */
  readonly value = input.required<number | null>();
  /** The unit lengths without a unit are in, and are shown in. */
  readonly unit = input<BoardUnit>('in');
  /** Shown in the empty field. */
  readonly placeholder = input('computed');
  /** Shown under the field (e.g. the computed value). */
  readonly hint = input<string | null>(null);
  /** Smallest length accepted, in inches. */
  readonly min = input(1 / 16);
  /** Largest length accepted, in inches. */
  readonly max = input(200);
  /** Whether the field only shows the value. */
  readonly readOnly = input(false);
  /** The new length in inches, or null when the field was emptied. */
  readonly valueChange = output<number | null>();

  protected readonly control = new FormControl('', { nonNullable: true, validators: [(c) => this.validate(c)] });
  private readonly shown = computed(() => {
    const v = this.value();
    if (v === null) return '';
    if (this.unit() === 'cm') return formatCentimetres(v, 2, false);
    const eighths = v * 8;
    return Math.abs(eighths - Math.round(eighths)) < 1e-9 ? formatInches(v, { withUnit: false }) : String(Math.round(v * 1000) / 1000);
  });

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
    const text = this.control.value.trim();
    if (text === '') {
      this.control.markAsPristine();
      if (this.value() !== null) this.valueChange.emit(null);
      return;
    }
    const r = readNumberField(text, 'length', this.unit(), this.min(), this.max());
    if (!r.ok) return;
    this.control.markAsPristine();
    const old = this.value();
    if (old === null || Math.abs(r.value - old) > 1e-12) this.valueChange.emit(r.value);
    else this.control.setValue(this.shown(), { emitEvent: false });
  }

  private validate(c: AbstractControl): ValidationErrors | null {
    const text = String(c.value ?? '').trim();
    if (text === '') return null;
    const r = readNumberField(text, 'length', this.unit(), this.min(), this.max());
    return r.ok ? null : { number: r.message };
  }
}
