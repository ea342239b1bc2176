import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  ElementRef,
  afterNextRender,
  effect,
  inject,
  input,
  viewChild,
} from '@angular/core';
import { MatDialog } from '@angular/material/dialog';
import { BoardRenderer } from './konva/board-renderer';
import type { BoardHighlight } from '../core/public-api';
import { boardKeysSentence } from '../keyboard-help/board-keys';
import { openKeyboardHelp } from '../keyboard-help/open-keyboard-help';
import { EditorSession } from '../session/editor-session';

let nextBoardId = 0;

/**
 * The Drafting board: a Konva stage showing the session's pattern. Pointer, wheel and key events go
 * to the editor core; the renderer draws what the core holds. The board is one Tab stop named
 * "Drafting board", described by its keys: arrows nudge the selection, Delete removes it, Escape
 * clears it, `?` opens the keyboard help, Tab leaves.
 */
@Component({
  selector: 'sw-drafting-board',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `<div
    #host
    class="board-host"
    role="application"
    aria-label="Drafting board"
    aria-roledescription="drawing board"
    tabindex="0"
    [attr.aria-describedby]="keysId"
    [attr.data-tool]="session.toolId()"
    [attr.data-tool-state]="session.toolState()"
    [attr.data-colourway]="session.shownColourway()?.id ?? null"
    (pointerdown)="onPointerDown($event)"
    (pointermove)="onPointerMove($event)"
    (pointerup)="onPointerUp($event)"
    (pointercancel)="onPointerUp($event)"
    (pointerleave)="onPointerLeave()"
    (keydown)="onKeyDown($event)"
    (contextmenu)="$event.preventDefault()"
  ></div>
  <p class="keys" [id]="keysId">{{ keysText }}</p>`,
  styles: `
    :host { display: block; position: relative; min-height: 0; }
    .board-host { position: absolute; inset: 0; outline: none; touch-action: none; cursor: crosshair; overflow: hidden; }
    .board-host:focus-visible { box-shadow: inset 0 0 0 3px var(--mat-sys-primary); }
    .keys { position: absolute; width: 1px; height: 1px; margin: -1px; padding: 0; overflow: hidden; clip: rect(0 0 0 0); white-space: nowrap; border: 0; }
    .board-host[data-tool='pan'] { cursor: grab; }
    .board-host[data-tool='select'] { cursor: default; }
  `,
})
export class DraftingBoardComponent {
  /** URL of a reference image to trace, shown locked and faded under the drawing. */
  readonly referenceImageUrl = input<string | null | undefined>(null);
  /** Paths and marks to point out over the drawing (e.g. the seam of the join chosen in the joining plan). */
  readonly highlight = input<BoardHighlight | null>(null);

  protected readonly session = inject(EditorSession);
  private readonly dialog = inject(MatDialog);
  /** Id of the hidden text that lists the board's keys (its description). */
  protected readonly keysId = `sw-board-keys-${nextBoardId++}`;
  protected readonly keysText = boardKeysSentence();
  private readonly host = viewChild.required<ElementRef<HTMLDivElement>>('host');
  private renderer?: BoardRenderer;
  private resizeObserver?: ResizeObserver;
  /**
   * Whether the view still has to be fitted to a newly opened pattern (done once the board has a
   * usable size). Nothing else fits the view by itself: resizing keeps scale and offset.
   */
  private fitPending = true;
  /** Pointers pressed on the board, for a two-finger pinch. */
  private readonly touches = new Map<number, { x: number; y: number }>();
  private pinchDistance: number | null = null;

  constructor() {
    afterNextRender(() => {
      const el = this.host().nativeElement;
      const ed = this.session.editor;
      ed.setSize(Math.max(1, el.clientWidth), Math.max(1, el.clientHeight));
      this.renderer = new BoardRenderer(el, ed);
      this.renderer.setReferenceImage(this.referenceImageUrl() ?? null);
      this.renderer.setHighlight(this.highlight());
      this.renderer.setColourway(this.session.shownColourway()?.id ?? null);
      this.fitIfPending();
      el.addEventListener('wheel', this.onWheel, { passive: false });
      this.resizeObserver = new ResizeObserver(() => {
        ed.setSize(Math.max(1, el.clientWidth), Math.max(1, el.clientHeight));
        this.renderer?.resize();
        this.fitIfPending();
      });
      this.resizeObserver.observe(el);
    });
    effect(() => {
      const url = this.referenceImageUrl() ?? null;
      this.session.referenceImageShown.set(url !== null && url !== '');
      this.renderer?.setReferenceImage(url);
    });
    effect(() => {
      const highlight = this.highlight();
      this.renderer?.setHighlight(highlight);
    });
    effect(() => {
      // The colourway chosen in the toolbar: only the fills are drawn again.
      const id = this.session.shownColourway()?.id ?? null;
      this.renderer?.setColourway(id);
    });
    effect(() => {
      // A newly opened document is shown whole, once.
      if (this.session.snapshot().origin === 'load') {
        this.fitPending = true;
        queueMicrotask(() => this.fitIfPending());
      }
    });
    inject(DestroyRef).onDestroy(() => {
      this.resizeObserver?.disconnect();
      this.host().nativeElement.removeEventListener('wheel', this.onWheel);
      this.renderer?.destroy();
    });
  }

  private fitIfPending(): void {
    const ed = this.session.editor;
    if (!this.fitPending || !this.renderer || ed.sizePx.width < 50 || ed.sizePx.height < 50) return;
    this.fitPending = false;
    ed.fitToContent();
  }

  private point(e: MouseEvent): { x: number; y: number } {
    const r = this.host().nativeElement.getBoundingClientRect();
    return { x: e.clientX - r.left, y: e.clientY - r.top };
  }

  protected onPointerDown(e: PointerEvent): void {
    const el = this.host().nativeElement;
    el.focus({ preventScroll: true });
    el.setPointerCapture?.(e.pointerId);
    if (e.pointerType === 'touch') {
      this.touches.set(e.pointerId, this.point(e));
      if (this.touches.size === 2) {
        // A second finger: the gesture becomes a pinch; whatever the first finger began is dropped.
        this.session.editor.tool.cancel();
        this.pinchDistance = this.spread();
        return;
      }
    }
    this.session.editor.pointerDown(this.point(e), { button: e.button, shiftKey: e.shiftKey, altKey: e.altKey });
  }

  protected onPointerMove(e: PointerEvent): void {
    if (this.touches.has(e.pointerId)) this.touches.set(e.pointerId, this.point(e));
    if (this.pinchDistance !== null && this.touches.size === 2) {
      const d = this.spread();
      const [a, b] = [...this.touches.values()];
      if (this.pinchDistance > 0 && d > 0) this.session.editor.zoomAt({ x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 }, d / this.pinchDistance);
      this.pinchDistance = d;
      return;
    }
    this.session.editor.pointerMove(this.point(e), { shiftKey: e.shiftKey, altKey: e.altKey });
  }

  protected onPointerUp(e: PointerEvent): void {
    this.host().nativeElement.releasePointerCapture?.(e.pointerId);
    const wasPinch = this.pinchDistance !== null;
    this.touches.delete(e.pointerId);
    if (wasPinch) {
      if (this.touches.size < 2) this.pinchDistance = null;
      return;
    }
    this.session.editor.pointerUp(this.point(e), { button: e.button, shiftKey: e.shiftKey, altKey: e.altKey });
  }

  private spread(): number {
    const [a, b] = [...this.touches.values()];
    return a && b ? Math.hypot(a.x - b.x, a.y - b.y) : 0;
  }

  protected onPointerLeave(): void {
    this.session.editor.pointerLeave();
  }

  protected onKeyDown(e: KeyboardEvent): void {
    if (e.key === '?' && !e.ctrlKey && !e.metaKey && !e.altKey) {
      e.preventDefault();
      openKeyboardHelp(this.dialog);
      return;
    }
    // Tab always leaves the board (no keyboard trap).
    if (e.key === 'Tab') return;
    if (this.session.editor.keyDown(e)) e.preventDefault();
  }

  private readonly onWheel = (e: WheelEvent): void => {
    e.preventDefault();
    this.session.editor.wheel(this.point(e), e.deltaY, e.ctrlKey);
  };
}
