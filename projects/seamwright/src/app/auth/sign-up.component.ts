import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { Router, RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { AuthService } from '../core/auth.service';
import { NewPasswordFieldsComponent, newPasswordControls, newPasswordsMatch } from './new-password-fields.component';
import { toApiError } from '../core/api-error';
import { afterSignIn } from './after-sign-in';
import { applyServerIssues, fieldMessage } from './form-errors';

/** Create an account as a designer or a quilter. */
@Component({
  selector: 'sw-sign-up',
  imports: [ReactiveFormsModule, RouterLink, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatRadioModule, MatProgressBarModule, NewPasswordFieldsComponent],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-card class="sw-auth-card" appearance="outlined">
      @if (busy()) { <mat-progress-bar mode="indeterminate" aria-label="Creating the account" /> }
      <mat-card-header><mat-card-title><h1>Create an account</h1></mat-card-title></mat-card-header>
      <mat-card-content>
        <form [formGroup]="form" (ngSubmit)="submit()" novalidate>
          <mat-form-field appearance="outline">
            <mat-label>Your name</mat-label>
            <input matInput formControlName="displayName" autocomplete="name" required />
            <mat-error>{{ message('Your name', 'displayName') }}</mat-error>
          </mat-form-field>
          <mat-form-field appearance="outline">
            <mat-label>E-mail</mat-label>
            <input matInput formControlName="email" type="email" autocomplete="email" required />
            <mat-error>{{ message('E-mail', 'email') }}</mat-error>
          </mat-form-field>
          <sw-new-password-fields label="Password" />
          <fieldset class="sw-fieldset">
            <legend>I will mostly</legend>
            <mat-radio-group formControlName="role" aria-label="Account type" class="sw-radio-column">
              <mat-radio-button value="designer">design patterns (designer)</mat-radio-button>
              <mat-radio-button value="quilter">sew patterns shared with me (quilter)</mat-radio-button>
            </mat-radio-group>
          </fieldset>
          @if (problem()) { <p class="sw-form-error" role="alert">{{ problem() }}</p> }
          <button mat-flat-button type="submit" [disabled]="busy()">Create account</button>
        </form>
      </mat-card-content>
      <mat-card-actions class="sw-auth-links">
        <a mat-button routerLink="/sign-in" [queryParams]="next() ? { next: next() } : {}">I have an account</a>
      </mat-card-actions>
    </mat-card>
  `,
})
export class SignUpComponent {
  /** Where to go afterwards (an invitation link, for example). */
  readonly next = input<string | undefined>();
  private readonly auth = inject(AuthService);
  private readonly router = inject(Router);
  protected readonly busy = signal(false);
  protected readonly problem = signal('');
  protected readonly form = inject(FormBuilder).nonNullable.group(
    {
      displayName: ['', [Validators.required, Validators.maxLength(80)]],
      email: ['', [Validators.required, Validators.email]],
      ...newPasswordControls(),
      role: ['designer' as 'designer' | 'quilter', Validators.required],
    },
    { validators: newPasswordsMatch },
  );

  protected message(label: string, name: 'displayName' | 'email'): string {
    return fieldMessage(label, this.form.controls[name]);
  }

  protected submit(): void {
    this.problem.set('');
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    const { displayName, email, password, role } = this.form.getRawValue();
    this.auth.signUp({ displayName: displayName.trim(), email: email.trim(), password, role }).subscribe({
      next: () => {
        this.busy.set(false);
        void this.router.navigateByUrl(afterSignIn(this.next()));
      },
      error: (err: unknown) => {
        this.busy.set(false);
        const e = toApiError(err);
        const rest = applyServerIssues(this.form, e.issues);
        this.problem.set(e.status === 409 ? 'An account with that e-mail already exists. Sign in instead.' : rest.length || !e.issues.length ? e.message : '');
      },
    });
  }
}
