import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { DomSanitizer, SafeHtml } from '@angular/platform-browser';
import { MatIconModule } from '@angular/material/icon';
import type { PatternDocument } from '@seamwright/piecing';

type Renderer = (doc: PatternDocument) => string | null;
/** The preview renderer pulls in the geometry library: fetched once, after the list is on screen. */
let renderer: Promise<Renderer> | null = null;
const loadRenderer = () => (renderer ??= import('./preview-svg').then((m) => m.previewSvg));

/** A small picture of a pattern (drawn by the board's preview renderer), or a plain mark without a document. */
@Component({
  selector: 'sw-pattern-thumbnail',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (svg(); as markup) {
      <span class="thumb" role="img" [attr.aria-label]="'Preview of ' + title()" [innerHTML]="markup"></span>
    } @else {
      <span class="thumb empty" aria-hidden="true"><mat-icon>grid_view</mat-icon></span>
    }
  `,
  styles: `
    .thumb { display: inline-flex; width: 48px; height: 48px; border-radius: 8px; overflow: hidden; align-items: center; justify-content: center;
      background: var(--mat-sys-surface-container); border: 1px solid var(--sw-card-edge); }
    .thumb ::ng-deep svg { width: 100%; height: 100%; }
    .empty { color: var(--mat-sys-on-surface-variant); }
  `,
})
export class PatternThumbnailComponent {
  /** The document to draw; without one a plain mark is shown. */
  readonly document = input<PatternDocument | undefined>();
  /** The pattern's title, for the picture's label. */
  readonly title = input('');
  private readonly sanitizer = inject(DomSanitizer);
  private readonly render = signal<Renderer | null>(null);

  constructor() {
    loadRenderer().then(
      (r) => this.render.set(r),
      () => undefined,
    );
  }

  protected readonly svg = computed<SafeHtml | null>(() => {
    const doc = this.document();
    const render = this.render();
    const markup = doc && render ? render(doc) : null;
    // The renderer builds the markup from a validated document with svg.js: no user HTML passes through.
    return markup ? this.sanitizer.bypassSecurityTrustHtml(markup) : null;
  });
}
