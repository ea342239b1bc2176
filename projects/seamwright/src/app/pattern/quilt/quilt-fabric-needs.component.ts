import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { QuiltPlan } from '@seamwright/piecing';
import { showInches, showYards } from '../../core/length-text';

/**
 * The whole quilt's fabric, from the library's quilt plan: what to buy of each fabric (blocks, setting
 * pieces, borders, binding, backing; rounded up to ⅛ yd), then the borders (sides first, then top and
 * bottom, measured through the centre), binding, backing and batting (common practice, design §11).
 */
@Component({
  selector: 'sw-quilt-fabric-needs',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @let p = plan();
    <section class="quilt sw-print-block" aria-labelledby="quilt-needs-title">
      <h2 id="quilt-needs-title">Whole quilt{{ p.sizeName ? ' — ' + p.sizeName : '' }}: {{ inches(p.finishedSizeIn.width) }} × {{ inches(p.finishedSizeIn.height) }}</h2>
      <p class="sw-muted">{{ p.blockCount }} {{ p.blockCount === 1 ? 'block' : 'blocks' }} ({{ p.columns }} × {{ p.rows }}, {{ p.setting === 'on-point' ? 'on point' : 'straight' }}) · {{ yards(p.totalYards) }} of fabric in all</p>
      <table class="needs">
        <caption class="sw-sr-only">Fabric to buy for the whole quilt</caption>
        <thead><tr><th scope="col">Fabric</th><th scope="col">Buy</th><th scope="col">For</th></tr></thead>
        <tbody>
          @for (f of p.fabrics; track f.id) {
            <tr>
              <th scope="row"><span class="swatch" [style.background]="f.colour" aria-hidden="true"></span>{{ f.name }}</th>
              <td><strong>{{ yards(f.yards) }}</strong></td>
              <td>
                @if (f.blocksIn > 0) { <span>blocks</span> }
                @for (g of f.settingPieces; track $index) { <span>{{ g.count }} × {{ g.use }} {{ inches(g.widthIn) }} × {{ inches(g.lengthIn) }}</span> }
                @if (f.borderStrips > 0) { <span>{{ f.borderStrips }} border {{ f.borderStrips === 1 ? 'strip' : 'strips' }}</span> }
                @if (f.bindingStrips > 0) { <span>{{ f.bindingStrips }} binding {{ f.bindingStrips === 1 ? 'strip' : 'strips' }}</span> }
                @if (f.backingIn > 0) { <span>backing</span> }
              </td>
            </tr>
          }
        </tbody>
      </table>
      @if (p.borders.length) {
        <h3>Borders</h3>
        <ol>
          @for (b of p.borders; track b.index) {
            <li>
              {{ inches(b.widthIn) }} finished: cut {{ b.strips }} {{ b.strips === 1 ? 'strip' : 'strips' }} {{ inches(b.cutWidthIn) }} × WOF, joined end to end ({{ b.joins }} {{ b.joins === 1 ? 'join' : 'joins' }});
              sides first, 2 × {{ inches(b.sides.cutLengthIn) }}, then top and bottom, 2 × {{ inches(b.topAndBottom.cutLengthIn) }}
            </li>
          }
        </ol>
      }
      <h3>Binding, backing and batting</h3>
      <ul>
        <li>Binding: {{ p.binding.strips }} strips {{ inches(p.binding.stripWidthIn) }} × WOF, {{ inches(p.binding.lengthIn) }} joined</li>
        <li>Backing: {{ inches(p.backing.widthIn) }} × {{ inches(p.backing.heightIn) }}, {{ p.backing.widths }} {{ p.backing.widths === 1 ? 'width' : 'widths' }}{{ p.backing.seams === 'none' ? ', no seam' : ', seamed ' + (p.backing.seams === 'across' ? 'across' : 'lengthwise') }}, {{ yards(p.backing.yards) }}</li>
        <li>Batting: {{ inches(p.batting.width) }} × {{ inches(p.batting.height) }}</li>
      </ul>
    </section>
  `,
  styles: `
    .quilt { border: 1px solid var(--sw-card-edge, var(--mat-sys-outline-variant)); border-radius: 12px; padding: 8px 16px 12px; margin-bottom: 16px; overflow-x: auto; }
    h2 { font: var(--mat-sys-title-large); margin: 8px 0 4px; }
    h3 { font: var(--mat-sys-title-small); margin: 12px 0 4px; }
    .needs { border-collapse: collapse; }
    .needs th, .needs td { text-align: left; padding: 4px 12px 4px 0; border-bottom: 1px solid var(--mat-sys-outline-variant); vertical-align: top; }
    .needs td span + span::before { content: ' · '; }
    .swatch { display: inline-block; width: 14px; height: 14px; border-radius: 3px; border: 1px solid var(--mat-sys-outline); margin-right: 8px; vertical-align: middle; -webkit-print-color-adjust: exact; print-color-adjust: exact; }
  `,
})
export class QuiltFabricNeedsComponent {
  readonly plan = input.required<QuiltPlan>();
  protected readonly inches = showInches;
  protected readonly yards = showYards;
}
