import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import type { PatternDocument } from '@seamwright/piecing';
import { QuiltChoice } from './quilt-choice.service';

/**
 * The quilter's choice of quilt size and colourway before the cutting list and the print set: the
 * same choice as on the Quilt tab (one per open pattern). Shows only what the pattern offers.
 */
@Component({
  selector: 'sw-quilt-choice-bar',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatFormFieldModule, MatSelectModule],
  template: `
    @if (sizes().length) {
      <mat-form-field appearance="outline" subscriptSizing="dynamic">
        <mat-label>Quilt size</mat-label>
        <mat-select [value]="sizeName() ?? ''" (selectionChange)="choice.sizeName.set($event.value || null)">
          <mat-option value="">As laid out ({{ layoutText() }})</mat-option>
          @for (s of sizes(); track s.name) { <mat-option [value]="s.name">{{ s.name }} ({{ s.columns }} × {{ s.rows }})</mat-option> }
        </mat-select>
      </mat-form-field>
    }
    @if (colourways().length) {
      <mat-form-field appearance="outline" subscriptSizing="dynamic">
        <mat-label>Colourway</mat-label>
        <mat-select [value]="colourwayId() ?? ''" (selectionChange)="choice.colourwayId.set($event.value || null)">
          <mat-option value="">The pattern's own fabrics</mat-option>
          @for (c of colourways(); track c.id) { <mat-option [value]="c.id">{{ c.name }}</mat-option> }
        </mat-select>
      </mat-form-field>
    }
  `,
  styles: `:host { display: flex; flex-wrap: wrap; gap: 8px; } mat-form-field { width: 240px; }`,
})
export class QuiltChoiceBarComponent {
  protected readonly choice = inject(QuiltChoice);
  readonly document = input.required<PatternDocument>();
  protected readonly sizes = computed(() => this.document().quilt?.sizes ?? []);
  protected readonly colourways = computed(() => this.document().colourways ?? []);
  protected readonly layoutText = computed(() => {
    const q = this.document().quilt;
    return q ? `${q.columns} × ${q.rows}` : '';
  });
  protected readonly sizeName = computed(() => chosenSize(this.document(), this.choice.sizeName()));
  protected readonly colourwayId = computed(() => chosenColourway(this.document(), this.choice.colourwayId()));
}

/** The chosen size's name when the pattern still has it, else null (the layout as laid out). */
export function chosenSize(doc: PatternDocument | null, name: string | null): string | null {
  return name && doc?.quilt?.sizes.some((s) => s.name === name) ? name : null;
}

/** The chosen colourway's id when the pattern still has it, else null (its own fabrics). */
export function chosenColourway(doc: PatternDocument | null, id: string | null): string | null {
  return id && doc?.colourways?.some((c) => c.id === id) ? id : null;
}
