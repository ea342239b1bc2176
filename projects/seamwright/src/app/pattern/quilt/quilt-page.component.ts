import { ChangeDetectionStrategy, Component, HostListener, computed, effect, inject, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import { applyColourway, quiltPictureSvg, quiltPlan, type PatternDocument, type QuiltPlan } from '@seamwright/piecing';
import { PatternContext } from '../pattern-context.service';
import { BoardAutosave } from '../board/board-autosave';
import type { HasUnsavedChanges } from '../board/unsaved-changes.guard';
import { NotifyService } from '../../core/notify.service';
import { showInches } from '../../core/length-text';
import { QuiltChoice } from './quilt-choice.service';
import { QuiltPictureComponent, type CellRef } from './quilt-picture.component';
import { QuiltLayoutFormComponent } from './quilt-layout-form.component';
import { SizeChartComponent } from './size-chart.component';
import { ColourwaysComponent } from './colourways.component';
import { QuiltExportComponent } from './quilt-export.component';
import { startQuilt, type QuiltEdit } from './quilt-edits';

/**
 * The Quilt part of the pattern page: the block set into a quilt (picture in the chosen colourway and
 * size), the layout's controls for designers, colourways, the size chart and picture downloads. Changes
 * save as revisions the same way the board's do (autosave, a stale save reported as a conflict).
 */
@Component({
  selector: 'sw-quilt-page',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatSelectModule, QuiltPictureComponent, QuiltLayoutFormComponent, SizeChartComponent, ColourwaysComponent, QuiltExportComponent],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './quilt-page.component.html',
  styleUrl: './quilt-page.component.scss',
})
export class QuiltPageComponent implements HasUnsavedChanges {
  protected readonly ctx = inject(PatternContext);
  protected readonly choice = inject(QuiltChoice);
  private readonly notify = inject(NotifyService);
  protected readonly inches = showInches;
  protected readonly autosave = new BoardAutosave((doc, rev) => this.ctx.adopt(doc, rev));
  /** The pattern with the designer's unsaved changes. */
  protected readonly working = signal<PatternDocument | null>(null);
  protected readonly canEdit = this.ctx.canEdit;
  /** The block chosen on the picture. */
  protected readonly chosen = signal<CellRef | null>(null);

  protected readonly colourways = computed(() => this.working()?.colourways ?? []);
  protected readonly sizes = computed(() => this.working()?.quilt?.sizes ?? []);
  /** The chosen colourway, if it still exists. */
  protected readonly colourwayId = computed(() => {
    const id = this.choice.colourwayId();
    return id && this.colourways().some((c) => c.id === id) ? id : null;
  });
  protected readonly chosenColourwayName = computed(() => this.colourways().find((c) => c.id === this.colourwayId())?.name ?? null);
  protected readonly sizeName = computed(() => {
    const name = this.choice.sizeName();
    return name && this.sizes().some((s) => s.name === name) ? name : null;
  });
  /** The pattern in the chosen colourway's fabrics. */
  protected readonly shown = computed(() => {
    const doc = this.working();
    return doc ? applyColourway(doc, this.colourwayId()) : null;
  });
  private readonly planned = computed<{ plan: QuiltPlan } | { error: string } | null>(() => {
    const doc = this.working();
    if (!doc?.quilt) return null;
    try {
      return { plan: quiltPlan(doc, { sizeName: this.sizeName(), colourwayId: this.colourwayId() }) };
    } catch (err) {
      return { error: err instanceof Error ? err.message : String(err) };
    }
  });
  protected readonly plan = computed(() => {
    const p = this.planned();
    return p && 'plan' in p ? p.plan : null;
  });
  protected readonly planError = computed(() => {
    const p = this.planned();
    return p && 'error' in p ? p.error : null;
  });
  protected readonly svg = computed(() => {
    const doc = this.shown();
    const plan = this.plan();
    return doc && plan ? quiltPictureSvg(doc, { plan, colourwayId: null, idPrefix: 'main-', selected: this.canEdit() ? this.chosen() : null }) : null;
  });
  protected readonly cells = computed(() => this.plan()?.cells.map((c) => ({ row: c.row, col: c.col })) ?? []);
  protected readonly pictureLabel = computed(() => {
    const p = this.plan();
    return p ? `Quilt picture, ${this.inches(p.finishedSizeIn.width)} × ${this.inches(p.finishedSizeIn.height)}` : 'Quilt picture';
  });
  protected readonly statusText = this.autosave.statusText;

  constructor() {
    // Take the server's document whenever a revision arrives from outside this tab (first load, reload).
    effect(() => {
      const doc = this.ctx.document();
      const rev = this.ctx.revision();
      untracked(() => {
        if (!doc || this.autosave.dirty()) return;
        if (rev === this.autosave.lastSavedRevision() && this.working()) return;
        this.working.set(doc);
        this.autosave.reset(this.ctx.id(), rev);
      });
    });
  }

  hasUnsavedChanges(): boolean {
    return this.autosave.dirty();
  }

  @HostListener('window:beforeunload', ['$event'])
  protected beforeUnload(event: BeforeUnloadEvent): void {
    if (!this.hasUnsavedChanges()) return;
    this.autosave.flush();
    event.preventDefault();
  }

  /** A change from one of the designer's controls: shown at once, saved after a pause. */
  protected change(doc: PatternDocument): void {
    if (!this.canEdit()) return;
    const before = this.working()?.quilt;
    // Changing the layout's own columns or rows shows the layout, not a named size.
    if (before && doc.quilt && (before.columns !== doc.quilt.columns || before.rows !== doc.quilt.rows)) this.choice.sizeName.set(null);
    this.working.set(doc);
    this.autosave.change(doc);
  }

  /** A change from one of the controls, applied to the newest working document. */
  protected apply(edit: QuiltEdit): void {
    const doc = this.working();
    if (!doc) return;
    const next = edit(doc);
    if (next !== doc) this.change(next);
  }

  protected start(): void {
    const doc = this.working();
    if (doc) this.change(startQuilt(doc));
  }

  protected saveNow(): void {
    this.autosave.flush();
  }

  /** Conflict: show the other revision here (the designer's change is dropped). */
  protected loadTheirs(): void {
    const theirs = this.autosave.conflict();
    if (!theirs) return;
    this.autosave.discard();
    this.working.set(theirs.document);
    this.autosave.reset(this.ctx.id(), theirs.number);
    this.ctx.adopt(theirs.document, theirs.number);
    this.notify.info(`Showing revision ${theirs.number}`);
  }

  /** Conflict: save the designer's document as the newest revision; the other one stays in History. */
  protected saveMineOnTop(): void {
    const theirs = this.autosave.conflict();
    if (theirs) this.autosave.saveOnTopOf(theirs.number);
  }
}
