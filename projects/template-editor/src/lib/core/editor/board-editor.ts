import { polygonBounds, type Bounds, type PatternDocument, type Point, type Section, type SectionGeometry } from '@seamwright/piecing';
import { SectionAnalysis } from '../analysis/section-analysis';
import { copySections, pasteSections, type SectionClipboard } from '../clipboard/section-clipboard';
import { NUDGE_DIRECTIONS, nudgeSection, nudgeStepIn } from '../commands/nudge-commands';
import { deleteSection, findSection } from '../commands/section-commands';
import { addSeamByValues, addSectionByValues } from '../commands/typed-entry';
import { snapDirectionDeg, snapSweepDeg } from '../snapping/angle-snap';
import { collectSnapTargets, snapPoint, snapToGrid, SnapTargetIndex, type SnapResult, type SnapTarget } from '../snapping/snapping';
import { DocumentStore } from '../store/document-store';
import { createTool } from '../tools/create-tool';
import type { BoardTool, ToolContext, ToolId } from '../tools/tool';
import { fitBounds, panBy, toDocument, toScreen, zoomAt, type Viewport } from '../view/viewport';
import { describeSection, historyMessage, nudgeMessage, selectionMessage } from './board-announcements';
import { DEFAULT_BOARD_SETTINGS, type BoardSettings } from './board-settings';
import { actionFor, TOOL_SHORTCUTS, type BoardKey } from './shortcuts';

/** Pointer details the editor reads (DOM PointerEvent fits). */
export interface BoardPointerInfo {
  button?: number;
  shiftKey?: boolean;
  altKey?: boolean;
}

/** Whether two section lists hold the same section objects in the same order, but for the one with id `exceptId`. */
function sameSectionsBut(a: readonly Section[], b: readonly Section[], exceptId: string | undefined): boolean {
  if (a === b) return true;
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) {
    if (a[i] === b[i]) continue;
    if (exceptId === undefined || a[i].id !== exceptId || b[i].id !== exceptId) return false;
  }
  return true;
}

/** Tools a read-only board keeps. */
const READ_ONLY_TOOLS: ReadonlySet<ToolId> = new Set(['select', 'pan']);

/** Zoom step of the + and − keys. */
const KEY_ZOOM_FACTOR = 1.25;

/** Screen pixels within which the pointer catches a vertex, an edge or a handle. */
const HIT_RADIUS_PX = 8;

/**
 * The Drafting board without a screen: document store, tools, snapping, view and keyboard. The Konva
 * layer and the Angular components feed it screen pointer events and draw what it holds.
 */
export class BoardEditor {
  readonly store: DocumentStore;
  readonly analysis: SectionAnalysis;
  private settingsValue: BoardSettings = { ...DEFAULT_BOARD_SETTINGS };
  private view: Viewport = { scale: 40, originX: 40, originY: 40, mirrored: false, mirrorWidthIn: 0 };
  private size = { width: 800, height: 600 };
  private current: BoardTool;
  private cursorValue: Point | null = null;
  private snapValue: SnapResult | null = null;
  private panning: Point | null = null;
  private clipboard: SectionClipboard | null = null;
  private readOnlyValue = false;
  /**
   * Snap targets of every section but the excluded one, indexed. Kept while those sections stay the
   * same objects: a drag changes only the section it drags, which is the one excluded.
   */
  private targets: { sections: readonly Section[]; exclude: string | undefined; index: SnapTargetIndex } | null = null;
  private edges: { doc: PatternDocument; rings: Point[][] } | null = null;
  private readonly targetCache = new WeakMap<Section, SnapTarget[]>();
  private readonly viewListeners = new Set<() => void>();
  private readonly announceListeners = new Set<(message: string) => void>();
  private readonly ctx: ToolContext;

  constructor(document: PatternDocument) {
    this.store = new DocumentStore(document);
    this.analysis = new SectionAnalysis();
    this.view.mirrorWidthIn = document.canvas.widthIn;
    this.ctx = {
      store: this.store,
      analysis: this.analysis,
      snap: (p, o) => this.snap(p, o?.edges ?? false, o?.excludeSectionId),
      snapGrid: (p) => snapToGrid(p, this.settingsValue.grid),
      snapAngle: (deg, centre, kind) => this.snapAngle(deg, centre, kind),
      snapsToPoints: () => this.settingsValue.snapToPoints,
      hitRadiusIn: () => HIT_RADIUS_PX / this.view.scale,
      activeFabricId: () => this.settingsValue.activeFabricId ?? this.store.document.fabrics[0]?.id ?? null,
      stripWidthsIn: () => this.settingsValue.stripWidthsIn,
      ringCount: () => this.settingsValue.ringCount,
    };
    this.current = createTool('select', this.ctx);
    // Every change of selection (a click, the outline, a key) is said in words; loading is not.
    // (A selection change keeps the store's last origin, so a load is told apart by its new document.)
    let lastSelection = this.store.selection;
    let lastDocument = this.store.document;
    this.store.subscribe((snap) => {
      const loaded = snap.origin === 'load' && snap.document !== lastDocument;
      lastDocument = snap.document;
      if (snap.selection === lastSelection) return;
      lastSelection = snap.selection;
      if (!loaded) this.announce(selectionMessage(snap.document, snap.selection, this.analysis));
    });
  }

  /**
   * Calls `listener` with each message the board's live region should say: what is selected and what
   * each key did ("Section B moved ⅛ in. right"). Returns the function that stops it.
   */
  onAnnounce(listener: (message: string) => void): () => void {
    this.announceListeners.add(listener);
    return () => this.announceListeners.delete(listener);
  }

  /** The active tool. */
  get tool(): BoardTool {
    return this.current;
  }

  /** The board settings. */
  get settings(): BoardSettings {
    return this.settingsValue;
  }

  /** The current view. */
  get viewport(): Viewport {
    return this.view;
  }

  /** Board size in screen pixels. */
  get sizePx(): { width: number; height: number } {
    return this.size;
  }

  /** The pointer position in document inches (snapped as the active tool would), or null off the board. */
  get cursor(): Point | null {
    return this.snapValue?.point ?? this.cursorValue;
  }

  /** What the last pointer position snapped to. */
  get lastSnap(): SnapResult | null {
    return this.snapValue;
  }

  /** Whether the board only shows the pattern (no drawing tools, no changes). */
  get readOnly(): boolean {
    return this.readOnlyValue;
  }

  /** Calls `listener` when the view, tool, settings or cursor change (the store has its own listeners). */
  onViewChange(listener: () => void): () => void {
    this.viewListeners.add(listener);
    return () => this.viewListeners.delete(listener);
  }

  /** Makes the board read-only (or editable again). */
  setReadOnly(readOnly: boolean): void {
    this.readOnlyValue = readOnly;
    if (readOnly && !READ_ONLY_TOOLS.has(this.current.id)) this.setTool('select');
    this.changed();
  }

  /** Switches tool; whatever the old tool had half done is dropped (the renumber tool keeps its numbers). */
  setTool(id: ToolId): void {
    if (this.readOnlyValue && !READ_ONLY_TOOLS.has(id)) return;
    if (id === this.current.id) return;
    this.current.cancel();
    this.current = createTool(id, this.ctx);
    this.changed();
  }

  /** Changes board settings. */
  setSettings(change: Partial<BoardSettings>): void {
    this.settingsValue = { ...this.settingsValue, ...change };
    if (change.mirrored !== undefined && change.mirrored !== this.view.mirrored) {
      this.view = { ...this.view, mirrored: change.mirrored, mirrorWidthIn: this.store.document.canvas.widthIn };
    }
    this.changed();
  }

  /**
   * Tells the editor the board's size in screen pixels. The view keeps its scale and offset: what is
   * under the pointer stays there (only zoom, pan, Fit and opening a pattern move the view).
   */
  setSize(width: number, height: number): void {
    if (width === this.size.width && height === this.size.height) return;
    this.size = { width, height };
    this.changed();
  }

  /** Sets the view directly (restoring a saved view). */
  setViewport(view: Viewport): void {
    this.view = { ...view };
    this.changed();
  }

  /** Bounds of everything drawn: the drawing area and every section with its ring copies. */
  contentBounds(): Bounds {
    const doc = this.store.document;
    const points: Point[] = [
      { x: 0, y: 0 },
      { x: doc.canvas.widthIn, y: doc.canvas.heightIn },
    ];
    for (const s of doc.sections) for (const c of this.analysis.placements(s)) points.push(...this.analysis.outline(c));
    return polygonBounds(points);
  }

  /** Fits the view to the content. */
  fitToContent(marginPx = 40): void {
    this.view = fitBounds({ ...this.view, mirrorWidthIn: this.store.document.canvas.widthIn }, this.contentBounds(), this.size.width, this.size.height, marginPx);
    this.changed();
  }

  /** Zooms by `factor` about a screen point. */
  zoomAt(screen: Point, factor: number): void {
    this.view = zoomAt(this.view, screen, factor);
    this.changed();
  }

  /** The wheel: zoom to the cursor. A pinch on a touchpad comes as a wheel with Ctrl and smaller steps. */
  wheel(screen: Point, deltaY: number, pinch = false): void {
    this.zoomAt(screen, Math.exp(-deltaY * (pinch ? 0.01 : 0.0015)));
  }

  /** Zooms in (factor > 1) or out about the pointer when it is on the board, else about the board's middle. */
  zoomStep(factor: number): void {
    this.zoomAt(this.cursorValue ? toScreen(this.view, this.cursorValue) : { x: this.size.width / 2, y: this.size.height / 2 }, factor);
  }

  /** Pointer pressed at a screen position. */
  pointerDown(screen: Point, info: BoardPointerInfo = {}): void {
    if (info.button === 1 || info.button === 2 || this.current.id === 'pan') {
      this.panning = screen;
      return;
    }
    this.current.pointerDown(this.toolPointer(screen, info));
    this.changed();
  }

  /** Pointer moved to a screen position. */
  pointerMove(screen: Point, info: BoardPointerInfo = {}): void {
    if (this.panning) {
      this.view = panBy(this.view, screen.x - this.panning.x, screen.y - this.panning.y);
      this.panning = screen;
      this.changed();
      return;
    }
    this.current.pointerMove(this.toolPointer(screen, info));
    this.changed();
  }

  /** Pointer released at a screen position. */
  pointerUp(screen: Point, info: BoardPointerInfo = {}): void {
    if (this.panning) {
      this.panning = null;
      return;
    }
    this.current.pointerUp(this.toolPointer(screen, info));
    this.changed();
  }

  /** Pointer left the board. */
  pointerLeave(): void {
    this.cursorValue = null;
    this.snapValue = null;
    this.changed();
  }

  /**
   * A key press; returns whether the board used it (the caller then prevents the default). The keys
   * on the selection (arrows, Delete, Escape) act only when `selectionKeys` is on: when the board
   * itself has focus, not when a key comes from elsewhere in the editor.
   */
  keyDown(e: BoardKey, options: { selectionKeys?: boolean } = {}): boolean {
    if (options.selectionKeys !== false && this.selectionKey(e)) return true;
    const action = actionFor(e);
    if (action) {
      if (action === 'fit') this.fitToContent();
      else if (action === 'zoom-in') this.zoomStep(KEY_ZOOM_FACTOR);
      else if (action === 'zoom-out') this.zoomStep(1 / KEY_ZOOM_FACTOR);
      else if (action === 'undo') this.undo();
      else if (action === 'redo') this.redo();
      else if (action === 'copy') this.copy();
      else if (action === 'paste') this.paste();
      else if (action === 'cut') this.cut();
      return true;
    }
    if (this.current.key(e.key)) {
      this.changed();
      return true;
    }
    if (!e.ctrlKey && !e.metaKey && !e.altKey) {
      const tool = TOOL_SHORTCUTS[e.key.toLowerCase()];
      if (tool) {
        this.setTool(tool);
        return true;
      }
    }
    return false;
  }

  /**
   * Moves the selected section by an arrow key's step (the grid's snap step; with Shift 1 in., or
   * 1 cm on a metric board) as one undo step. Returns whether it moved.
   */
  nudge(key: string, large = false): boolean {
    const id = this.store.selection.sectionId;
    const dir = NUDGE_DIRECTIONS[key];
    const section = id ? findSection(this.store.document, id) : undefined;
    if (this.readOnlyValue || !dir || !section) return false;
    const step = nudgeStepIn(this.settingsValue.grid, this.settingsValue.unit, large);
    this.store.apply(`Move section ${section.label}`, (d) => nudgeSection(d, section.id, key, step));
    this.announce(nudgeMessage(section.label, step, dir.word, this.settingsValue.unit));
    this.changed();
    return true;
  }

  /** Removes the selected section (one undo step); returns whether there was one. */
  deleteSelection(): boolean {
    const id = this.store.selection.sectionId;
    const section = id ? findSection(this.store.document, id) : undefined;
    if (this.readOnlyValue || !section) return false;
    this.store.apply(`Delete section ${section.label}`, (d) => deleteSection(d, section.id));
    this.store.select({ sectionId: null, patchIndex: null });
    this.announce(`Section ${section.label} deleted`);
    this.changed();
    return true;
  }

  /**
   * Adds a section from typed values (one undo step) and selects it; returns the problem in words when
   * the values make none.
   */
  addSectionByValues(geometry: SectionGeometry): { ok: true; sectionId: string } | { ok: false; message: string } {
    if (this.readOnlyValue) return { ok: false, message: 'the board is read-only' };
    const r = addSectionByValues(this.store.document, geometry, this.analysis, this.settingsValue.snapToPoints);
    if (!r.ok) return r;
    this.store.apply(`Add ${geometry.kind} section`, () => r.document);
    this.store.select({ sectionId: r.sectionId, patchIndex: null });
    const added = findSection(this.store.document, r.sectionId);
    if (added) this.announce(`Section ${describeSection(added, this.analysis)} added`);
    this.changed();
    return { ok: true, sectionId: r.sectionId };
  }

  /** Adds a seam from its two typed ends to the selected section (one undo step). */
  addSeamByValues(a: Point, b: Point): { ok: true } | { ok: false; message: string } {
    const id = this.store.selection.sectionId;
    if (this.readOnlyValue) return { ok: false, message: 'the board is read-only' };
    if (!id) return { ok: false, message: 'select a section first' };
    const r = addSeamByValues(this.store.document, id, a, b, this.analysis);
    if (!r.ok) return r;
    this.store.apply('Split patch', () => r.document);
    const s = findSection(this.store.document, id);
    if (s) this.announce(`Seam added: section ${describeSection(s, this.analysis)}`);
    this.changed();
    return { ok: true };
  }

  /** Clears the selection; returns whether there was one. */
  clearSelection(): boolean {
    if (!this.store.selection.sectionId) return false;
    this.store.select({ sectionId: null, patchIndex: null });
    this.changed();
    return true;
  }

  /** Undoes the last step. */
  undo(): void {
    if (this.readOnlyValue) return;
    this.current.cancel();
    const label = this.store.undoLabel;
    this.store.undo();
    this.announce(historyMessage('undo', label));
    this.changed();
  }

  /** Redoes the last undone step. */
  redo(): void {
    if (this.readOnlyValue) return;
    const label = this.store.redoLabel;
    this.store.redo();
    this.announce(historyMessage('redo', label));
    this.changed();
  }

  /**
   * The board's own keys on the selection, while the active tool is idle: arrows nudge, Delete (or
   * Backspace) removes, Escape clears. A tool in the middle of something keeps these keys.
   */
  private selectionKey(e: BoardKey): boolean {
    if (e.ctrlKey || e.metaKey || e.altKey || this.current.state !== 'idle' || this.store.inGesture) return false;
    if (NUDGE_DIRECTIONS[e.key]) return this.nudge(e.key, e.shiftKey ?? false);
    if (e.key === 'Delete' || e.key === 'Backspace') return this.deleteSelection();
    if (e.key === 'Escape') return this.clearSelection();
    return false;
  }

  private announce(message: string): void {
    for (const l of this.announceListeners) l(message);
  }

  /** Copies the selected section. */
  copy(): boolean {
    const id = this.store.selection.sectionId;
    if (!id) return false;
    this.clipboard = copySections(this.store.document, [id]);
    return true;
  }

  /** Copies and removes the selected section. */
  cut(): void {
    const id = this.store.selection.sectionId;
    if (this.readOnlyValue || !id || !this.copy()) return;
    this.store.apply('Cut section', (d) => deleteSection(d, id));
  }

  /** Pastes the copied sections, a little down and right of the originals. */
  paste(): void {
    const clip = this.clipboard;
    if (this.readOnlyValue || !clip || clip.sections.length === 0) return;
    let ids: string[] = [];
    this.store.apply('Paste sections', (d) => {
      const r = pasteSections(d, clip);
      ids = r.sectionIds;
      return r.document;
    });
    if (ids[0]) this.store.select({ sectionId: ids[0], patchIndex: null });
    // Paste again lands one more step along.
    this.clipboard = copySections(this.store.document, ids);
  }

  /** Whether there is something to paste. */
  get canPaste(): boolean {
    return (this.clipboard?.sections.length ?? 0) > 0;
  }

  private toolPointer(screen: Point, info: BoardPointerInfo) {
    const point = toDocument(this.view, screen);
    this.cursorValue = point;
    this.snapValue = this.snap(point, this.current.id === 'split', this.store.inGesture ? this.store.selection.sectionId ?? undefined : undefined);
    return { point, shiftKey: info.shiftKey, altKey: info.altKey };
  }

  private snapAngle(deg: number, centre: Point, kind: 'direction' | 'sweep'): number {
    if (!this.settingsValue.snapAngles) return deg;
    const near = (q: Point) => Math.hypot(q.x - centre.x, q.y - centre.y) < 1e-6;
    const divisions = [this.settingsValue.ringCount];
    for (const s of this.store.document.sections) if (s.ringRepeat && near(s.ringRepeat.centre)) divisions.push(s.ringRepeat.count);
    return kind === 'direction' ? snapDirectionDeg(deg, divisions) : snapSweepDeg(deg, divisions);
  }

  private snap(p: Point, edges: boolean, excludeSectionId?: string): SnapResult {
    const doc = this.store.document;
    if (!this.targets || this.targets.exclude !== excludeSectionId || !sameSectionsBut(this.targets.sections, doc.sections, excludeSectionId)) {
      this.targets = { sections: doc.sections, exclude: excludeSectionId, index: new SnapTargetIndex(collectSnapTargets(doc, excludeSectionId, this.targetCache)) };
    }
    let rings: Point[][] = [];
    if (edges) {
      if (!this.edges || this.edges.doc !== doc) {
        this.edges = { doc, rings: doc.sections.flatMap((s) => this.analysis.patches(s).map((p) => p.polygon)) };
      }
      rings = this.edges.rings;
    }
    return snapPoint(p, this.targets.index, { grid: this.settingsValue.grid, toPoints: this.settingsValue.snapToPoints, radiusIn: HIT_RADIUS_PX / this.view.scale }, rings);
  }

  private changed(): void {
    for (const l of this.viewListeners) l();
  }
}
