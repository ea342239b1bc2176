import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { Listing } from '../shop-types';
import { showYards } from '../../core/length-text';

/** The quilt part of a listing as the server stores it (design §11): size chart and pictures. */
export type ListingQuilt = NonNullable<Listing['quilt']>;

const inches = (v: number) => String(+v.toFixed(2));

/**
 * A listing's quilt: one picture per colourway (the pattern's own fabrics first) with its name, and the
 * size chart. Everything comes from the listing's own columns, drawn by the server when it was saved.
 */
@Component({
  selector: 'sw-listing-quilt',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="quilt" aria-labelledby="listing-quilt-title">
      <h3 id="listing-quilt-title">The quilt</h3>
      <ul class="pictures" aria-label="Colourways">
        @for (p of pictures(); track p.colourwayId) {
          <li>
            <figure>
              <img [src]="p.src" [alt]="p.alt" width="160" height="160" />
              <figcaption>{{ p.name }}</figcaption>
            </figure>
          </li>
        }
      </ul>
      @if (quilt().sizes.length) {
        <table class="sizes">
          <caption>Sizes</caption>
          <thead>
            <tr>
              <th scope="col">Size</th>
              <th scope="col">Finished size</th>
              <th scope="col">Blocks</th>
              <th scope="col">All fabric</th>
            </tr>
          </thead>
          <tbody>
            @for (s of sizes(); track s.name) {
              <tr>
                <th scope="row">{{ s.name }}</th>
                <td>{{ s.finished }}</td>
                <td>{{ s.blockCount }}</td>
                <td>{{ s.yards }}</td>
              </tr>
            }
          </tbody>
        </table>
      }
    </section>
  `,
  styles: `
    .quilt { margin-top: 24px; }
    h3 { margin: 0 0 8px; font: var(--mat-sys-title-medium); }
    .pictures { display: flex; flex-wrap: wrap; gap: 16px; list-style: none; margin: 0; padding: 0; }
    figure { margin: 0; }
    img { display: block; box-sizing: border-box; width: 160px; height: 160px; object-fit: contain; border-radius: 8px;
      background: var(--mat-sys-surface-container); border: 1px solid var(--sw-card-edge); }
    figcaption { margin-top: 4px; font: var(--mat-sys-body-medium); color: var(--mat-sys-on-surface); }
    .sizes { margin-top: 16px; border-collapse: collapse; font: var(--mat-sys-body-medium); }
    .sizes caption { text-align: start; font: var(--mat-sys-title-small); margin-bottom: 4px; }
    .sizes th, .sizes td { padding: 4px 12px 4px 0; text-align: start; border-bottom: 1px solid var(--mat-sys-outline-variant); }
    .sizes td { font-variant-numeric: tabular-nums; }
  `,
})
export class ListingQuiltComponent {
  readonly quilt = input.required<ListingQuilt>();
  /** The pattern's title, for the pictures' text. */
  readonly title = input.required<string>();

  /** Data: URLs of the server's SVG: as images they run no script and load nothing. */
  protected readonly pictures = computed(() =>
    this.quilt().pictures.map((p) => ({
      colourwayId: p.colourwayId,
      name: p.name,
      src: `data:image/svg+xml,${encodeURIComponent(p.svg)}`,
      alt: p.colourwayId === null ? `${this.title()} quilt in the pattern's own fabrics` : `${this.title()} quilt in the ${p.name} colourway`,
    })),
  );

  protected readonly sizes = computed(() =>
    this.quilt().sizes.map((s) => ({
      name: s.name,
      finished: `${inches(s.widthIn)} × ${inches(s.heightIn)} in.`,
      blockCount: s.blockCount,
      yards: showYards(s.totalYards),
    })),
  );
}
