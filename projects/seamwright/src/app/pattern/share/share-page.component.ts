import { ChangeDetectionStrategy, Component, OnInit, inject, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { FormBuilder, FormGroupDirective, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatListModule } from '@angular/material/list';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { PatternContext } from '../pattern-context.service';
import { MembersService } from '../../resources/members.service';
import { LoadState } from '../../core/load-state';
import { NotifyService } from '../../core/notify.service';
import { toApiError } from '../../core/api-error';
import type { Member, MemberAccess, MembersResponse } from '../../core/api-types';
import { applyServerIssues, fieldMessage } from '../../auth/form-errors';

/** Share: who has the pattern, invitations by e-mail, changing and revoking access. */
@Component({
  selector: 'sw-share-page',
  imports: [DatePipe, ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, MatListModule, MatProgressBarModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './share-page.component.html',
  styleUrl: './share-page.component.scss',
})
export class SharePageComponent implements OnInit {
  protected readonly ctx = inject(PatternContext);
  private readonly members = inject(MembersService);
  private readonly notify = inject(NotifyService);
  protected readonly state = new LoadState<MembersResponse>();
  protected readonly sending = signal(false);
  protected readonly form = inject(FormBuilder).nonNullable.group({
    email: ['', [Validators.required, Validators.email]],
    access: ['quilter' as MemberAccess, Validators.required],
  });

  ngOnInit(): void {
    this.reload();
  }

  protected reload(): void {
    this.state.run(this.members.list(this.ctx.id()));
  }

  protected message(): string {
    return fieldMessage('E-mail', this.form.controls.email);
  }

  protected invite(directive: FormGroupDirective): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { email, access } = this.form.getRawValue();
    this.sending.set(true);
    this.members.invite(this.ctx.id(), email.trim(), access).subscribe({
      next: (inv) => {
        this.sending.set(false);
        this.notify.info(`Invitation sent to ${inv.email}`);
        // resetForm also clears "submitted", so the empty field shows no error after sending.
        directive.resetForm({ email: '', access });
        this.reload();
      },
      error: (err: unknown) => {
        this.sending.set(false);
        const rest = applyServerIssues(this.form, toApiError(err).issues);
        if (rest.length || !toApiError(err).issues.length) this.notify.error(err, 'Invitation not sent');
      },
    });
  }

  protected changeAccess(m: Member, access: MemberAccess): void {
    this.members.changeAccess(this.ctx.id(), m.userId, access).subscribe({
      next: () => {
        this.notify.info(`${m.displayName} is now a ${access}`);
        this.reload();
      },
      error: (err: unknown) => this.notify.error(err),
    });
  }

  protected revoke(m: Member): void {
    if (!confirm(`Remove ${m.displayName}'s access to this pattern?`)) return;
    this.members.revoke(this.ctx.id(), m.userId).subscribe({
      next: () => {
        this.notify.info(`${m.displayName} no longer has access`);
        this.reload();
      },
      error: (err: unknown) => this.notify.error(err),
    });
  }

  protected withdraw(id: string, email: string): void {
    this.members.withdrawInvitation(this.ctx.id(), id).subscribe({
      next: () => {
        this.notify.info(`Invitation to ${email} withdrawn`);
        this.reload();
      },
      error: (err: unknown) => this.notify.error(err),
    });
  }
}
