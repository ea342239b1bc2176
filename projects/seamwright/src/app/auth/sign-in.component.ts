import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { Router, RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { AuthService } from '../core/auth.service';
import { toApiError } from '../core/api-error';
import { afterSignIn } from './after-sign-in';
import { fieldMessage } from './form-errors';

/** Sign in with e-mail and password. */
@Component({
  selector: 'sw-sign-in',
  imports: [ReactiveFormsModule, RouterLink, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatProgressBarModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-card class="sw-auth-card" appearance="outlined">
      @if (busy()) { <mat-progress-bar mode="indeterminate" aria-label="Signing in" /> }
      <mat-card-header><mat-card-title><h1>Sign in</h1></mat-card-title></mat-card-header>
      <mat-card-content>
        <form [formGroup]="form" (ngSubmit)="submit()" novalidate>
          <mat-form-field appearance="outline">
            <mat-label>E-mail</mat-label>
            <input matInput formControlName="email" type="email" autocomplete="username" required />
            <mat-error>{{ message('E-mail', 'email') }}</mat-error>
          </mat-form-field>
          <mat-form-field appearance="outline">
            <mat-label>Password</mat-label>
            <input matInput formControlName="password" type="password" autocomplete="current-password" required />
            <mat-error>{{ message('Password', 'password') }}</mat-error>
          </mat-form-field>
          @if (problem()) { <p class="sw-form-error" role="alert">{{ problem() }}</p> }
          <button mat-flat-button type="submit" [disabled]="busy()">Sign in</button>
        </form>
      </mat-card-content>
      <mat-card-actions class="sw-auth-links">
        <a mat-button routerLink="/sign-up">Create an account</a>
        <a mat-button routerLink="/reset-password">Forgot your password?</a>
      </mat-card-actions>
    </mat-card>
  `,
})
export class SignInComponent {
  /** Where to go after signing in (from the query string). */
  readonly next = input<string | undefined>();
  private readonly auth = inject(AuthService);
  private readonly router = inject(Router);
  protected readonly busy = signal(false);
  protected readonly problem = signal('');
  protected readonly form = inject(FormBuilder).nonNullable.group({
    email: ['', [Validators.required, Validators.email]],
    password: ['', Validators.required],
  });

  protected message(label: string, name: 'email' | 'password'): string {
    return fieldMessage(label, this.form.controls[name]);
  }

  protected submit(): void {
    this.problem.set('');
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    const { email, password } = this.form.getRawValue();
    this.auth.signIn(email.trim(), password).subscribe({
      next: () => {
        this.busy.set(false);
        void this.router.navigateByUrl(afterSignIn(this.next()));
      },
      error: (err: unknown) => {
        this.busy.set(false);
        const e = toApiError(err);
        this.problem.set(e.status === 401 ? 'That e-mail and password do not match an account.' : e.message);
      },
    });
  }
}
