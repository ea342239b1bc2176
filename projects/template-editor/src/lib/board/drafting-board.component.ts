import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  ElementRef,
  afterNextRender,
  inject,
  input,
  viewChild,
} from '@angular/core';
import Konva from 'konva';

/** The Drafting board: a Konva stage the designer draws sections on. */
@Component({
  selector: 'sw-drafting-board',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `<div #host class="board-host" role="img" aria-label="Drafting board"></div>`,
  styles: `:host { display: block; } .board-host { width: 100%; height: 100%; min-height: 320px; }`,
})
export class DraftingBoardComponent {
  /** Board width in CSS pixels. */
  readonly widthPx = input(640);
  /** Board height in CSS pixels. */
  readonly heightPx = input(480);

  private readonly host = viewChild.required<ElementRef<HTMLDivElement>>('host');
  private stage?: Konva.Stage;

  constructor() {
    afterNextRender(() => {
      this.stage = new Konva.Stage({ container: this.host().nativeElement, width: this.widthPx(), height: this.heightPx() });
      this.stage.add(new Konva.Layer());
    });
    inject(DestroyRef).onDestroy(() => this.stage?.destroy());
  }
}
