import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { ControlContainer, FormGroupDirective, ReactiveFormsModule, Validators, type ValidatorFn } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MIN_PASSWORD_LENGTH, fieldMessage, sameAs } from './form-errors';

/** The controls the fields below bind to, for the host's FormBuilder group (longest: bcrypt's 72 bytes). */
export function newPasswordControls(): { password: [string, ValidatorFn[]]; confirm: [string, ValidatorFn] } {
  return {
    password: ['', [Validators.required, Validators.minLength(MIN_PASSWORD_LENGTH), Validators.maxLength(72)]],
    confirm: ['', Validators.required],
  };
}

/** The host group's validator: the two new passwords must match. */
export const newPasswordsMatch = sameAs('password', 'confirm');

/**
 * The "choose a password" pair of fields (the password and the same again) inside the host's form,
 * whose group holds `newPasswordControls()` and `newPasswordsMatch`. Used by sign-up, the
 * reset link and the change-password screen.
 */
@Component({
  selector: 'sw-new-password-fields',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule],
  // Default, not OnPush: the errors shown follow the host form's submit, which no input of this component carries.
  changeDetection: ChangeDetectionStrategy.Default,
  // The controls belong to the host's form: errors show when it is submitted.
  viewProviders: [{ provide: ControlContainer, useFactory: () => inject(FormGroupDirective, { skipSelf: true }) }],
  styles: `:host { display: contents; }`,
  template: `
    <mat-form-field appearance="outline">
      <mat-label>{{ label() }}</mat-label>
      <input matInput formControlName="password" type="password" autocomplete="new-password" required />
      <mat-hint>At least {{ minLength }} characters</mat-hint>
      <mat-error>{{ message(label(), 'password') }}</mat-error>
    </mat-form-field>
    <mat-form-field appearance="outline">
      <mat-label>{{ label() }} again</mat-label>
      <input matInput formControlName="confirm" type="password" autocomplete="new-password" required />
      <mat-error>{{ message(label() + ' again', 'confirm') }}</mat-error>
    </mat-form-field>
  `,
})
export class NewPasswordFieldsComponent {
  /** What the first field is called ("Password", "New password"). */
  readonly label = input('New password');
  protected readonly minLength = MIN_PASSWORD_LENGTH;
  private readonly form = inject(FormGroupDirective, { skipSelf: true });

  protected message(label: string, name: 'password' | 'confirm'): string {
    return fieldMessage(label, this.form.form.get(name));
  }
}
