import { ChangeDetectionStrategy, Component, OnInit, inject } from '@angular/core';
import { DatePipe } from '@angular/common';
import { MatButtonModule } from '@angular/material/button';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatIconModule } from '@angular/material/icon';
import { AdminUsersService } from '../resources/admin-users.service';
import { LoadState } from '../core/load-state';
import type { DevMessage } from '../core/api-types';
import { API } from '../core/api-paths';

/** In development: the mail the local fake mail server caught (invitations, password resets). */
@Component({
  selector: 'sw-dev-inbox',
  imports: [DatePipe, MatButtonModule, MatExpansionModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (!state.notFound()) {
      <section aria-labelledby="inbox-title">
        <div class="sw-toolbar-row">
          <h2 id="inbox-title" class="sw-grow">Development mail inbox</h2>
          <a mat-button [href]="rawUrl" target="_blank" rel="noopener">Open the inbox (JSON)</a>
          <button mat-stroked-button type="button" (click)="reload()"><mat-icon aria-hidden="true">refresh</mat-icon>Refresh</button>
        </div>
        <p class="sw-muted">Only in development: mail is caught by the local fake mail server and never leaves this machine.</p>
        @if (state.error(); as e) { <p role="alert">The inbox cannot be read: {{ e.message }}</p> }
        <mat-accordion>
          @for (m of state.value() ?? []; track m.id) {
            <mat-expansion-panel>
              <mat-expansion-panel-header>
                <mat-panel-title>{{ m.subject }}</mat-panel-title>
                <mat-panel-description>to {{ m.to.join(', ') }} · {{ m.date | date: 'd MMM, HH:mm' }}</mat-panel-description>
              </mat-expansion-panel-header>
              <pre class="mail">{{ m.text }}</pre>
            </mat-expansion-panel>
          } @empty {
            <p class="sw-muted">No mail yet.</p>
          }
        </mat-accordion>
      </section>
    }
  `,
  styles: `.mail { white-space: pre-wrap; word-break: break-word; font-family: inherit; margin: 0; }`,
})
export class DevInboxComponent implements OnInit {
  private readonly admin = inject(AdminUsersService);
  protected readonly state = new LoadState<DevMessage[]>({ snackOnError: false });
  protected readonly rawUrl = API.devInbox;

  ngOnInit(): void {
    this.reload();
  }

  protected reload(): void {
    this.state.run(this.admin.devInbox());
  }
}
