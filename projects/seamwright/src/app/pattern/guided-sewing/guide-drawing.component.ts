import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { drawingView, type GuideDrawing } from './guide-drawing';

/**
 * A step's picture in plain SVG from the piecing library's patches: the patch to place outlined thick
 * and marked "here", sewn patches ticked, the line to sew dashed, matching marks as rings. The words in
 * `label` say the same for those who do not see the picture.
 */
@Component({
  selector: 'sw-guide-drawing',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @let v = view();
    <svg [attr.viewBox]="v.viewBox" role="img" [attr.aria-label]="label()" preserveAspectRatio="xMidYMid meet">
      @for (s of v.shapes; track $index) {
        <polygon [attr.points]="s.points" [attr.fill]="s.fill ?? 'none'" [class]="'shape ' + s.state" />
      }
      @for (l of v.lines; track $index) {
        <polyline [attr.points]="l" class="sew-under" />
        <polyline [attr.points]="l" class="sew" />
      }
      @for (m of v.marks; track $index) {
        <circle [attr.cx]="m.x" [attr.cy]="m.y" [attr.r]="v.markRadius" class="mark" />
      }
      @for (s of v.shapes; track $index) {
        @if (s.label) {
          <text [attr.x]="s.x" [attr.y]="s.y" [attr.font-size]="v.fontSize" [class]="'text ' + s.state" text-anchor="middle" dominant-baseline="central">{{ s.label }}</text>
        }
      }
    </svg>
  `,
  styles: `
    :host { display: block; }
    svg { width: 100%; height: 100%; max-height: 60vh; display: block; }
    .shape { stroke: var(--mat-sys-outline); stroke-width: 1.5px; vector-effect: non-scaling-stroke; }
    .shape.todo { fill: var(--mat-sys-surface-container-high); }
    .shape.done { opacity: 0.75; }
    .shape.context { opacity: 0.25; }
    .shape.current { stroke: var(--mat-sys-primary); stroke-width: 5px; stroke-dasharray: none; }
    .sew-under { fill: none; stroke: var(--mat-sys-surface); stroke-width: 9px; vector-effect: non-scaling-stroke; stroke-linecap: round; }
    .sew { fill: none; stroke: var(--mat-sys-error); stroke-width: 5px; stroke-dasharray: 10 5; vector-effect: non-scaling-stroke; stroke-linecap: round; }
    .mark { fill: var(--mat-sys-surface); stroke: var(--mat-sys-tertiary); stroke-width: 3px; vector-effect: non-scaling-stroke; }
    .text { fill: var(--mat-sys-on-surface); stroke: var(--mat-sys-surface); stroke-width: 3px; paint-order: stroke; vector-effect: non-scaling-stroke; font-family: Roboto, sans-serif; }
    .text.current { font-weight: 700; }
  `,
})
export class GuideDrawingComponent {
  /** What to draw. */
  readonly drawing = input.required<GuideDrawing>();
  /** The picture in words. */
  readonly label = input.required<string>();
  protected readonly view = computed(() => drawingView(this.drawing()));
}
