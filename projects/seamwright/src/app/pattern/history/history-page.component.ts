import { ChangeDetectionStrategy, Component, OnInit, computed, inject, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { MatTableModule } from '@angular/material/table';
import { MatButtonModule } from '@angular/material/button';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { PatternContext } from '../pattern-context.service';
import { RevisionsService } from '../../resources/revisions.service';
import { LoadState } from '../../core/load-state';
import type { Page, RevisionSummary } from '../../core/api-types';
import { RevisionRestore } from './revision-restore';

/** History: every revision with its author and time; open one read-only or restore it. */
@Component({
  selector: 'sw-history-page',
  imports: [DatePipe, RouterLink, MatTableModule, MatButtonModule, MatPaginatorModule, MatProgressBarModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="sw-table-wrap">
      @if (state.loading()) { <mat-progress-bar mode="indeterminate" aria-label="Loading revisions" /> }
      <table mat-table [dataSource]="rows()" aria-label="Revisions">
        <ng-container matColumnDef="number">
          <th mat-header-cell *matHeaderCellDef>Revision</th>
          <td mat-cell *matCellDef="let r">
            {{ r.number }}
            @if (r.number === ctx.revision()) { <span class="latest">latest</span> }
          </td>
        </ng-container>
        <ng-container matColumnDef="author">
          <th mat-header-cell *matHeaderCellDef>Saved by</th>
          <td mat-cell *matCellDef="let r">{{ r.author.displayName }}</td>
        </ng-container>
        <ng-container matColumnDef="createdAt">
          <th mat-header-cell *matHeaderCellDef>When</th>
          <td mat-cell *matCellDef="let r"><time [attr.datetime]="r.createdAt">{{ r.createdAt | date: 'd MMM y, HH:mm:ss' }}</time></td>
        </ng-container>
        <ng-container matColumnDef="note">
          <th mat-header-cell *matHeaderCellDef>Note</th>
          <td mat-cell *matCellDef="let r">@if (r.restoredFrom) { Restored from revision {{ r.restoredFrom }} }</td>
        </ng-container>
        <ng-container matColumnDef="actions">
          <th mat-header-cell *matHeaderCellDef><span class="sw-sr-only">Actions</span></th>
          <td mat-cell *matCellDef="let r" class="actions">
            <a mat-button [routerLink]="['..', 'history', r.number]" [attr.aria-label]="'Open revision ' + r.number + ' read-only'">Open</a>
            @if (ctx.canEdit() && r.number !== ctx.revision()) {
              <button mat-stroked-button type="button" (click)="restore.restore(r.number)" [disabled]="restore.busy()" [attr.aria-label]="'Restore revision ' + r.number">Restore</button>
            }
          </td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let row; columns: columns"></tr>
      </table>
      <mat-paginator [length]="state.value()?.total ?? 0" [pageIndex]="page() - 1" [pageSize]="20" [hidePageSize]="true" (page)="onPage($event)" aria-label="Pages of revisions" />
    </div>
    <p class="sw-muted">Every save is kept. Restoring makes an old revision the newest one; nothing is overwritten.</p>
  `,
  styles: `
    table { width: 100%; }
    .latest { margin-left: 8px; padding: 1px 8px; border-radius: 8px; font-size: 0.75rem; background: var(--mat-sys-primary-container); color: var(--mat-sys-on-primary-container); }
    .actions { white-space: nowrap; text-align: right; }
  `,
})
export class HistoryPageComponent implements OnInit {
  protected readonly ctx = inject(PatternContext);
  private readonly revisions = inject(RevisionsService);
  protected readonly state = new LoadState<Page<RevisionSummary>>();
  protected readonly rows = computed(() => this.state.value()?.items ?? []);
  protected readonly page = signal(1);
  protected readonly columns = ['number', 'author', 'createdAt', 'note', 'actions'];
  protected readonly restore = new RevisionRestore(() => this.reload());

  ngOnInit(): void {
    this.reload();
  }

  protected onPage(e: PageEvent): void {
    this.page.set(e.pageIndex + 1);
    this.reload();
  }

  private reload(): void {
    this.state.run(this.revisions.list(this.ctx.id(), this.page(), 20));
  }
}
