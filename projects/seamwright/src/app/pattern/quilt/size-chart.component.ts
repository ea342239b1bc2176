import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { quiltSizes, type PatternDocument, type QuiltSizeRow } from '@seamwright/piecing';
import { showInches, showYards } from '../../core/length-text';
import { QuiltNumberFieldComponent } from './quilt-number-field.component';
import { addSize, removeSize, updateSize, type QuiltEdit } from './quilt-edits';


/**
 * The size chart: each named size's blocks across and down, finished size, block count and yardage per
 * fabric (in the chosen colourway). Designers name, change and remove sizes; everyone chooses the size
 * the cutting list and the print set are for.
 */
@Component({
  selector: 'sw-size-chart',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatRadioModule, QuiltNumberFieldComponent],
  templateUrl: './size-chart.component.html',
  styleUrl: './size-chart.component.scss',
})
export class SizeChartComponent {
  readonly document = input.required<PatternDocument>();
  readonly colourwayId = input<string | null>(null);
  readonly canEdit = input(false);
  /** The size chosen for the cutting list and print set, or null for the layout as laid out. */
  readonly chosenSize = input<string | null>(null);
  /** A change to the pattern, applied by the page to its newest copy (see `QuiltEdit`). */
  readonly edit = output<QuiltEdit>();
  readonly chooseSize = output<string | null>();
  protected readonly inches = showInches;
  protected readonly yards = showYards;

  private readonly chart = computed<{ rows: QuiltSizeRow[] } | { error: string }>(() => {
    try {
      return { rows: quiltSizes(this.document(), { colourwayId: this.colourwayId() }) };
    } catch (err) {
      return { error: err instanceof Error ? err.message : String(err) };
    }
  });
  protected readonly rows = computed(() => {
    const c = this.chart();
    return 'rows' in c ? c.rows : [];
  });
  protected readonly error = computed(() => {
    const c = this.chart();
    return 'error' in c ? c.error : null;
  });
  /** Every fabric any size uses, in the document's order: one column each. */
  protected readonly fabricColumns = computed(() => {
    const used = new Map<string, string>();
    for (const row of this.rows()) for (const f of row.fabrics) if (!used.has(f.id)) used.set(f.id, f.name);
    return [...used].map(([id, name]) => ({ id, name }));
  });
  protected readonly sizes = computed(() => this.document().quilt?.sizes ?? []);

  protected yardsOf(row: QuiltSizeRow, fabricId: string): number | null {
    return row.fabrics.find((f) => f.id === fabricId)?.yards ?? null;
  }

  protected add(): void {
    this.edit.emit((doc) => addSize(doc));
  }

  protected rename(index: number, name: string): void {
    const trimmed = name.trim();
    if (!trimmed || this.sizes().some((s, i) => i !== index && s.name === trimmed)) return;
    const old = this.sizes()[index]?.name;
    this.edit.emit((doc) => ((doc.quilt?.sizes ?? []).some((s, i) => i !== index && s.name === trimmed) ? doc : updateSize(doc, index, { name: trimmed })));
    if (old && old === this.chosenSize()) this.chooseSize.emit(trimmed);
  }

  protected resize(index: number, change: { columns?: number; rows?: number }): void {
    this.edit.emit((doc) => updateSize(doc, index, change));
  }

  protected remove(index: number): void {
    this.edit.emit((doc) => removeSize(doc, index));
  }

  /** Whether a typed name is taken by another size. */
  protected taken(index: number, name: string): boolean {
    return this.sizes().some((s, i) => i !== index && s.name === name.trim());
  }
}
