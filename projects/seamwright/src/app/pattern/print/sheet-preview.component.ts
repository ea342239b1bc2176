import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { PlannedSheet } from '@seamwright/piecing';

/** One planned sheet, drawn small: margins, header, test squares and where each template print lands. */
@Component({
  selector: 'sw-sheet-preview',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @let s = sheet();
    @let f = s.frame;
    <figure class="sheet">
      <svg [attr.viewBox]="'0 0 ' + f.widthIn + ' ' + f.heightIn" role="img" [attr.aria-label]="'Sheet ' + s.pageNumber + ': sections ' + s.sectionLabels.join(', ')">
        <rect class="paper" x="0" y="0" [attr.width]="f.widthIn" [attr.height]="f.heightIn" />
        <rect class="margin" [attr.x]="f.printable.x" [attr.y]="f.printable.y" [attr.width]="f.printable.width" [attr.height]="f.printable.height" />
        <rect class="header" [attr.x]="f.header.x" [attr.y]="f.header.y" [attr.width]="f.header.width" [attr.height]="f.header.height" />
        <rect class="test" [attr.x]="f.testBlock.x" [attr.y]="f.testBlock.y" width="1" height="1" />
        @for (p of s.placements; track $index) {
          <g>
            <rect class="print" [attr.x]="p.rect.x" [attr.y]="p.rect.y" [attr.width]="p.rect.width" [attr.height]="p.rect.height" />
            <text class="label" [attr.x]="p.rect.x + p.rect.width / 2" [attr.y]="p.rect.y + p.rect.height / 2" text-anchor="middle" dominant-baseline="middle"
              [attr.font-size]="labelSize(p.rect.width, p.rect.height)">{{ p.sectionLabel }}@if (p.tile) {·{{ p.tile.row }},{{ p.tile.column }}}</text>
          </g>
        }
      </svg>
      <figcaption>Sheet {{ s.pageNumber }} · {{ s.sectionLabels.join(', ') }}</figcaption>
    </figure>
  `,
  styles: `
    .sheet { margin: 0; width: 150px; }
    svg { width: 100%; height: auto; display: block; filter: drop-shadow(0 1px 2px rgba(0,0,0,.25)); }
    .paper { fill: #fff; }
    .margin { fill: none; stroke: #c9bfb6; stroke-width: 0.03; stroke-dasharray: 0.1 0.08; }
    .header { fill: #efe6ea; }
    .test { fill: none; stroke: #222; stroke-width: 0.03; }
    .print { fill: #f3dcea; stroke: #5b2a54; stroke-width: 0.04; }
    .label { fill: #3a1435; font-family: Roboto, sans-serif; font-weight: 700; }
    figcaption { font-size: 0.8rem; margin-top: 4px; color: var(--mat-sys-on-surface-variant); }
  `,
})
export class SheetPreviewComponent {
  /** The sheet to draw. */
  readonly sheet = input.required<PlannedSheet>();

  protected labelSize(w: number, h: number): number {
    return Math.max(0.25, Math.min(1, Math.min(w, h) / 3));
  }
}
