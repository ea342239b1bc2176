import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { Listing } from './shop-types';

/**
 * The picture of a design in the shop (drawn by the server when the listing was saved), or a plain
 * mark when the listing has no picture yet. The finished size is in the text beside it (listingFacts).
 */
@Component({
  selector: 'sw-listing-picture',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'sw-listing-picture', '[style.--sw-picture-size.px]': 'sizePx()' },
  template: `
    @if (src(); as url) {
      <img [src]="url" [alt]="'Picture of the design ' + listing().title" />
    } @else {
      <span class="empty" role="img" [attr.aria-label]="'No picture of ' + listing().title + ' yet'"><mat-icon aria-hidden="true">grid_view</mat-icon></span>
    }
  `,
  styles: `
    :host { display: block; }
    img, .empty { box-sizing: border-box; width: var(--sw-picture-size); height: var(--sw-picture-size); border-radius: 8px;
      background: var(--mat-sys-surface-container); border: 1px solid var(--sw-card-edge); }
    img { object-fit: contain; }
    .empty { display: inline-flex; align-items: center; justify-content: center; color: var(--mat-sys-on-surface-variant); }
  `,
})
export class ListingPictureComponent {
  readonly listing = input.required<Pick<Listing, 'title' | 'preview'>>();
  /** Side of the square the picture fits in, CSS pixels. */
  readonly sizePx = input(160);

  /** A data: URL of the SVG: as an image it runs no script and loads nothing (the server writes only numbers and colours). */
  protected readonly src = computed(() => {
    const svg = this.listing().preview;
    return svg ? `data:image/svg+xml,${encodeURIComponent(svg)}` : null;
  });
}
