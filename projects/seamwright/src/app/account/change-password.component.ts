import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormBuilder, FormGroupDirective, ReactiveFormsModule, Validators } from '@angular/forms';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { AuthService } from '../core/auth.service';
import { toApiError, type FieldIssue } from '../core/api-error';
import { applyServerIssues, fieldMessage } from '../auth/form-errors';
import { NewPasswordFieldsComponent, newPasswordControls, newPasswordsMatch } from '../auth/new-password-fields.component';

/** Change the password of the signed-in account; the server signs out its other sessions. */
@Component({
  selector: 'sw-change-password',
  imports: [ReactiveFormsModule, RouterLink, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatProgressBarModule, NewPasswordFieldsComponent],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-card class="sw-auth-card" appearance="outlined">
      @if (busy()) { <mat-progress-bar mode="indeterminate" aria-label="Saving" /> }
      <mat-card-header><mat-card-title><h1>Change your password</h1></mat-card-title></mat-card-header>
      <mat-card-content>
        @if (auth.user(); as user) { <p class="sw-muted">Signed in as {{ user.email }}</p> }
        @if (done()) {
          <p role="status">Your password is changed. Other browsers and devices signed in to this account were signed out.</p>
        }
        <form [formGroup]="form" #formDirective="ngForm" (ngSubmit)="submit(formDirective)" novalidate>
          <mat-form-field appearance="outline">
            <mat-label>Current password</mat-label>
            <input matInput formControlName="currentPassword" type="password" autocomplete="current-password" required />
            <mat-error>{{ message('Current password', 'currentPassword') }}</mat-error>
          </mat-form-field>
          <sw-new-password-fields />
          @if (problem()) { <p class="sw-form-error" role="alert">{{ problem() }}</p> }
          <button mat-flat-button type="submit" [disabled]="busy()">Change password</button>
        </form>
      </mat-card-content>
      <mat-card-actions class="sw-auth-links">
        <a mat-button routerLink="/patterns">Back to patterns</a>
        <a mat-button routerLink="/reset-password">Forgot the current one?</a>
      </mat-card-actions>
    </mat-card>
  `,
})
export class ChangePasswordComponent {
  protected readonly auth = inject(AuthService);
  protected readonly busy = signal(false);
  protected readonly done = signal(false);
  protected readonly problem = signal('');
  protected readonly form = inject(FormBuilder).nonNullable.group(
    {
      currentPassword: ['', Validators.required],
      ...newPasswordControls(),
    },
    { validators: newPasswordsMatch },
  );

  protected message(label: string, name: 'currentPassword'): string {
    return fieldMessage(label, this.form.controls[name]);
  }

  protected submit(formDirective: FormGroupDirective): void {
    this.problem.set('');
    this.done.set(false);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { currentPassword, password: newPassword } = this.form.getRawValue();
    this.busy.set(true);
    this.auth.changePassword(currentPassword, newPassword).subscribe({
      next: () => {
        this.busy.set(false);
        this.done.set(true);
        // Clears the values and the submitted state, so the emptied fields do not show as errors.
        formDirective.resetForm();
      },
      error: (err: unknown) => {
        this.busy.set(false);
        const e = toApiError(err);
        // The server names the new password `newPassword`; here its control is `password`.
        const issues = (Array.isArray(e.details) ? (e.details as FieldIssue[]) : []).map((i) => (i.path === 'newPassword' ? { ...i, path: 'password' } : i));
        const rest = applyServerIssues(this.form, issues);
        if (issues.length === 0 || rest.length > 0) this.problem.set(e.message);
      },
    });
  }
}
