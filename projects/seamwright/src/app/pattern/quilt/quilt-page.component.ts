import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { PatternContext } from '../pattern-context.service';

/** The Quilt part of the pattern page: the block set into a quilt, its sizes and colourways. */
@Component({
  selector: 'sw-quilt-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `<h2>Quilt</h2>`,
})
export class QuiltPageComponent {
  protected readonly ctx = inject(PatternContext);
}
