import { ChangeDetectionStrategy, Component, OnInit, computed, inject, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { MatTableModule } from '@angular/material/table';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { PatternContext } from '../pattern-context.service';
import { RevisionHistoryService } from '../../resources/revision-history.service';
import { LoadState } from '../../core/load-state';
import type { Page, RevisionGroup } from '../../core/api-types';
import { RevisionRestore } from './revision-restore';
import { RevisionRunComponent } from './revision-run.component';
import { runRangeLabel, sameDay, savesLabel } from './run-labels';

/** A row of the History table: a run of saves, or the opened list of a run's saves below it. */
export interface HistoryRow {
  kind: 'run' | 'saves';
  run: RevisionGroup;
}

/**
 * History: the revisions in runs of saves (one sitting at the board, one author), named versions on
 * rows of their own; open a run to see each save, open any revision read-only or restore it.
 */
@Component({
  selector: 'sw-history-page',
  imports: [DatePipe, RouterLink, MatTableModule, MatButtonModule, MatIconModule, MatPaginatorModule, MatProgressBarModule, RevisionRunComponent],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './history-page.component.html',
  styleUrl: './history-page.component.scss',
})
export class HistoryPageComponent implements OnInit {
  protected readonly ctx = inject(PatternContext);
  private readonly history = inject(RevisionHistoryService);
  protected readonly state = new LoadState<Page<RevisionGroup>>();
  protected readonly page = signal(1);
  protected readonly pageSize = 20;
  /** First revision numbers of the runs whose saves are shown. */
  protected readonly opened = signal<ReadonlySet<number>>(new Set());
  protected readonly rows = computed<HistoryRow[]>(() =>
    (this.state.value()?.items ?? []).flatMap((run) =>
      this.opened().has(run.first) ? [{ kind: 'run' as const, run }, { kind: 'saves' as const, run }] : [{ kind: 'run' as const, run }],
    ),
  );
  protected readonly columns = ['number', 'author', 'createdAt', 'note', 'actions'];
  protected readonly restore = new RevisionRestore(() => this.reload());
  protected readonly rangeLabel = runRangeLabel;
  protected readonly savesLabel = savesLabel;
  protected readonly sameDay = sameDay;
  protected readonly isRunRow = (_i: number, row: HistoryRow) => row.kind === 'run';
  protected readonly isSavesRow = (_i: number, row: HistoryRow) => row.kind === 'saves';
  /** Keeps a run's row (and the focus on its button) when its saves open or close. */
  protected readonly trackRow = (_i: number, row: HistoryRow) => `${row.kind}:${row.run.first}`;

  ngOnInit(): void {
    this.reload();
  }

  protected isOpen(run: RevisionGroup): boolean {
    return this.opened().has(run.first);
  }

  protected savesId(run: RevisionGroup): string {
    return `saves-of-${run.first}`;
  }

  protected toggle(run: RevisionGroup): void {
    this.opened.update((s) => {
      const next = new Set(s);
      if (!next.delete(run.first)) next.add(run.first);
      return next;
    });
  }

  protected onPage(e: PageEvent): void {
    this.page.set(e.pageIndex + 1);
    this.opened.set(new Set());
    this.reload();
  }

  private reload(): void {
    this.state.run(this.history.groups(this.ctx.id(), this.page(), this.pageSize));
  }
}
