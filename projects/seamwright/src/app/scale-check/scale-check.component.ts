import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatIconModule } from '@angular/material/icon';
import { MatButtonModule } from '@angular/material/button';
import { TEST_SQUARE_CM_IN, TEST_SQUARE_IN } from '@seamwright/piecing';
import { readLength } from '../core/length-text';
import { ScaleVerdict, formatScale, judgeScale } from './scale-verdict';
import { CautionsComponent } from '../shared/cautions.component';

type SquareChoice = 'inch' | 'cm';

/** Scale check: the quilter types what the printed test square measures; we say whether the print is true. */
@Component({
  selector: 'sw-scale-check',
  imports: [ReactiveFormsModule, MatButtonToggleModule, MatFormFieldModule, MatInputModule, MatIconModule, MatButtonModule, CautionsComponent],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './scale-check.component.html',
  styleUrl: './scale-check.component.scss',
})
export class ScaleCheckComponent {
  protected readonly form = inject(FormBuilder).nonNullable.group({
    square: ['inch' as SquareChoice],
    measured: ['', Validators.required],
    unit: ['in' as 'in' | 'cm'],
  });
  private readonly value = toSignal(this.form.valueChanges, { initialValue: this.form.getRawValue() });
  protected readonly submitted = signal(false);
  protected readonly formatScale = formatScale;

  protected readonly reading = computed(() => {
    const v = this.value();
    return readLength(v.measured ?? '', v.unit ?? 'in');
  });

  protected readonly expectedIn = computed(() => (this.value().square === 'cm' ? TEST_SQUARE_CM_IN : TEST_SQUARE_IN));

  protected readonly verdict = computed<ScaleVerdict | null>(() => {
    const r = this.reading();
    return this.submitted() && r.ok ? judgeScale(r.inches, this.expectedIn()) : null;
  });

  protected readonly fieldError = computed(() => {
    const r = this.reading();
    if (!this.submitted()) return '';
    return r.ok ? '' : r.message;
  });

  protected check(): void {
    this.submitted.set(true);
    this.form.controls.measured.markAsTouched();
  }

  protected edited(): void {
    // A new number means a new check: the verdict waits for "Check".
    this.submitted.set(false);
  }
}
