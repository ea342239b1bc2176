import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import { MAX_SIZE_IN, type PatternDocument, type QuiltCell, type QuiltLayout } from '@seamwright/piecing';
import { QuiltNumberFieldComponent } from './quilt-number-field.component';
import { addBorder, cellAt, removeBorder, updateBorder, updateCell, updateQuilt, type CellChange, type QuiltEdit } from './quilt-edits';
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
  /** A change to the pattern, applied by the page to its newest copy (see `QuiltEdit`). */
  readonly edit = output<QuiltEdit>();
  protected readonly maxBlocks = MAX_BLOCKS;
  protected readonly maxLength = MAX_SIZE_IN;
  protected readonly turns = [0, 90, 180, 270] as const;
  protected readonly quilt = computed(() => this.document().quilt as QuiltLayout);
  protected readonly fabrics = computed(() => this.document().fabrics);
  protected readonly cell = computed<QuiltCell | null>(() => {
    const c = this.chosen();
    return c ? cellAt(this.quilt(), c.row, c.col) : null;
  });

  protected set(change: Partial<QuiltLayout> | ((quilt: QuiltLayout) => Partial<QuiltLayout> | null)): void {
    this.edit.emit((doc) => {
      if (!doc.quilt) return doc;
      const c = typeof change === 'function' ? change(doc.quilt) : change;
      return c ? updateQuilt(doc, c) : doc;
    });
  }

  /** Changes the chosen block (a change worked out from the block as it is when the page applies it). */
  protected setCell(change: CellChange | ((cell: QuiltCell) => CellChange)): void {
    const c = this.chosen();
    if (!c) return;
    this.edit.emit((doc) => (doc.quilt ? updateCell(doc, c.row, c.col, typeof change === 'function' ? change(cellAt(doc.quilt, c.row, c.col)) : change) : doc));
  }

  /** A quarter turn clockwise more. */
  protected turnChosen(): void {
    this.setCell((cell) => ({ rotateDeg: (((cell.rotateDeg ?? 0) + 90) % 360) as 0 | 90 | 180 | 270 }));
  }

  protected setSashing(on: boolean): void {
    const first = this.fabrics()[0]?.id;
    if (!on) this.set({ sashing: undefined });
    else if (first) this.set({ sashing: { widthIn: 2, fabricId: first } });
  }

  protected setSashingField(change: Partial<NonNullable<QuiltLayout['sashing']>>): void {
    this.set((quilt) => {
      if (!quilt.sashing) return null;
      const next = { ...quilt.sashing, ...change };
      if (!next.cornerstoneFabricId) delete next.cornerstoneFabricId;
      return { sashing: next };
    });
  }

  protected addBorder(): void {
    this.edit.emit((doc) => addBorder(doc));
  }

  protected setBorder(index: number, change: { widthIn?: number; fabricId?: string }): void {
    this.edit.emit((doc) => updateBorder(doc, index, change));
  }

  protected removeBorder(index: number): void {
    this.edit.emit((doc) => removeBorder(doc, index));
  }

  protected setBinding(change: Partial<QuiltLayout['binding']>): void {
    this.set((quilt) => ({ binding: { ...quilt.binding, ...change } }));
  }

  protected setBacking(change: Partial<QuiltLayout['backing']>): void {
    this.set((quilt) => ({ backing: { ...quilt.backing, ...change } }));
  }
}
