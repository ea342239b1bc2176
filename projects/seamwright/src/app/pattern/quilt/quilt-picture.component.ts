import { ChangeDetectionStrategy, Component, ElementRef, computed, effect, input, output, viewChild } from '@angular/core';

/** A block position of the quilt, as the library numbers it (design §11: rows of block centres on point). */
export interface CellRef {
  row: number;
  col: number;
}

/**
 * Shows a quilt picture (SVG text from the piecing library's `quiltPictureSvg`) inline. When `selectable`, the picture is one
 * Tab stop: arrow keys move the chosen block, a click chooses the block under the pointer, and the
 * chosen one is said in words beside it.
 */
@Component({
  selector: 'sw-quilt-picture',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (selectable()) {
      <div #drawing class="drawing selectable" tabindex="0" role="group" [attr.aria-label]="label() + ' — arrow keys choose a block'"
        [attr.aria-describedby]="statusId" (click)="pick($event)" (keydown)="onKey($event)"></div>
      <p class="status" [id]="statusId" aria-live="polite">{{ chosenText() }}</p>
    } @else {
      <div #drawing class="drawing"></div>
    }
  `,
  styles: `
    :host { display: block; }
    .drawing { line-height: 0; }
    .drawing ::ng-deep svg { width: 100%; height: auto; max-height: var(--sw-quilt-picture-max-height, 70vh); display: block; }
    .selectable { cursor: pointer; border-radius: 4px; }
    .selectable:focus-visible { outline: 3px solid var(--mat-sys-primary); outline-offset: 3px; }
    .status { margin: 4px 0 0; color: var(--mat-sys-on-surface-variant); font: var(--mat-sys-body-medium); }
  `,
})
export class QuiltPictureComponent {
  private static next = 0;
  /** The picture, as SVG text. */
  readonly svg = input.required<string>();
  /** What the picture shows, in words (its accessible name when it can be chosen from). */
  readonly label = input('Quilt picture');
  /** Whether a block can be chosen (designers). */
  readonly selectable = input(false);
  /** Block positions in the order the library lists them. */
  readonly cells = input<readonly CellRef[]>([]);
  /** The chosen block. */
  readonly chosen = input<CellRef | null>(null);
  readonly chosenChange = output<CellRef>();
  protected readonly statusId = `quilt-picture-status-${QuiltPictureComponent.next++}`;
  private readonly drawing = viewChild<ElementRef<HTMLElement>>('drawing');
  protected readonly chosenText = computed(() => {
    const c = this.chosen();
    return c ? `Chosen block: row ${c.row + 1}, position ${c.col + 1}` : 'No block chosen: click one or use the arrow keys';
  });

  constructor() {
    effect(() => {
      const el = this.drawing()?.nativeElement;
      // Our own SVG text (every value escaped in quiltPictureSvg); set directly so Angular keeps the SVG.
      if (el) el.innerHTML = this.svg().replace(/^<\?xml[^>]*>\s*/, '');
    });
  }

  protected pick(event: MouseEvent): void {
    const target = (event.target as Element | null)?.closest('[data-row][data-col]');
    if (!target) return;
    this.chosenChange.emit({ row: Number(target.getAttribute('data-row')), col: Number(target.getAttribute('data-col')) });
  }

  /** Arrows: left and right along a row, up and down to the nearest block of the row above or below. */
  protected onKey(event: KeyboardEvent): void {
    const cells = this.cells();
    if (!cells.length) return;
    const at = this.chosen() ?? cells[0];
    const rows = [...new Set(cells.map((c) => c.row))].sort((a, b) => a - b);
    const inRow = (row: number) => cells.filter((c) => c.row === row).sort((a, b) => a.col - b.col);
    let next: CellRef | undefined;
    const row = inRow(at.row);
    const i = row.findIndex((c) => c.col === at.col);
    switch (event.key) {
      case 'ArrowLeft':
        next = row[Math.max(0, i - 1)];
        break;
      case 'ArrowRight':
        next = row[Math.min(row.length - 1, i + 1)];
        break;
      case 'ArrowUp':
      case 'ArrowDown': {
        const r = rows[rows.indexOf(at.row) + (event.key === 'ArrowUp' ? -1 : 1)];
        if (r === undefined) break;
        const other = inRow(r);
        next = other[Math.min(other.length - 1, Math.max(0, at.col))];
        break;
      }
      case 'Home':
        next = cells[0];
        break;
      case 'End':
        next = cells[cells.length - 1];
        break;
      default:
        return;
    }
    event.preventDefault();
    if (next) this.chosenChange.emit({ row: next.row, col: next.col });
  }
}
