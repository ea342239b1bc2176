import { ChangeDetectionStrategy, Component, DestroyRef, ElementRef, effect, inject, input, viewChild } from '@angular/core';
import { SVG, type Svg } from '@svgdotjs/svg.js';
import { stripSetDisplayName, type CuttingListStripSet } from '@seamwright/piecing';
import { showInches } from '../../core/length-text';

/** Pixels per inch of the drawing (the picture scales to its box; this only sets proportions). */
const PX_PER_IN = 12;

/**
 * A strip set drawn with svg.js: the cut strips sewn side by side, the seams, and where the sub-cuts
 * fall along the sewn set. Colours are the pattern's fabric colours.
 */
@Component({
  selector: 'sw-strip-diagram',
  changeDetection: ChangeDetectionStrategy.OnPush,
  // The drawing never shrinks below 560 px, where its 11-unit text renders at 9 px (684 units wide);
  // on a narrower screen it scrolls sideways inside its own box, which takes focus for the keys.
  template: `<div class="scroll" tabindex="0" role="group" [attr.aria-label]="'Diagram of ' + name()"><div #host class="diagram" role="img" [attr.aria-label]="label()"></div></div>`,
  styles: `
    .scroll { max-width: 100%; overflow-x: auto; }
    .diagram { max-width: 640px; min-width: 560px; }
    .diagram ::ng-deep svg { width: 100%; height: auto; display: block; }
  `,
})
export class StripDiagramComponent {
  /** The strip set to draw. */
  readonly stripSet = input.required<CuttingListStripSet>();
  /** Colour and name of each fabric, by id. */
  readonly fabrics = input.required<ReadonlyMap<string, { name: string; colour: string }>>();
  /** Usable width of fabric the set is sewn across, inches. */
  readonly wofIn = input(42);
  private readonly host = viewChild.required<ElementRef<HTMLDivElement>>('host');
  private svg: Svg | null = null;

  protected name(): string {
    return stripSetDisplayName(this.stripSet().name, this.stripSet().patchLabels);
  }

  protected label(): string {
    const s = this.stripSet();
    const strips = s.strips.map((st) => `${this.fabrics().get(st.fabricId)?.name ?? st.fabricId} cut ${showInches(st.cutWidthIn)}`).join(', ');
    return `${stripSetDisplayName(s.name, s.patchLabels)}: ${strips}; ${s.subCutsPerSet} sub-cuts of ${showInches(s.subCutLengthIn)} from each sewn set`;
  }

  constructor() {
    effect(() => this.draw(this.stripSet(), this.fabrics(), this.wofIn()));
    inject(DestroyRef).onDestroy(() => this.svg?.remove());
  }

  private draw(set: CuttingListStripSet, fabrics: ReadonlyMap<string, { name: string; colour: string }>, wofIn: number): void {
    this.svg?.remove();
    const margin = 4 * PX_PER_IN;
    const labelRoom = 11 * PX_PER_IN;
    const length = wofIn * PX_PER_IN;
    const totalCut = set.strips.reduce((s, st) => s + st.cutWidthIn, 0);
    const height = totalCut * PX_PER_IN;
    const width = labelRoom + length + margin;
    const svg = SVG().addTo(this.host().nativeElement).viewbox(0, 0, width, height + 3 * PX_PER_IN);
    this.svg = svg;
    let y = 0;
    set.strips.forEach((st) => {
      const h = st.cutWidthIn * PX_PER_IN;
      const f = fabrics.get(st.fabricId);
      svg.rect(length, h).move(labelRoom, y).fill(f?.colour ?? '#cccccc').stroke({ color: '#3a2b33', width: 1 });
      svg
        .plain(`${f?.name ?? st.fabricId} · cut ${showInches(st.cutWidthIn)}`)
        .font({ family: 'Roboto, sans-serif', size: 11 })
        .fill('currentColor')
        .move(0, y + h / 2 - 7);
      y += h;
    });
    // Sewn seams sit a seam allowance in from each joint (drawn dashed on the joint for clarity).
    let joint = 0;
    set.strips.slice(0, -1).forEach((st) => {
      joint += st.cutWidthIn * PX_PER_IN;
      svg.line(labelRoom, joint, labelRoom + length, joint).stroke({ color: '#000', width: 1.5, dasharray: '6 3' });
    });
    // Sub-cuts across the sewn set.
    const step = set.subCutLengthIn * PX_PER_IN;
    for (let i = 1; i <= set.subCutsPerSet && i * step <= length + 0.01; i++) {
      svg.line(labelRoom + i * step, -2, labelRoom + i * step, height + 2).stroke({ color: '#a3262a', width: 1.5 });
    }
    svg
      .plain(`${set.subCutsPerSet} sub-cuts of ${showInches(set.subCutLengthIn)} across ${showInches(wofIn)}`)
      .font({ family: 'Roboto, sans-serif', size: 11 })
      .fill('currentColor')
      .move(labelRoom, height + 8);
  }
}
