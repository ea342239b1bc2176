import { ChangeDetectionStrategy, Component, input, output, viewChild } from '@angular/core';
import type { PatternDocument } from '@seamwright/piecing';
import { PatternEditorComponent } from '@seamwright/template-editor';

/**
 * Where the drafting board's editor sits on the page. The editor comes from
 * '@seamwright/template-editor'; only the board and history routes load it (and Konva).
 */
@Component({
  selector: 'sw-board-host',
  imports: [PatternEditorComponent],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `<sw-pattern-editor class="editor" [document]="document()" [readOnly]="readOnly()" [referenceImageUrl]="referenceImageUrl()" (documentChange)="documentChange.emit($event)" />`,
  styles: `
    :host { display: block; }
    /* The editor lays itself out (a grid of a definite height); only its height is chosen here. */
    .editor { height: max(560px, calc(100vh - 260px)); }
    /* The editor paints its own light surfaces; in the dark theme use the theme's instead. */
    :host-context(html.sw-dark) ::ng-deep sw-pattern-editor { background: var(--mat-sys-surface) !important; }
    :host-context(html.sw-dark) ::ng-deep sw-pattern-editor .side {
      background: var(--mat-sys-surface-container-low) !important;
      border-left-color: var(--sw-card-edge) !important;
    }
  `,
})
export class BoardHostComponent {
  /** The document to open; a new object loads it into the editor (and clears its undo history). */
  readonly document = input.required<PatternDocument>();
  /** Whether the board only shows the design. */
  readonly readOnly = input(false);
  /** Address of the image traced under the drawing, if any. */
  readonly referenceImageUrl = input<string | null>(null);
  /** Every change made on the board (a drag emits once, at its end). */
  readonly documentChange = output<PatternDocument>();
  private readonly editor = viewChild(PatternEditorComponent);

  /** Tells the editor its document is stored (clears its unsaved mark). */
  markSaved(): void {
    this.editor()?.markSaved();
  }
}
