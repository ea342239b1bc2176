import { ChangeDetectionStrategy, Component, DestroyRef, OnInit, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { DatePipe } from '@angular/common';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { Observable, Subscription, map, of, switchMap } from 'rxjs';
import {
  PAPER_NAMES, PAPER_SIZES, buildPrintTemplates, planPrintLayout, printOptionsSchema, sheetCountStatement,
  type PaperName, type PrintLayout, type PrintOptionsInput, type PrintTemplate,
} from '@seamwright/piecing';
import { PatternContext } from '../pattern-context.service';
import { PatternsService } from '../../resources/patterns.service';
import { PrintSetsService, formatBytes, percent } from '../../resources/print-sets.service';
import { LoadState } from '../../core/load-state';
import { NotifyService } from '../../core/notify.service';
import type { PrintSet } from '../../core/api-types';
import { CautionsComponent } from '../../shared/cautions.component';
import { SheetPreviewComponent } from './sheet-preview.component';

/** Sheets shown in the preview before "and N more". */
const PREVIEW_SHEETS = 12;

/** Print: options, a preview of the sheets, making a print set, and the stored print sets. */
@Component({
  selector: 'sw-print-page',
  imports: [
    DatePipe, ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, MatRadioModule,
    MatSelectModule, MatSlideToggleModule, CautionsComponent, SheetPreviewComponent,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './print-page.component.html',
  styleUrl: './print-page.component.scss',
})
export class PrintPageComponent implements OnInit {
  protected readonly ctx = inject(PatternContext);
  private readonly patterns = inject(PatternsService);
  private readonly printSets = inject(PrintSetsService);
  private readonly notify = inject(NotifyService);
  protected readonly papers = PAPER_NAMES.map((n) => PAPER_SIZES[n]);
  protected readonly percent = percent;
  protected readonly formatBytes = formatBytes;
  protected readonly form = inject(FormBuilder).nonNullable.group({
    paper: ['letter' as PaperName],
    marginIn: [0.5, [Validators.required, Validators.min(0.25), Validators.max(1.5)]],
    view: ['mirrored' as 'mirrored' | 'front'],
    foundation: ['paper' as 'paper' | 'freezer-paper'],
    pressingsPerTemplate: [this.ctx.document()?.pressingsPerTemplate ?? 16, [Validators.required, Validators.min(1), Validators.max(1000)]],
    copies: ['plan' as 'plan' | 'single'],
    includeCuttingList: [true],
  });
  private readonly formValue = toSignal(this.form.valueChanges.pipe(map(() => this.form.getRawValue())), { initialValue: this.form.getRawValue() });
  protected readonly sets = new LoadState<PrintSet[]>();
  /** The print set being made, while it renders. */
  protected readonly making = signal<PrintSet | null>(null);
  protected readonly starting = signal(false);
  private follow: Subscription | null = null;

  protected readonly options = computed<PrintOptionsInput>(() => {
    const v = this.formValue();
    return {
      paper: v.paper,
      marginIn: v.marginIn,
      mirrored: v.view === 'mirrored',
      foundation: v.foundation,
      copies: v.copies,
      includeCuttingList: v.includeCuttingList,
    };
  });

  protected readonly pressingsChanged = computed(() => {
    const doc = this.ctx.document();
    return !!doc && this.formValue().foundation === 'freezer-paper' && this.formValue().pressingsPerTemplate !== doc.pressingsPerTemplate;
  });

  protected readonly layout = computed<{ layout: PrintLayout; templates: ReadonlyMap<string, PrintTemplate> } | { error: string } | null>(() => {
    const doc = this.ctx.document();
    const v = this.formValue();
    if (!doc || this.form.invalid) return null;
    try {
      const planned = { ...doc, pressingsPerTemplate: v.pressingsPerTemplate };
      const templates = buildPrintTemplates(planned, printOptionsSchema.parse(this.options()));
      return { layout: planPrintLayout(planned, this.options()), templates: new Map(templates.map((t) => [t.id, t])) };
    } catch (err) {
      return { error: err instanceof Error ? err.message : String(err) };
    }
  });
  protected readonly plan = computed(() => {
    const l = this.layout();
    return l && 'layout' in l ? l.layout : null;
  });
  protected readonly templates = computed(() => {
    const l = this.layout();
    return l && 'templates' in l ? l.templates : new Map<string, PrintTemplate>();
  });
  protected readonly planError = computed(() => {
    const l = this.layout();
    return l && 'error' in l ? l.error : null;
  });
  protected readonly previewSheets = computed(() => this.plan()?.sheets.slice(0, PREVIEW_SHEETS) ?? []);
  protected readonly statement = computed(() => {
    const p = this.plan();
    return p ? sheetCountStatement(p) : '';
  });

  constructor() {
    inject(DestroyRef).onDestroy(() => this.follow?.unsubscribe());
  }

  ngOnInit(): void {
    if (!this.ctx.canEdit()) this.form.controls.pressingsPerTemplate.disable();
    this.reload();
  }

  protected reload(): void {
    this.sets.run(this.printSets.list(this.ctx.id()));
  }

  /** Saves a changed pressings setting as a new revision first (editors only), then queues the print set. */
  protected make(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const doc = this.ctx.document();
    if (!doc) return;
    this.starting.set(true);
    const pressings = this.form.getRawValue().pressingsPerTemplate;
    const revision$: Observable<number> =
      this.pressingsChanged() && this.ctx.canEdit()
        ? this.patterns.save(this.ctx.id(), { baseRevision: this.ctx.revision(), document: { ...doc, pressingsPerTemplate: pressings } }).pipe(
            map((r) => {
              this.ctx.adopt(r.revision.document, r.revision.number);
              return r.revision.number;
            }),
          )
        : of(this.ctx.revision());
    revision$.pipe(switchMap((rev) => this.printSets.create(this.ctx.id(), this.options(), rev))).subscribe({
      next: (set) => {
        this.starting.set(false);
        this.making.set(set);
        this.follow?.unsubscribe();
        this.follow = this.printSets.follow(this.ctx.id(), set.id).subscribe({
          next: (s) => {
            this.making.set(s);
            if (s.status === 'done') {
              this.notify.info(`Print set ready: ${s.sheets} pages`);
              this.reload();
            } else if (s.status === 'failed') this.notify.error(new Error(s.error ?? 'The print set could not be made'));
          },
          error: (err: unknown) => this.notify.error(err),
        });
      },
      error: (err: unknown) => {
        this.starting.set(false);
        this.notify.error(err, 'No print set made');
      },
    });
  }

  protected fileUrl(set: PrintSet): string {
    return this.printSets.fileUrl(this.ctx.id(), set.id);
  }

  protected remove(set: PrintSet): void {
    if (!confirm(`Delete the print set of revision ${set.revision}?`)) return;
    this.printSets.delete(this.ctx.id(), set.id).subscribe({
      next: () => {
        if (this.making()?.id === set.id) this.making.set(null);
        this.notify.info('Print set deleted');
        this.reload();
      },
      error: (err: unknown) => this.notify.error(err),
    });
  }

  protected paperName(name: unknown): string {
    return PAPER_SIZES[name as PaperName]?.displayName ?? String(name);
  }
}
