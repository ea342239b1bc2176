import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { AuthService } from '../core/auth.service';
import { toApiError } from '../core/api-error';
import { fieldMessage } from './form-errors';

/** Ask for a password-reset e-mail. */
@Component({
  selector: 'sw-reset-request',
  imports: [ReactiveFormsModule, RouterLink, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatProgressBarModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-card class="sw-auth-card" appearance="outlined">
      @if (busy()) { <mat-progress-bar mode="indeterminate" aria-label="Sending" /> }
      <mat-card-header><mat-card-title><h1>Reset your password</h1></mat-card-title></mat-card-header>
      <mat-card-content>
        @if (sent()) {
          <p role="status">If an account uses that address, an e-mail with a link to choose a new password is on its way. The link works once, for one hour.</p>
        } @else {
          <p>We will e-mail you a link to choose a new password.</p>
          <form [formGroup]="form" (ngSubmit)="submit()" novalidate>
            <mat-form-field appearance="outline">
              <mat-label>E-mail</mat-label>
              <input matInput formControlName="email" type="email" autocomplete="email" required />
              <mat-error>{{ message() }}</mat-error>
            </mat-form-field>
            @if (problem()) { <p class="sw-form-error" role="alert">{{ problem() }}</p> }
            <button mat-flat-button type="submit" [disabled]="busy()">Send the link</button>
          </form>
        }
      </mat-card-content>
      <mat-card-actions class="sw-auth-links"><a mat-button routerLink="/sign-in">Back to sign in</a></mat-card-actions>
    </mat-card>
  `,
})
export class ResetRequestComponent {
  private readonly auth = inject(AuthService);
  protected readonly busy = signal(false);
  protected readonly sent = signal(false);
  protected readonly problem = signal('');
  protected readonly form = inject(FormBuilder).nonNullable.group({ email: ['', [Validators.required, Validators.email]] });

  protected message(): string {
    return fieldMessage('E-mail', this.form.controls.email);
  }

  protected submit(): void {
    this.problem.set('');
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.auth.requestPasswordReset(this.form.getRawValue().email.trim()).subscribe({
      next: () => {
        this.busy.set(false);
        this.sent.set(true);
      },
      error: (err: unknown) => {
        this.busy.set(false);
        this.problem.set(toApiError(err).message);
      },
    });
  }
}
