import { ChangeDetectionStrategy, Component, effect, inject, input, numberAttribute } from '@angular/core';
import { DatePipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { PatternContext } from '../pattern-context.service';
import { RevisionsService } from '../../resources/revisions.service';
import { LoadState } from '../../core/load-state';
import type { Revision } from '../../core/api-types';
import { BoardHostComponent } from '../board/board-host.component';
import { NotFoundComponent } from '../../not-found/not-found.component';
import { RevisionRestore } from './revision-restore';

/** One old revision, read-only, with a way to restore it. */
@Component({
  selector: 'sw-revision-view',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, BoardHostComponent, NotFoundComponent],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (state.notFound()) {
      <sw-not-found />
    } @else {
      @if (state.loading()) { <mat-progress-bar mode="indeterminate" aria-label="Loading the revision" /> }
      @if (state.value(); as rev) {
        <div class="sw-toolbar-row">
          <a mat-button routerLink="../"><mat-icon aria-hidden="true">arrow_back</mat-icon>All revisions</a>
          <p class="sw-grow">
            <strong>Revision {{ rev.number }}</strong> (read-only) · saved by {{ rev.author.displayName }} on {{ rev.createdAt | date: 'd MMM y, HH:mm' }}
          </p>
          @if (ctx.canEdit() && rev.number !== ctx.revision()) {
            <button mat-flat-button type="button" (click)="restore.restore(rev.number)" [disabled]="restore.busy()">Restore this revision</button>
          }
        </div>
        @if (rev.version; as version) {
          <section class="version" aria-label="Named version">
            <p class="version-title"><mat-icon aria-hidden="true">bookmark</mat-icon><span class="tag">Version</span> <strong>{{ version.name }}</strong></p>
            @if (version.note) { <p class="note">{{ version.note }}</p> }
          </section>
        }
        <sw-board-host [document]="rev.document" [readOnly]="true" />
      }
    }
  `,
  styles: `
    .version { margin: 0 0 12px; padding: 8px 16px; border-radius: 12px; border-left: 4px solid var(--mat-sys-primary); background: var(--mat-sys-secondary-container); color: var(--mat-sys-on-secondary-container); }
    .version p { margin: 0; }
    .version-title { display: flex; align-items: center; gap: 6px; }
    .tag { font: var(--mat-sys-label-large); text-transform: uppercase; letter-spacing: 0.04em; }
    .note { margin-top: 4px; white-space: pre-line; }
  `,
})
export class RevisionViewComponent {
  /** The revision number from the URL. */
  readonly revisionNumber = input.required({ transform: numberAttribute });
  protected readonly ctx = inject(PatternContext);
  private readonly revisions = inject(RevisionsService);
  protected readonly state = new LoadState<Revision>();
  protected readonly restore = new RevisionRestore();

  constructor() {
    effect(() => this.state.run(this.revisions.get(this.ctx.id(), this.revisionNumber())));
  }
}
