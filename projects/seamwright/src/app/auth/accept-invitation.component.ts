import { ChangeDetectionStrategy, Component, OnInit, inject, input, signal } from '@angular/core';
import { Router, RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { AuthService } from '../core/auth.service';
import { LoadState } from '../core/load-state';
import type { InvitationPreview } from '../core/api-types';
import { MembersService } from '../resources/members.service';
import { NotifyService } from '../core/notify.service';

/** Accept an invitation to a pattern; asks the person to sign in or up first when needed. */
@Component({
  selector: 'sw-accept-invitation',
  imports: [RouterLink, MatCardModule, MatButtonModule, MatProgressBarModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-card class="sw-auth-card" appearance="outlined">
      @if (state.loading() || busy()) { <mat-progress-bar mode="indeterminate" aria-label="Loading" /> }
      <mat-card-header><mat-card-title><h1>Invitation</h1></mat-card-title></mat-card-header>
      <mat-card-content>
        @if (state.value(); as inv) {
          <p>
            <strong>{{ inv.invitedBy.displayName }}</strong> invites you to <strong>{{ inv.patternTitle }}</strong> as
            {{ inv.access === 'quilter' ? 'a quilter (view, print, keep a sewing log)' : 'a co-designer (may edit)' }}.
          </p>
          <p class="sw-muted">Sent to {{ inv.email }}.</p>
        } @else if (state.error(); as e) {
          <p role="alert">This invitation cannot be used: {{ e.message }}. It may have expired or been withdrawn; ask the designer for a new one.</p>
        }
      </mat-card-content>
      @if (state.value()) {
        <mat-card-actions class="sw-auth-links">
          @if (auth.signedIn()) {
            <button mat-flat-button type="button" (click)="accept()" [disabled]="busy()">Accept and open the pattern</button>
          } @else {
            <a mat-flat-button routerLink="/sign-up" [queryParams]="{ next: here() }">Create an account</a>
            <a mat-button routerLink="/sign-in" [queryParams]="{ next: here() }">Sign in to accept</a>
          }
        </mat-card-actions>
      }
    </mat-card>
  `,
})
export class AcceptInvitationComponent implements OnInit {
  /** The token from the e-mailed link (`?token=`). */
  readonly token = input('');
  protected readonly auth = inject(AuthService);
  private readonly members = inject(MembersService);
  private readonly router = inject(Router);
  private readonly notify = inject(NotifyService);
  protected readonly state = new LoadState<InvitationPreview>({ snackOnError: false });
  protected readonly busy = signal(false);

  ngOnInit(): void {
    this.auth.load().subscribe({ error: () => undefined });
    this.state.run(this.members.preview(this.token()));
  }

  protected here(): string {
    return `/invitations/accept?token=${encodeURIComponent(this.token())}`;
  }

  protected accept(): void {
    this.busy.set(true);
    this.members.accept(this.token()).subscribe({
      next: (r) => {
        this.busy.set(false);
        this.notify.info('Invitation accepted');
        void this.router.navigate(['/patterns', r.id]);
      },
      error: (err: unknown) => {
        this.busy.set(false);
        this.notify.error(err, 'Could not accept');
      },
    });
  }
}
