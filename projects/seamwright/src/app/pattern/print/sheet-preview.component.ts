import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { PlannedSheet, Point, SheetPlacement } from '@seamwright/piecing';
import type { PreviewTemplate } from './print-preview-plan';
import { SHEET_PREVIEW_PX, labelFontIn, placeSheetLabel } from './sheet-label-fit';

/**
 * One planned sheet, drawn small from the print layout: margins, header, test squares, and each
 * template print (cutting line, sewing line, seams) placed by the layout's own transform.
 */
@Component({
  selector: 'sw-sheet-preview',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @let s = sheet();
    @let f = s.frame;
    <figure class="sheet" [style.width.px]="widthPx">
      <svg [attr.viewBox]="'0 0 ' + f.widthIn + ' ' + f.heightIn" role="img" [attr.aria-label]="'Sheet ' + s.pageNumber + ': sections ' + s.sectionLabels.join(', ')">
        <defs>
          @for (p of s.placements; track $index) {
            <clipPath [attr.id]="clipId($index)"><rect [attr.x]="p.rect.x" [attr.y]="p.rect.y" [attr.width]="p.rect.width" [attr.height]="p.rect.height" /></clipPath>
          }
        </defs>
        <rect class="paper" x="0" y="0" [attr.width]="f.widthIn" [attr.height]="f.heightIn" />
        <rect class="margin" [attr.x]="f.printable.x" [attr.y]="f.printable.y" [attr.width]="f.printable.width" [attr.height]="f.printable.height" />
        <rect class="header" [attr.x]="f.header.x" [attr.y]="f.header.y" [attr.width]="f.header.width" [attr.height]="f.header.height" />
        <rect class="test" [attr.x]="f.testBlock.x" [attr.y]="f.testBlock.y" width="1" height="1" />
        @for (p of s.placements; track $index) {
          @let t = templates().get(p.templateId);
          @if (t) {
            <g [attr.clip-path]="'url(#' + clipId($index) + ')'">
              <g [attr.transform]="matrix(p.transform)">
                <polygon class="cut" [attr.points]="points(t.cuttingLine)" />
                <polygon class="sew" [attr.points]="points(t.sewingLine)" />
                @for (seam of t.seams; track $index) {
                  <line class="seam" [attr.x1]="seam.a.x" [attr.y1]="seam.a.y" [attr.x2]="seam.b.x" [attr.y2]="seam.b.y" />
                }
              </g>
            </g>
          } @else {
            <rect class="print" [attr.x]="p.rect.x" [attr.y]="p.rect.y" [attr.width]="p.rect.width" [attr.height]="p.rect.height" />
          }
        }
        <!-- Labels last, so no print covers another's label; each keeps its size and moves out if it must. -->
        @for (l of labels(); track $index) {
          @if (l.leader; as ln) { <line class="leader" [attr.x1]="ln.x1" [attr.y1]="ln.y1" [attr.x2]="ln.x2" [attr.y2]="ln.y2" /> }
          <text class="label" [attr.x]="l.x" [attr.y]="l.y" [attr.font-size]="fontIn()"><title>{{ l.full }}</title>{{ l.text }}</text>
        }
      </svg>
      <figcaption>Sheet {{ s.pageNumber }} · {{ s.sectionLabels.join(', ') }}</figcaption>
    </figure>
  `,
  styles: `
    /* A fixed width: label sizes are worked out from it (sheet-label-fit.ts). */
    .sheet { margin: 0; flex: none; }
    svg { width: 100%; height: auto; display: block; overflow: visible; box-shadow: 0 1px 3px rgba(0,0,0,.3); }
    .paper { fill: #fff; }
    .margin { fill: none; stroke: #c9bfb6; stroke-width: 0.03; stroke-dasharray: 0.1 0.08; }
    .header { fill: #efe6ea; }
    .test { fill: none; stroke: #222; stroke-width: 0.03; }
    .print { fill: #f3dcea; stroke: #5b2a54; stroke-width: 0.04; }
    .cut { fill: #f7ecf2; stroke: #5b2a54; stroke-width: 0.04; stroke-dasharray: 0.12 0.06; }
    .sew { fill: none; stroke: #3a1435; stroke-width: 0.035; }
    .seam { stroke: #3a1435; stroke-width: 0.03; }
    /* The sheet is paper, white in both themes; a white halo keeps a label readable over lines. */
    .label { fill: #3a1435; font-family: Roboto, sans-serif; font-weight: 700; paint-order: stroke; stroke: #fff; stroke-width: 0.08; stroke-linejoin: round; }
    .leader { stroke: #3a1435; stroke-width: 0.03; }
    figcaption { font-size: 0.8rem; margin-top: 6px; color: var(--mat-sys-on-surface-variant); }
  `,
})
export class SheetPreviewComponent {
  /** The sheet to draw. */
  readonly sheet = input.required<PlannedSheet>();
  /** The lines of the print templates, by id, as the layout was planned from. */
  readonly templates = input<ReadonlyMap<string, PreviewTemplate>>(new Map());
  protected readonly widthPx = SHEET_PREVIEW_PX;
  private static next = 0;
  private readonly uid = `sw-sheet-${SheetPreviewComponent.next++}`;

  /** Label size in sheet inches: renders at the readable minimum on the fixed-width preview. */
  protected readonly fontIn = computed(() => labelFontIn(this.sheet().frame.widthIn));
  protected readonly labels = computed(() => this.sheet().placements.map((p) => placeSheetLabel(p, this.fontIn())));

  protected clipId(i: number): string {
    return `${this.uid}-${i}`;
  }

  /** The layout's transform written as an SVG matrix (same six numbers, same order). */
  protected matrix(m: SheetPlacement['transform']): string {
    return `matrix(${m.a} ${m.b} ${m.c} ${m.d} ${m.e} ${m.f})`;
  }


  protected points(ring: readonly Point[]): string {
    return ring.map((p) => `${p.x},${p.y}`).join(' ');
  }
}
