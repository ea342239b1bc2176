import { DestroyRef, Injectable, computed, inject, signal } from '@angular/core';
import { readPatternDocument, type PatternDocument } from '@seamwright/piecing';
import {
  BoardEditor,
  OrderSearchRunner,
  applyFoundOrder,
  findSection,
  type BoardOrderSearch,
  type BoardSettings,
  type DocumentUpdate,
  type EditorSnapshot,
  type ToolId,
} from '../core/public-api';

const PLACEHOLDER = readPatternDocument({ formatVersion: 1, title: 'Untitled pattern', canvas: { widthIn: 12, heightIn: 12 } });

/**
 * One editing session of a pattern, shared by the board, toolbar, panels and list of one
 * `<sw-pattern-editor>`: the framework-free {@link BoardEditor} with its state mirrored into signals.
 * Components read the signals and change things only through the named methods.
 */
@Injectable()
export class EditorSession {
  /** The editor core. */
  readonly editor = new BoardEditor(PLACEHOLDER);
  private readonly snapshotState = signal<EditorSnapshot>(this.editor.store.snapshot());
  private readonly viewTick = signal(0);

  /** The store's latest state. */
  readonly snapshot = this.snapshotState.asReadonly();
  /** The current document. */
  readonly document = computed(() => this.snapshotState().document);
  /** The current selection. */
  readonly selection = computed(() => this.snapshotState().selection);
  /** Whether the document has changes not yet saved. */
  readonly dirty = computed(() => this.snapshotState().dirty);
  /** Whether there is a step to undo. */
  readonly canUndo = computed(() => this.snapshotState().canUndo);
  /** Whether there is a step to redo. */
  readonly canRedo = computed(() => this.snapshotState().canRedo);
  /** The selected section, if any. */
  readonly selectedSection = computed(() => {
    const id = this.selection().sectionId;
    return id ? findSection(this.document(), id) ?? null : null;
  });
  /** The selected section's derived patches. */
  readonly selectedPatches = computed(() => {
    const s = this.selectedSection();
    return s ? this.editor.analysis.patches(s) : [];
  });
  /** The selected section's sewability. */
  readonly selectedSewability = computed(() => {
    const s = this.selectedSection();
    return s ? this.editor.analysis.sewability(s) : null;
  });
  /** Problems with the selected section's seams, in words. */
  readonly selectedProblems = computed(() => {
    const s = this.selectedSection();
    return s ? this.editor.analysis.problems(s) : [];
  });
  /** Board settings. */
  readonly settings = computed<BoardSettings>(() => (this.viewTick(), this.editor.settings));
  /** The active tool's id. */
  readonly toolId = computed<ToolId>(() => (this.viewTick(), this.editor.tool.id));
  /** The active tool's state name. */
  readonly toolState = computed(() => (this.viewTick(), this.editor.tool.state));
  /** What the active tool asks for next. */
  readonly toolHint = computed(() => (this.viewTick(), this.editor.tool.hint));
  /** The pointer position in inches (snapped), or null. */
  readonly cursor = computed(() => (this.viewTick(), this.editor.cursor));
  /** Whether the board is read-only. */
  readonly readOnly = computed(() => (this.viewTick(), this.editor.readOnly));
  /** The last order search's outcome when it found no order (for the suggested split). */
  readonly lastOrderSearch = signal<{ sectionId: string; result: BoardOrderSearch } | null>(null);
  /** Whether an order search is running (in the board's worker). */
  readonly orderSearching = signal(false);
  /** Order searches run in a Web Worker, so a long one never blocks the page. */
  private readonly orderSearch = new OrderSearchRunner();

  constructor() {
    inject(DestroyRef).onDestroy(() => this.orderSearch.dispose());
    this.editor.store.subscribe((s) => this.snapshotState.set(s));
    this.editor.onViewChange(() => this.viewTick.update((n) => n + 1));
  }

  /**
   * The colourway the board shows, chosen in the toolbar, or null for the pattern's own fabrics. View
   * state only: choosing one never changes the document and makes no undo step. The four-blocks panel
   * follows it unless changed there.
   */
  readonly colourwayId = signal<string | null>(null);
  /** The colourway the board shows, or null (also when the chosen one is no longer in the pattern). */
  readonly shownColourway = computed(() => {
    const id = this.colourwayId();
    return id === null ? null : (this.document().colourways?.find((c) => c.id === id) ?? null);
  });

  /** Whether the board shows a reference image (the toolbar then offers its fading). */
  readonly referenceImageShown = signal(false);

  /** Opens a document (not recorded; the history starts empty). */
  load(document: PatternDocument): void {
    this.editor.store.load(document);
    this.lastOrderSearch.set(null);
    this.orderSearch.cancel();
    this.orderSearching.set(false);
  }

  /** Runs a named command as one undo step. */
  apply(label: string, update: DocumentUpdate): void {
    if (this.editor.readOnly) return;
    this.editor.store.apply(label, update);
  }

  /** Switches tool. */
  setTool(id: ToolId): void {
    this.editor.setTool(id);
  }

  /** Changes board settings. */
  setSettings(change: Partial<BoardSettings>): void {
    this.editor.setSettings(change);
  }

  /** Undoes the last step. */
  undo(): void {
    this.editor.undo();
  }

  /** Redoes the last undone step. */
  redo(): void {
    this.editor.redo();
  }

  /** Fits the view to the drawing. */
  fit(): void {
    this.editor.fitToContent();
  }

  /** Zooms in (factor > 1) or out about the middle of the board. */
  zoom(factor: number): void {
    this.editor.zoomStep(factor);
  }

  /**
   * Searches a sewable order of the selected section (in the worker) and, when the answer comes,
   * applies the order found or keeps the reason and the suggested split. An answer is dropped when
   * the pattern changed while the search ran (it was about a section that is no longer there as it
   * was) or when another search started after it.
   */
  applySewableOrder(): void {
    const s = this.selectedSection();
    if (!s || this.editor.readOnly) return;
    const asked = this.document();
    this.orderSearching.set(true);
    this.orderSearch.search(s, (result) => {
      this.orderSearching.set(false);
      if (this.document() !== asked || this.editor.readOnly) return;
      if (result.ok) this.editor.store.apply('Apply sewable order', (d) => applyFoundOrder(d, s.id, result, this.editor.analysis));
      this.lastOrderSearch.set({ sectionId: s.id, result });
    });
  }

}
