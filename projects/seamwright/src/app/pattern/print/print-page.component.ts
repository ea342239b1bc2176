import { ChangeDetectionStrategy, Component, DestroyRef, ElementRef, OnInit, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
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
import { Observable, Subscription, combineLatest, debounceTime, map, of, startWith, switchMap, tap } from 'rxjs';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { PAPER_NAMES, PAPER_SIZES, findUnsewableSections, sheetCountStatement, type PaperName, type PatternDocument, type PrintOptionsInput } from '@seamwright/piecing';
import { PatternContext } from '../pattern-context.service';
import { PatternsService } from '../../resources/patterns.service';
import { PrintSetsService, formatBytes, percent } from '../../resources/print-sets.service';
import { LoadState } from '../../core/load-state';
import { NotifyService } from '../../core/notify.service';
import type { PrintSet } from '../../core/api-types';
import { CautionsComponent } from '../../shared/cautions.component';
import { FocusAfterRender } from '../../core/focus-after-render';
import { SheetPreviewComponent } from './sheet-preview.component';
import { QuiltChoiceBarComponent, chosenColourway, chosenSize } from '../quilt/quilt-choice-bar.component';
import { QuiltChoice } from '../quilt/quilt-choice.service';
import { PrintPreviewPlanner } from './print-preview-planner';
import type { PreviewRequest, PreviewResult, PreviewTemplate } from './print-preview-plan';

/** Sheets shown in the preview before "and N more". */
const PREVIEW_SHEETS = 12;

/** Quiet time after the last form change before the preview is planned again, ms. */
export const PREVIEW_DEBOUNCE_MS = 250;

/** The form's values that are print options. */
interface PrintForm {
  paper: PaperName;
  marginIn: number;
  view: 'mirrored' | 'front';
  foundation: 'paper' | 'freezer-paper';
  copies: 'plan' | 'single';
  includeCuttingList: boolean;
  printUnsewable: boolean;
}

function printOptions(v: PrintForm): PrintOptionsInput {
  return { paper: v.paper, marginIn: v.marginIn, mirrored: v.view === 'mirrored', foundation: v.foundation, copies: v.copies, includeCuttingList: v.includeCuttingList, printUnsewable: v.printUnsewable };
}

/** Print: options, a preview of the sheets, making a print set, and the stored print sets. */
@Component({
  selector: 'sw-print-page',
  imports: [
    DatePipe, ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, MatRadioModule,
    MatSelectModule, MatSlideToggleModule, MatCheckboxModule, CautionsComponent, SheetPreviewComponent, QuiltChoiceBarComponent,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [PrintPreviewPlanner],
  templateUrl: './print-page.component.html',
  styleUrl: './print-page.component.scss',
})
export class PrintPageComponent implements OnInit {
  protected readonly ctx = inject(PatternContext);
  private readonly patterns = inject(PatternsService);
  private readonly printSets = inject(PrintSetsService);
  private readonly notify = inject(NotifyService);
  private readonly planner = inject(PrintPreviewPlanner);
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
    printUnsewable: [false],
  });
  private readonly formValue = toSignal(this.form.valueChanges.pipe(map(() => this.form.getRawValue())), { initialValue: this.form.getRawValue() });
  protected readonly sets = new LoadState<PrintSet[]>();
  /** The print set being made, while it renders. */
  protected readonly making = signal<PrintSet | null>(null);
  protected readonly starting = signal(false);
  private follow: Subscription | null = null;
  private readonly host: HTMLElement = inject(ElementRef).nativeElement;
  private readonly focusAfter = new FocusAfterRender();

  protected readonly quiltChoice = inject(QuiltChoice, { optional: true });
  /** The quilt size and colourway chosen on this page or the Quilt tab: the print set's cover and fabric follow them. */
  private readonly quiltOptions = computed<Pick<PrintOptionsInput, 'quiltSize' | 'colourwayId'>>(() => {
    const doc = this.ctx.document();
    const quiltSize = chosenSize(doc, this.quiltChoice?.sizeName() ?? null);
    const colourwayId = chosenColourway(doc, this.quiltChoice?.colourwayId() ?? null);
    return { ...(quiltSize ? { quiltSize } : {}), ...(colourwayId ? { colourwayId } : {}) };
  });
  protected readonly options = computed(() => ({ ...printOptions(this.formValue()), ...this.quiltOptions() }));

  /** Sections not sewable as numbered: the print set is refused unless the user prints anyway. */
  protected readonly unsewable = computed(() => {
    const doc = this.ctx.document();
    return doc ? findUnsewableSections(doc) : [];
  });
  /** Whether making a print set waits for "Print anyway". */
  protected readonly blockedByUnsewable = computed(() => this.unsewable().length > 0 && !this.formValue().printUnsewable);

  protected readonly pressingsChanged = computed(() => {
    const doc = this.ctx.document();
    return !!doc && this.formValue().foundation === 'freezer-paper' && this.formValue().pressingsPerTemplate !== doc.pressingsPerTemplate;
  });

  /** The latest planned preview (kept on screen while the next one is planned), or null. */
  private readonly result = signal<PreviewResult | null>(null);
  /** Whether a plan for the current options is on its way (the form changed since the last answer). */
  protected readonly planning = signal(false);
  protected readonly plan = computed(() => {
    const r = this.result();
    return r && 'layout' in r ? r.layout : null;
  });
  protected readonly templates = computed(() => {
    const r = this.result();
    return new Map<string, PreviewTemplate>(r && 'templates' in r ? r.templates.map((t) => [t.id, t]) : []);
  });
  protected readonly planError = computed(() => {
    const r = this.result();
    return r && 'error' in r ? r.error : null;
  });
  protected readonly previewSheets = computed(() => this.plan()?.sheets.slice(0, PREVIEW_SHEETS) ?? []);
  protected readonly statement = computed(() => {
    const p = this.plan();
    return p ? sheetCountStatement(p) : '';
  });

  constructor() {
    inject(DestroyRef).onDestroy(() => this.follow?.unsubscribe());
    // Every change of the document or the form asks for a plan; a burst of changes asks once, after
    // it settles, and a newer request drops the answer of an older one (switchMap unsubscribes it).
    combineLatest([toObservable(this.ctx.document), this.form.valueChanges.pipe(startWith(null)), toObservable(this.quiltOptions)])
      .pipe(
        map(([doc]) => this.previewRequest(doc)),
        tap(() => this.planning.set(true)),
        debounceTime(PREVIEW_DEBOUNCE_MS),
        switchMap((request) => (request ? this.planner.plan(request) : of(null))),
        takeUntilDestroyed(),
      )
      .subscribe((result) => {
        this.result.set(result);
        this.planning.set(false);
      });
  }

  /** What to plan for the current form, or null when there is nothing valid to plan. */
  private previewRequest(doc: PatternDocument | null): Omit<PreviewRequest, 'id'> | null {
    if (!doc || this.form.invalid) return null;
    const v = this.form.getRawValue();
    return { document: doc, options: { ...printOptions(v), ...this.quiltOptions() }, pressingsPerTemplate: v.pressingsPerTemplate, sheetsShown: PREVIEW_SHEETS };
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
    if (this.blockedByUnsewable()) return;
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
    // The user's own colourway copy, when one is chosen, stands in for the colourway (quiltOptions has none then).
    const copyId = this.quiltChoice?.copy()?.id ?? null;
    revision$.pipe(switchMap((rev) => this.printSets.create(this.ctx.id(), this.options(), rev, copyId))).subscribe({
      next: (set) => {
        this.starting.set(false);
        this.making.set(set);
        this.follow?.unsubscribe();
        this.follow = this.printSets.follow(this.ctx.id(), set.id).subscribe({
          next: (s) => {
            this.making.set(s);
            if (s.status === 'done') {
              this.notify.info(`Print set ready: ${s.sheets} pages`);
              // The result is the new set's download link; focus goes there, not to the page body.
              this.focusAfter.focus(() => this.host.querySelector<HTMLElement>('[data-focus="new-print-set"]'));
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

  /** The name of the colourway copy a set was printed in (the server answers `{ id, name }`), or null. */
  protected copyName(set: PrintSet): string | null {
    const copy = set.options['colourwayCopy'] as { name?: unknown } | undefined;
    return typeof copy?.name === 'string' ? copy.name : null;
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
        // The row and its button are gone: focus goes to the list's heading.
        this.focusAfter.focus(() => this.host.querySelector<HTMLElement>('#sets-title'));
        this.reload();
      },
      error: (err: unknown) => this.notify.error(err),
    });
  }

  protected paperName(name: unknown): string {
    return PAPER_SIZES[name as PaperName]?.displayName ?? String(name);
  }
}
