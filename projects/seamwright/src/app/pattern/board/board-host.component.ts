import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import type { PatternDocument } from '@seamwright/piecing';

/**
 * Where the drafting board's editor sits on the page. The editor comes from
 * '@seamwright/template-editor'; this route's chunk is the only one that loads it (and Konva).
 */
@Component({
  selector: 'sw-board-host',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="host" role="region" aria-label="Drafting board">
      <p>{{ document().sections.length }} sections on a {{ document().canvas.widthIn }} × {{ document().canvas.heightIn }} in. drawing area.</p>
    </div>
  `,
  styles: `.host { min-height: 480px; border: 1px solid var(--sw-card-edge); border-radius: 12px; padding: 16px; }`,
})
export class BoardHostComponent {
  /** The document to show and edit. */
  readonly document = input.required<PatternDocument>();
  /** Whether the board only shows the design. */
  readonly readOnly = input(false);
  /** Every change made on the board. */
  readonly documentChange = output<PatternDocument>();
}
