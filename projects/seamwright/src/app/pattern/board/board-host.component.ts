import { ChangeDetectionStrategy, Component, DestroyRef, ElementRef, inject, input, output, viewChild } from '@angular/core';
import type { PatternDocument } from '@seamwright/piecing';
import { EditorSession, PatternEditorComponent, TraceImagePanelComponent, toDocument, type DocumentUpdate } from '@seamwright/template-editor';

/**
 * Where the drafting board's editor sits on the page. The editor comes from
 * '@seamwright/template-editor'; only the board and history routes load it (and Konva).
 */
@Component({
  selector: 'sw-board-host',
  imports: [PatternEditorComponent, TraceImagePanelComponent],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (session(); as s) {
      @if (!readOnly() && s.document().referenceImage) {
        <section class="trace" aria-label="Trace image"><sw-trace-image-panel [session]="s" /></section>
      }
    }
    <sw-pattern-editor class="editor" [document]="document()" [readOnly]="readOnly()" [referenceImageUrl]="referenceImageUrl()" (documentChange)="documentChange.emit($event)" />
  `,
  host: { '(keydown.escape)': 'tracePanel()?.cancelScale()' },
  styles: `
    :host { display: block; }
    .trace { border-bottom: 1px solid var(--sw-card-edge, var(--mat-sys-outline-variant)); background: var(--mat-sys-surface-container-low); color: var(--mat-sys-on-surface); }
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
  /** The editor's editing session (provided by the editor component; read from its injector). */
  protected readonly session = viewChild(PatternEditorComponent, { read: EditorSession });
  protected readonly tracePanel = viewChild(TraceImagePanelComponent);
  private pickPointer: number | null = null;

  constructor() {
    // Capture phase: the pick must see the click before the board's own tool does.
    const el = inject<ElementRef<HTMLElement>>(ElementRef).nativeElement;
    const down = (e: PointerEvent) => this.pickOnBoard(e);
    const up = (e: PointerEvent) => this.swallowPickRelease(e);
    el.addEventListener('pointerdown', down, { capture: true });
    el.addEventListener('pointerup', up, { capture: true });
    inject(DestroyRef).onDestroy(() => {
      el.removeEventListener('pointerdown', down, { capture: true });
      el.removeEventListener('pointerup', up, { capture: true });
    });
  }

  /** Tells the editor its document is stored (clears its unsaved mark). */
  markSaved(): void {
    this.editor()?.markSaved();
  }

  /** Runs a named command in the editor as one undo step; returns whether the editor took it. */
  apply(label: string, update: DocumentUpdate): boolean {
    const session = this.session();
    if (!session || this.readOnly()) return false;
    session.apply(label, update);
    return true;
  }

  /**
   * While the trace panel waits for scale points, a click on the board is a picked point (in the
   * board's inches), not an action of the board's tool.
   */
  private pickOnBoard(e: PointerEvent): void {
    const panel = this.tracePanel();
    const session = this.session();
    const board = (e.target as Element | null)?.closest<HTMLElement>('[role=application][aria-label="Drafting board"]');
    if (!panel?.picking() || !session || !board || e.button !== 0) return;
    e.stopPropagation();
    e.preventDefault();
    this.pickPointer = e.pointerId;
    const r = board.getBoundingClientRect();
    panel.pickAt(toDocument(session.editor.viewport, { x: e.clientX - r.left, y: e.clientY - r.top }));
  }

  private swallowPickRelease(e: PointerEvent): void {
    if (e.pointerId !== this.pickPointer) return;
    this.pickPointer = null;
    e.stopPropagation();
  }
}
