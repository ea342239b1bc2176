import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/** The cautions of the product (docs/design-notes.md#cautions), by topic. */
export type CautionTopic = 'print' | 'cutter' | 'iron' | 'freezer-paper';

const CAUTIONS: Record<CautionTopic, { icon: string; title: string; text: string }> = {
  print: {
    icon: 'straighten',
    title: 'Print at 100 % / actual size',
    text: 'Turn off "fit to page" and measure the test square on every sheet before cutting any fabric.',
  },
  cutter: {
    icon: 'content_cut',
    title: 'Rotary cutters are very sharp',
    text: 'Close the blade every time you put the cutter down, and cut away from your body.',
  },
  iron: {
    icon: 'local_fire_department',
    title: 'Irons are hot',
    text: 'Starch and steam burn. Press, do not iron back and forth, and keep the cord out of the way.',
  },
  'freezer-paper': {
    icon: 'print_disabled',
    title: 'Freezer paper and laser printers',
    text: "Freezer paper in a laser printer can melt its coating onto the fuser: check the printer's manual. Most quilters use an inkjet printer.",
  },
};

/** A short block of cautions for the screen it sits on (print and cutting screens). */
@Component({
  selector: 'sw-cautions',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <aside class="cautions sw-print-block" aria-label="Cautions">
      <h2 class="title"><mat-icon aria-hidden="true">warning</mat-icon>Before you start</h2>
      <ul>
        @for (c of items(); track c.title) {
          <li><mat-icon aria-hidden="true">{{ c.icon }}</mat-icon><span><strong>{{ c.title }}.</strong> {{ c.text }}</span></li>
        }
      </ul>
    </aside>
  `,
  styles: `
    .cautions { border-left: 4px solid var(--sw-caution-edge); background: var(--sw-caution-bg); color: var(--sw-caution-fg); border-radius: 8px; padding: 8px 16px; margin: 24px 0 8px; max-width: 900px; }
    .title { display: flex; align-items: center; gap: 8px; font: var(--mat-sys-title-medium); margin: 4px 0 8px; }
    ul { list-style: none; margin: 0; padding: 0; }
    li { display: flex; gap: 10px; align-items: flex-start; padding: 4px 0; }
    li mat-icon { flex: none; font-size: 20px; width: 20px; height: 20px; margin-top: 1px; }
    @media print { .cautions { background: none; color: #000; border-left-color: #000; } }
  `,
})
export class CautionsComponent {
  /** Which cautions to show, in this order. */
  readonly which = input<CautionTopic[]>(['print', 'cutter', 'iron', 'freezer-paper']);
  protected readonly items = computed(() => this.which().map((t) => CAUTIONS[t]));
}
