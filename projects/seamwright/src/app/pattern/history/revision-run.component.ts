import { ChangeDetectionStrategy, Component, OnInit, computed, inject, input, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { PatternContext } from '../pattern-context.service';
import { RevisionHistoryService } from '../../resources/revision-history.service';
import { LoadState } from '../../core/load-state';
import type { Page, RevisionGroup, RevisionSummary } from '../../core/api-types';
import { RevisionRestore } from './revision-restore';
import { runRangeLabel } from './run-labels';

/** How many saves of a run are fetched at a time. */
export const RUN_PAGE_SIZE = 100;

/** The individual saves of one run in History, newest first, each to open or restore. */
@Component({
  selector: 'sw-revision-run',
  imports: [DatePipe, RouterLink, MatButtonModule, MatProgressBarModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (state.loading()) { <mat-progress-bar mode="indeterminate" [attr.aria-label]="'Loading the saves of ' + label()" /> }
    <table class="saves" [attr.aria-label]="'Saves of ' + label()">
      <thead>
        <tr><th scope="col">Revision</th><th scope="col">Saved at</th><th scope="col"><span class="sw-sr-only">Actions</span></th></tr>
      </thead>
      <tbody>
        @for (r of saves(); track r.number) {
          <tr>
            <td>{{ r.number }}</td>
            <td><time [attr.datetime]="r.createdAt">{{ r.createdAt | date: 'd MMM y, HH:mm:ss' }}</time></td>
            <td class="actions">
              <a mat-button [routerLink]="['..', 'history', r.number]" [attr.aria-label]="'Open revision ' + r.number + ' read-only'">Open</a>
              @if (ctx.canEdit() && r.number !== ctx.revision()) {
                <button mat-button type="button" (click)="restore.restore(r.number)" [disabled]="restore.busy()" [attr.aria-label]="'Restore revision ' + r.number">Restore</button>
              }
            </td>
          </tr>
        }
      </tbody>
    </table>
    @if (saves().length < total()) {
      <button mat-button type="button" (click)="more()" [disabled]="state.loading()">Show earlier saves ({{ total() - saves().length }} more)</button>
    }
  `,
  styles: `
    :host { display: block; padding: 4px 0 12px 32px; }
    .saves { border-collapse: collapse; min-width: 60%; }
    th { text-align: left; font: var(--mat-sys-label-large); color: var(--mat-sys-on-surface-variant); padding: 4px 16px 4px 0; }
    td { padding: 2px 16px 2px 0; border-top: 1px solid var(--mat-sys-outline-variant); }
    .actions { white-space: nowrap; text-align: right; }
  `,
})
export class RevisionRunComponent implements OnInit {
  /** The run whose saves are listed. */
  readonly run = input.required<RevisionGroup>();
  protected readonly ctx = inject(PatternContext);
  private readonly history = inject(RevisionHistoryService);
  protected readonly state = new LoadState<Page<RevisionSummary>>();
  protected readonly restore = new RevisionRestore();
  protected readonly saves = signal<RevisionSummary[]>([]);
  protected readonly total = signal(0);
  protected readonly label = computed(() => runRangeLabel(this.run()).toLowerCase());
  private page = 0;

  ngOnInit(): void {
    this.more();
  }

  /** Loads the next (older) page of saves. */
  protected more(): void {
    const run = this.run();
    this.page += 1;
    this.state.run(this.history.range(this.ctx.id(), run.first, run.last, this.page, RUN_PAGE_SIZE), (p) => {
      this.saves.update((s) => [...s, ...p.items]);
      this.total.set(p.total);
    });
  }
}
