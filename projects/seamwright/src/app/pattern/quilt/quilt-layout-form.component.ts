import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import { MAX_SIZE_IN, type PatternDocument, type QuiltCell, type QuiltLayout } from '@seamwright/piecing';
import { QuiltNumberFieldComponent } from './quilt-number-field.component';
import { addBorder, cellAt, removeBorder, updateBorder, updateCell, updateQuilt } from './quilt-edits';
import type { CellRef } from './quilt-picture.component';

/** Most blocks across or down (the document's own limit, design §11). */
const MAX_BLOCKS = 100;

/**
 * The designer's controls of the quilt layout: setting, blocks across and down, the chosen block's turn,
 * mirroring and plain block, sashing, borders, binding and backing. Every change goes out as a new
 * document; nothing here keeps its own copy of the layout.
 */
@Component({
  selector: 'sw-quilt-layout-form',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatButtonToggleModule, MatCheckboxModule, MatFormFieldModule, MatIconModule, MatSelectModule, QuiltNumberFieldComponent],
  templateUrl: './quilt-layout-form.component.html',
  styleUrl: './quilt-layout-form.component.scss',
})
export class QuiltLayoutFormComponent {
  /** The pattern with its quilt layout (the working copy, unsaved changes included). */
  readonly document = input.required<PatternDocument>();
  /** The block chosen on the picture. */
  readonly chosen = input<CellRef | null>(null);
  readonly documentChange = output<PatternDocument>();
  protected readonly maxBlocks = MAX_BLOCKS;
  protected readonly maxLength = MAX_SIZE_IN;
  protected readonly turns = [0, 90, 180, 270] as const;
  protected readonly quilt = computed(() => this.document().quilt as QuiltLayout);
  protected readonly fabrics = computed(() => this.document().fabrics);
  protected readonly cell = computed<QuiltCell | null>(() => {
    const c = this.chosen();
    return c ? cellAt(this.quilt(), c.row, c.col) : null;
  });

  protected set(change: Partial<QuiltLayout>): void {
    this.documentChange.emit(updateQuilt(this.document(), change));
  }

  protected setCell(change: Partial<Pick<QuiltCell, 'rotateDeg' | 'mirrored' | 'alternate'>>): void {
    const c = this.chosen();
    if (c) this.documentChange.emit(updateCell(this.document(), c.row, c.col, change));
  }

  /** A quarter turn clockwise more. */
  protected turnChosen(): void {
    const now = this.cell()?.rotateDeg ?? 0;
    this.setCell({ rotateDeg: ((now + 90) % 360) as 0 | 90 | 180 | 270 });
  }

  protected setSashing(on: boolean): void {
    const first = this.fabrics()[0]?.id;
    if (!on) this.set({ sashing: undefined });
    else if (first) this.set({ sashing: { widthIn: 2, fabricId: first } });
  }

  protected setSashingField(change: Partial<NonNullable<QuiltLayout['sashing']>>): void {
    const s = this.quilt().sashing;
    if (!s) return;
    const next = { ...s, ...change };
    if (!next.cornerstoneFabricId) delete next.cornerstoneFabricId;
    this.set({ sashing: next });
  }

  protected addBorder(): void {
    this.documentChange.emit(addBorder(this.document()));
  }

  protected setBorder(index: number, change: { widthIn?: number; fabricId?: string }): void {
    this.documentChange.emit(updateBorder(this.document(), index, change));
  }

  protected removeBorder(index: number): void {
    this.documentChange.emit(removeBorder(this.document(), index));
  }

  protected setBinding(change: Partial<QuiltLayout['binding']>): void {
    this.set({ binding: { ...this.quilt().binding, ...change } });
  }

  protected setBacking(change: Partial<QuiltLayout['backing']>): void {
    this.set({ backing: { ...this.quilt().backing, ...change } });
  }
}
