import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { AuthService } from '../core/auth.service';
import { NewPasswordFieldsComponent, newPasswordControls, newPasswordsMatch } from './new-password-fields.component';
import { toApiError } from '../core/api-error';

/** Choose a new password with the token from the reset e-mail. */
@Component({
  selector: 'sw-reset-confirm',
  imports: [ReactiveFormsModule, RouterLink, MatCardModule, MatButtonModule, MatProgressBarModule, NewPasswordFieldsComponent],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-card class="sw-auth-card" appearance="outlined">
      @if (busy()) { <mat-progress-bar mode="indeterminate" aria-label="Saving" /> }
      <mat-card-header><mat-card-title><h1>Choose a new password</h1></mat-card-title></mat-card-header>
      <mat-card-content>
        @if (done()) {
          <p role="status">Your password is changed. Sign in with the new one.</p>
        } @else {
          <form [formGroup]="form" (ngSubmit)="submit()" novalidate>
            <sw-new-password-fields />
            @if (problem()) { <p class="sw-form-error" role="alert">{{ problem() }}</p> }
            <button mat-flat-button type="submit" [disabled]="busy()">Save the new password</button>
          </form>
        }
      </mat-card-content>
      <mat-card-actions class="sw-auth-links">
        <a mat-button routerLink="/sign-in">Sign in</a>
        @if (!done()) { <a mat-button routerLink="/reset-password">Ask for a new link</a> }
      </mat-card-actions>
    </mat-card>
  `,
})
export class ResetConfirmComponent {
  /** The single-use token from the e-mailed link. */
  readonly token = input.required<string>();
  private readonly auth = inject(AuthService);
  protected readonly busy = signal(false);
  protected readonly done = signal(false);
  protected readonly problem = signal('');
  protected readonly form = inject(FormBuilder).nonNullable.group(
    {
      ...newPasswordControls(),
    },
    { validators: newPasswordsMatch },
  );

  protected submit(): void {
    this.problem.set('');
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.auth.confirmPasswordReset(this.token(), this.form.getRawValue().password).subscribe({
      next: () => {
        this.busy.set(false);
        this.done.set(true);
      },
      error: (err: unknown) => {
        this.busy.set(false);
        const e = toApiError(err);
        this.problem.set(e.status === 400 || e.status === 404 || e.status === 410 ? `${e.message}. The link may be used or expired; ask for a new one.` : e.message);
      },
    });
  }
}
