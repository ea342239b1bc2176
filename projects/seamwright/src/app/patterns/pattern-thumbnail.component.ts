import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/**
 * A small picture of a pattern: the SVG the pattern list carries for the row (drawn by the server),
 * shown as an image, or a plain mark without one.
 */
@Component({
  selector: 'sw-pattern-thumbnail',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (src(); as url) {
      <img class="thumb" [src]="url" [alt]="'Preview of ' + title()" width="48" height="48" />
    } @else {
      <span class="thumb empty" aria-hidden="true"><mat-icon>grid_view</mat-icon></span>
    }
  `,
  styles: `
    .thumb { display: inline-flex; box-sizing: border-box; width: 48px; height: 48px; border-radius: 8px; overflow: hidden; align-items: center;
      justify-content: center; background: var(--mat-sys-surface-container); border: 1px solid var(--sw-card-edge); }
    img.thumb { object-fit: contain; }
    .empty { color: var(--mat-sys-on-surface-variant); }
  `,
})
export class PatternThumbnailComponent {
  /** SVG markup of the picture; without it a plain mark is shown. */
  readonly svg = input<string | null | undefined>(null);
  /** The pattern's title, for the picture's text alternative. */
  readonly title = input('');

  /**
   * A data: URL of the SVG. As an image the SVG runs no script and loads nothing, whatever it holds, so
   * it needs no sanitising into the page (the server writes only numbers and colours into it anyway).
   */
  protected readonly src = computed(() => {
    const svg = this.svg();
    return svg ? `data:image/svg+xml,${encodeURIComponent(svg)}` : null;
  });
}
