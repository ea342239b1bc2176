import { ChangeDetectionStrategy, Component, DestroyRef, ElementRef, OnInit, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { DatePipe } from '@angular/common';
import { Router, RouterLink } from '@angular/router';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatTableModule } from '@angular/material/table';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatMenuModule } from '@angular/material/menu';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatDialog } from '@angular/material/dialog';
import { Observable, debounceTime, distinctUntilChanged, filter, switchMap } from 'rxjs';
import { PatternsService } from '../resources/patterns.service';
import { LoadState } from '../core/load-state';
import { NotifyService } from '../core/notify.service';
import { AuthService } from '../core/auth.service';
import type { Page, PatternListItem, PatternListQuery } from '../core/api-types';
import { NewPatternChoice, NewPatternDialogComponent } from './new-pattern-dialog.component';
import { STARTERS } from './starters';
import { PatternThumbnailComponent } from './pattern-thumbnail.component';
import { accessLabel } from './access-label';
import { OpenPatternFileComponent } from './open-pattern-file.component';
import { FocusAfterRender } from '../core/focus-after-render';

/** The pattern list: everything the user owns or was invited to, and the trash. */
@Component({
  selector: 'sw-patterns-page',
  imports: [
    DatePipe, RouterLink, ReactiveFormsModule, MatTableModule, MatSortModule, MatPaginatorModule, MatButtonModule, MatIconModule,
    MatFormFieldModule, MatInputModule, MatMenuModule, MatProgressBarModule, MatButtonToggleModule, PatternThumbnailComponent,
    OpenPatternFileComponent,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './patterns-page.component.html',
  styleUrl: './patterns-page.component.scss',
})
export class PatternsPageComponent implements OnInit {
  private readonly patterns = inject(PatternsService);
  private readonly notify = inject(NotifyService);
  private readonly dialog = inject(MatDialog);
  private readonly router = inject(Router);
  private readonly destroyRef = inject(DestroyRef);
  protected readonly auth = inject(AuthService);
  protected readonly accessLabel = accessLabel;

  protected readonly columns = ['thumbnail', 'title', 'sections', 'size', 'updated', 'owner', 'access', 'actions'];
  /** The list query; `page` here is 0-based like the paginator. */
  protected readonly query = signal<PatternListQuery>({ page: 0, pageSize: 10, sort: 'updated', order: 'desc', q: '', scope: 'all' });
  protected readonly trashed = computed(() => this.query().scope === 'trash');
  /** One request fills the page: each row carries its section count, finished size and picture. */
  protected readonly state = new LoadState<Page<PatternListItem>>();
  protected readonly rows = computed(() => this.state.value()?.items ?? []);
  protected readonly total = computed(() => this.state.value()?.total ?? 0);
  protected readonly busyId = signal<string | null>(null);
  protected readonly filter = new FormControl('', { nonNullable: true });
  private readonly host: HTMLElement = inject(ElementRef).nativeElement;
  private readonly focusAfter = new FocusAfterRender();

  ngOnInit(): void {
    this.reload();
    this.filter.valueChanges
      .pipe(debounceTime(300), distinctUntilChanged(), takeUntilDestroyed(this.destroyRef))
      .subscribe((q) => this.update({ q, page: 0 }));
  }

  protected update(change: Partial<PatternListQuery>): void {
    this.query.update((q) => ({ ...q, ...change }));
    this.reload();
  }

  protected onSort(s: Sort): void {
    const sort = (s.direction ? s.active : 'updated') as PatternListQuery['sort'];
    this.update({ sort, order: s.direction || 'desc', page: 0 });
  }

  protected onPage(e: PageEvent): void {
    this.update({ page: e.pageIndex, pageSize: e.pageSize });
  }

  /** Loads the page of the list; `then` runs once the new rows are in. */
  protected reload(then?: () => void): void {
    // The server numbers pages from 1; the paginator from 0.
    const q = this.query();
    this.state.run(this.patterns.list({ ...q, page: q.page + 1 }), then);
  }

  protected newPattern(): void {
    this.dialog
      .open<NewPatternDialogComponent, unknown, NewPatternChoice>(NewPatternDialogComponent, { width: '560px', maxWidth: '95vw' })
      .afterClosed()
      .pipe(
        filter((c): c is NewPatternChoice => !!c),
        switchMap((c) => {
          const starter = STARTERS.find((s) => s.id === c.starterId) ?? STARTERS[0];
          return this.patterns.create(starter.build(c.title));
        }),
      )
      .subscribe({
        next: (p) => void this.router.navigate(['/patterns', p.pattern.id, 'board']),
        error: (err: unknown) => this.notify.error(err, 'Could not create the pattern'),
      });
  }

  protected duplicate(row: PatternListItem): void {
    this.act(row, this.patterns.duplicate(row.id), `“${row.title}” duplicated`);
  }

  protected trash(row: PatternListItem): void {
    this.act(row, this.patterns.trash(row.id), `“${row.title}” moved to the trash`, true);
  }

  protected restore(row: PatternListItem): void {
    this.act(row, this.patterns.restore(row.id), `“${row.title}” restored`, true);
  }

  protected deleteForGood(row: PatternListItem): void {
    if (!confirm(`Delete “${row.title}” and all its revisions and print sets for good?`)) return;
    this.act(row, this.patterns.deleteForGood(row.id), `“${row.title}” deleted`, true);
  }

  /**
   * Runs a row's action and reloads the list. When the row leaves the list (`leaves`), focus goes to
   * the row now in its place, or to the list's heading when none is; otherwise it stays on the row's
   * actions button, where the menu gave it back.
   */
  private act(row: PatternListItem, call: Observable<unknown>, done: string, leaves = false): void {
    const index = this.rows().findIndex((r) => r.id === row.id);
    this.busyId.set(row.id);
    call.subscribe({
      next: () => {
        this.busyId.set(null);
        this.notify.info(done);
        this.reload(() => (leaves ? this.focusRowOrHeading(index) : undefined));
      },
      error: (err: unknown) => {
        this.busyId.set(null);
        this.notify.error(err);
      },
    });
  }

  private focusRowOrHeading(index: number): void {
    this.focusAfter.focus(() => {
      const rows = [...this.host.querySelectorAll<HTMLElement>('tr.mat-mdc-row')].filter((r) => !r.querySelector('td.empty'));
      const next = rows[Math.min(index, rows.length - 1)];
      return next?.querySelector<HTMLElement>('a.title-link, button[aria-label^="Actions for"]') ?? this.host.querySelector<HTMLElement>('h1');
    });
  }
}
