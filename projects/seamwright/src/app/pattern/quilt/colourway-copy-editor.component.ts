import { ChangeDetectionStrategy, Component, computed, inject, input, linkedSignal, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import type { ColourwayCopy, ColourwayCopyFabric } from '@seamwright/api';
import type { PatternDocument } from '@seamwright/piecing';
import { toApiError } from '../../core/api-error';
import { ColourwayCopiesService } from './colourway-copies.service';
import { QuiltChoice } from './quilt-choice.service';

/** One fabric slot as the editor shows it: the document's fabric and the copy's choice for it. */
interface SlotRow {
  fabricId: string;
  /** The pattern's own name for the slot. */
  slotName: string;
  fabric: ColourwayCopyFabric;
}

/**
 * Changes to the signed-in quilter's own colourway copy: its name and, for each fabric slot of the
 * pattern, a fabric name, colour and note. Saved on top of the copy's version; when the copy changed
 * elsewhere (409) the newer copy is loaded and the quilter is told to make the change again.
 */
@Component({
  selector: 'sw-colourway-copy-editor',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule],
  template: `
    <section class="copy-edit" aria-labelledby="copy-edit-title">
      <h3 id="copy-edit-title">My copy: {{ copy().name }}</h3>
      <p class="sw-muted hint">Only you see this copy. The cutting list, yardage and print set follow it while it is chosen.</p>
      <mat-form-field appearance="outline" subscriptSizing="dynamic" class="name">
        <mat-label>Name of my copy</mat-label>
        <input matInput [value]="name()" maxlength="80" (input)="name.set($any($event.target).value)" (keydown.enter)="saveOnEnter($event)" />
      </mat-form-field>
      @for (row of rows(); track row.fabricId) {
        <div class="slot" role="group" [attr.aria-label]="'Fabric slot ' + row.slotName">
          <span class="slot-name"><span class="swatch" [style.background]="row.fabric.colour" aria-hidden="true"></span>{{ row.slotName }}</span>
          <mat-form-field appearance="outline" subscriptSizing="dynamic">
            <mat-label>My fabric for {{ row.slotName }}</mat-label>
            <input matInput [value]="row.fabric.name" maxlength="80" (input)="setSlot(row.fabricId, { name: $any($event.target).value })" (keydown.enter)="saveOnEnter($event)" />
          </mat-form-field>
          <label class="colour">
            <span class="sw-sr-only">Colour of my fabric for {{ row.slotName }}</span>
            <input type="color" [value]="row.fabric.colour" (input)="setSlot(row.fabricId, { colour: $any($event.target).value })" />
          </label>
          <mat-form-field appearance="outline" subscriptSizing="dynamic">
            <mat-label>Note for {{ row.slotName }}</mat-label>
            <input matInput [value]="row.fabric.note ?? ''" maxlength="200" (input)="setSlot(row.fabricId, { note: $any($event.target).value })" (keydown.enter)="saveOnEnter($event)" />
          </mat-form-field>
        </div>
      }
      @if (problem(); as p) { <p class="problem" role="alert">{{ p }}</p> }
      @if (status(); as s) { <p class="sw-muted" role="status">{{ s }}</p> }
      <div class="actions">
        <button mat-flat-button type="button" [disabled]="busy() || !name().trim()" (click)="save()"><mat-icon aria-hidden="true">save</mat-icon>Save my copy</button>
        <button mat-stroked-button type="button" [disabled]="busy()" (click)="remove()"><mat-icon aria-hidden="true">delete</mat-icon>Delete my copy</button>
        <button mat-button type="button" (click)="closed.emit()">Close</button>
      </div>
    </section>
  `,
  styles: `
    :host { display: block; }
    .copy-edit { border: 1px solid var(--mat-sys-outline-variant); border-radius: 12px; padding: 12px 16px; margin-top: 12px; max-width: 820px; }
    h3 { font: var(--mat-sys-title-medium); margin: 0 0 4px; }
    .hint { margin: 0 0 12px; }
    .name { width: 320px; max-width: 100%; margin-bottom: 8px; }
    .slot { display: grid; grid-template-columns: minmax(110px, 1fr) minmax(160px, 2fr) auto minmax(140px, 2fr); gap: 8px; align-items: center; margin: 6px 0; }
    .slot-name { display: flex; align-items: center; gap: 6px; }
    .swatch { width: 16px; height: 16px; border-radius: 3px; border: 1px solid var(--mat-sys-outline); }
    .colour input { width: 48px; height: 40px; border: 1px solid var(--mat-sys-outline); border-radius: 6px; padding: 2px; background: var(--mat-sys-surface); cursor: pointer; }
    .colour input:focus-visible { outline: 3px solid var(--mat-sys-primary); outline-offset: 2px; }
    .problem { color: var(--mat-sys-error); }
    .actions { display: flex; flex-wrap: wrap; gap: 8px; margin-top: 8px; }
  `,
})
export class ColourwayCopyEditorComponent {
  private readonly service = inject(ColourwayCopiesService);
  private readonly choice = inject(QuiltChoice);
  readonly patternId = input.required<string>();
  readonly copy = input.required<ColourwayCopy>();
  readonly document = input.required<PatternDocument>();
  readonly closed = output<void>();

  /** The name being typed; back to the copy's own whenever a newer copy arrives. */
  protected readonly name = linkedSignal(() => this.copy().name);
  /** The fabric slots being changed; back to the copy's own whenever a newer copy arrives. */
  private readonly fabrics = linkedSignal<Record<string, ColourwayCopyFabric>>(() => ({ ...this.copy().fabrics }));
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly status = signal<string | null>(null);

  /** Every fabric slot of the pattern, with the copy's choice (or the pattern's own fabric). */
  protected readonly rows = computed<SlotRow[]>(() => {
    const chosen = this.fabrics();
    return this.document().fabrics.map((f) => ({ fabricId: f.id, slotName: f.name, fabric: chosen[f.id] ?? { name: f.name, colour: f.colour } }));
  });

  protected setSlot(fabricId: string, change: Partial<ColourwayCopyFabric>): void {
    const row = this.rows().find((r) => r.fabricId === fabricId);
    if (!row) return;
    this.fabrics.update((all) => ({ ...all, [fabricId]: { ...row.fabric, ...change } }));
    this.status.set(null);
  }

  /** Enter in a text field saves the copy (and never submits a form the editor sits in, such as the print options). */
  protected saveOnEnter(event: Event): void {
    event.preventDefault();
    if (!this.busy() && this.name().trim()) this.save();
  }

  protected save(): void {
    const copy = this.copy();
    // Every slot the pattern has now, each with a name (an emptied name keeps the one saved before).
    const fabrics: Record<string, ColourwayCopyFabric> = {};
    for (const row of this.rows()) {
      const name = row.fabric.name.trim() || copy.fabrics[row.fabricId]?.name || row.slotName;
      const note = row.fabric.note?.trim();
      fabrics[row.fabricId] = { name, colour: row.fabric.colour, ...(note ? { note } : {}) };
    }
    this.busy.set(true);
    this.problem.set(null);
    this.service.update(this.patternId(), copy.id, copy.version, { name: this.name().trim(), fabrics }).subscribe({
      next: (saved) => {
        this.busy.set(false);
        this.choice.keep(saved);
        this.status.set(`Saved “${saved.name}”.`);
      },
      error: (err: unknown) => {
        this.busy.set(false);
        const e = toApiError(err);
        const latest = (e.details as { latest?: ColourwayCopy } | null)?.latest;
        if (e.status === 409 && latest) {
          this.choice.keep(latest);
          this.problem.set('This copy was changed in another window or tab. Its latest version is shown now: make your change again and save.');
        } else this.problem.set(`Not saved: ${e.message}`);
      },
    });
  }

  protected remove(): void {
    const copy = this.copy();
    this.busy.set(true);
    this.service.delete(this.patternId(), copy.id).subscribe({
      next: () => {
        this.busy.set(false);
        this.choice.forget(copy.id);
        this.closed.emit();
      },
      error: (err: unknown) => {
        this.busy.set(false);
        this.problem.set(`Not deleted: ${toApiError(err).message}`);
      },
    });
  }
}
