import Konva from 'konva';
import { applyColourway, type Fabric, type PatternDocument, type Point, type Section } from '@seamwright/piecing';
import { sectionHandles, toDocument, toScreen, type BoardEditor, type BoardHighlight, type ToolPreview } from '../../core/public-api';
import { BOARD_COLOURS } from './board-colours';
import { createGridShape, createRulerShape, RULER_PX, type GridView } from './grid-shape';
import { createSectionPainter, createSectionShape, type SectionPainter, type SectionView } from './section-shape';

interface SectionEntry {
  section: Section;
  /** Draws the section (a static one is drawn by the static layer's one shape). */
  paint: SectionPainter;
  /** The section's own shape on the active layer (null for a static section). */
  node: Konva.Shape | null;
  active: boolean;
  /** Seam allowance the shape was made with (fabrics only restyle a shape, read at each draw). */
  settings: string;
  /** The selected patch the shape shows (active sections only). */
  patchIndex: number | null;
  /** The render pass that last saw the section in the document. */
  pass: number;
}

/** Screen pixels around the board within which sections are still drawn (strokes reach past outlines). */
const CULL_MARGIN_PX = 16;
/**
 * Time a render may spend checking the sewability of static sections before drawing them; sections
 * past it are drawn at once and checked afterwards in slices of {@link CHECK_SLICE_MS}, and those that
 * fail are drawn again with their failing patch. A small pattern is checked whole before its first draw.
 */
const SYNC_CHECK_BUDGET_MS = 25;
const CHECK_SLICE_MS = 8;

/**
 * A layer whose stage-sized canvas is made only when {@link ensureCanvas} first asks for it: making
 * one (allocating its bitmap) costs tens of milliseconds, which a first draw with nothing on this layer
 * need not pay. Until then it is 0 × 0 and draws nothing.
 */
class OnDemandLayer extends Konva.Layer {
  private wanted = { width: 0, height: 0 };
  private made = false;

  override _setSize(size: { width: number; height: number }): this {
    this.wanted = size;
    return this.made ? super._setSize(size) : this;
  }

  /** Gives the layer its canvas at the stage's size (once). */
  ensureCanvas(): void {
    if (this.made) return;
    this.made = true;
    super._setSize(this.wanted);
  }

  /** Whether the canvas has been made. */
  get hasCanvas(): boolean {
    return this.made;
  }
}

/**
 * Draws a {@link BoardEditor} on a Konva stage of three layers (each layer is a stage-sized canvas,
 * costly to make, so the first draw makes only the base): the base (grid in screen space, reference
 * image, the static sections drawn by one shape in document order, and the rulers), the active section
 * (selected or being dragged, kept inside the rulers; its canvas made at the first selection) and the
 * overlay (its canvas made once something is on it: a selection, the pointer, a tool preview, a
 * highlight). Each section has a painter that draws its patches, lines and numbers straight onto the
 * canvas; a section's painter is made again only when its object changed, and only the layers that
 * changed are redrawn: a vertex drag redraws the active layer and the overlay, never the static
 * sections; a pointer move alone redraws the overlay. The overlay (handles, snap marker, cursor, tool
 * preview, highlight) is one shape redrawn each frame. Sections off screen derive nothing until they
 * come into view.
 */
export class BoardRenderer {
  readonly stage: Konva.Stage;
  /** Grid, reference image, static sections and rulers. */
  private readonly baseLayer = new Konva.Layer({ listening: false });
  /** The active section. */
  private readonly activeLayer = new OnDemandLayer({ listening: false });
  /** The overlay. */
  private readonly topLayer = new OnDemandLayer({ listening: false });
  private readonly staticContent = new Konva.Group({ listening: false });
  private readonly activeContent = new Konva.Group({ listening: false });
  private readonly referenceContent = new Konva.Group({ listening: false });
  private readonly entries = new Map<string, SectionEntry>();
  /** The sections of the document last rendered, in the order the static layer draws them. */
  private drawnSections: readonly Section[] = [];
  private highlight: BoardHighlight | null = null;
  private referenceImage: Konva.Image | null = null;
  private referenceUrl: string | null = null;
  /** Placement and opacity the trace image was last drawn with. */
  private referenceKey = '';
  private frame = 0;
  private pass = 0;
  private lastViewKey = '';
  private sectionView: SectionView = { scale: 1, mirrored: false, visible: { minX: 0, minY: 0, maxX: 0, maxY: 0 } };
  /** The fabrics shown: the document's own or those of {@link colourwayId}, made again only when either changes. */
  private fabricsFor: { doc: Pick<PatternDocument, 'fabrics' | 'colourways'>; colourwayId: string | null; map: Map<string, Fabric>; key: string } | null = null;
  /** The colourway the board shows, or null for the pattern's own fabrics. */
  private colourwayId: string | null = null;
  private readonly shownFabrics = (): ReadonlyMap<string, Fabric> => this.fabricsFor?.map ?? new Map();
  /** The section the overlay draws handles for, found again only when the document or selection changes. */
  private activeSection: { doc: PatternDocument; id: string | null; section: Section | undefined } | null = null;
  /** Sections whose sewability this board has checked (the analysis keeps the verdicts). */
  private readonly checked = new WeakSet<Section>();
  /** Static sections drawn before their check, to check between frames. */
  private readonly unchecked: Section[] = [];
  private checkTimer: ReturnType<typeof setTimeout> | null = null;
  private readonly unsubscribe: Array<() => void> = [];
  /** How many times each layer was drawn (for tests and the benchmark). */
  readonly draws = { grid: 0, static: 0, active: 0, overlay: 0 };

  constructor(
    container: HTMLDivElement,
    private readonly editor: BoardEditor,
    /** Time a render may spend checking sewability before drawing (tests set 0 to defer every check). */
    private readonly syncCheckBudgetMs = SYNC_CHECK_BUDGET_MS,
  ) {
    // The renderer draws exactly the layers that changed; Konva's own redraw on every change would
    // draw them a second time on the next frame.
    Konva.autoDrawEnabled = false;
    const { width, height } = editor.sizePx;
    this.stage = new Konva.Stage({ container, width, height, listening: false });
    const view = (): GridView => {
      const v = this.editor.viewport;
      const cursor = this.editor.cursor;
      const doc = this.editor.store.document;
      return {
        viewport: v,
        widthPx: this.editor.sizePx.width,
        heightPx: this.editor.sizePx.height,
        unit: this.editor.settings.unit,
        canvasWidthIn: doc.canvas.widthIn,
        canvasHeightIn: doc.canvas.heightIn,
        cursorPx: cursor ? toScreen(v, cursor) : null,
      };
    };
    // The layers join the stage empty: the stage draws a layer as it is added, and the first real draw
    // comes after the view is set.
    this.stage.add(this.baseLayer, this.activeLayer, this.topLayer);
    this.staticContent.add(
      new Konva.Shape({
        name: 'static-sections',
        listening: false,
        perfectDrawEnabled: false,
        sceneFunc: (context) => this.drawStaticSections(context._context),
      }),
    );
    this.baseLayer.add(createGridShape(view), this.referenceContent, this.staticContent, createRulerShape(view));
    // The active section stays inside the rulers, which lie under it on the base layer.
    const activeClip = new Konva.Group({
      listening: false,
      clipFunc: (ctx) => {
        const { width, height } = this.editor.sizePx;
        ctx.rect(RULER_PX, RULER_PX, Math.max(0, width - RULER_PX), Math.max(0, height - RULER_PX));
      },
    });
    activeClip.add(this.activeContent);
    this.activeLayer.add(activeClip);
    this.topLayer.add(
      new Konva.Shape({
        name: 'overlay',
        listening: false,
        perfectDrawEnabled: false,
        sceneFunc: (context) => this.drawOverlay(context._context),
      }),
    );
    this.unsubscribe.push(editor.store.subscribe(() => this.schedule()));
    this.unsubscribe.push(editor.onViewChange(() => this.schedule()));
    // Drawn on the next frame, so a view set right after (e.g. fitting the pattern) is drawn once.
    this.schedule();
  }

  /** The static sections in document order, each from its painter (the active one is on its own layer). */
  private drawStaticSections(ctx: CanvasRenderingContext2D): void {
    for (const section of this.drawnSections) {
      const e = this.entries.get(section.id);
      if (e && !e.active) e.paint(ctx);
    }
  }

  /**
   * Shows (or hides, with null) the image to trace, locked under the drawing. Where it sits, how wide
   * it is and how opaque follow the document's `referenceImage` on every render.
   */
  setReferenceImage(url: string | null): void {
    if (url === this.referenceUrl) return;
    this.referenceUrl = url;
    this.referenceImage?.destroy();
    this.referenceImage = null;
    this.referenceKey = '';
    if (!url) {
      this.baseLayer.draw();
      return;
    }
    const img = new Image();
    img.onload = () => {
      if (this.referenceUrl !== url) return;
      this.referenceImage = new Konva.Image({ name: 'reference-image', image: img, listening: false });
      this.referenceContent.add(this.referenceImage);
      this.renderNow();
    };
    img.src = url;
  }

  /** Places the trace image as the document says; returns whether anything changed. */
  private placeReferenceImage(doc: PatternDocument): boolean {
    const node = this.referenceImage;
    if (!node) return false;
    const ref = doc.referenceImage;
    const key = ref ? `${ref.origin.x}|${ref.origin.y}|${ref.widthIn}|${ref.opacity}` : 'none';
    if (key === this.referenceKey) return false;
    this.referenceKey = key;
    node.visible(!!ref);
    if (ref) {
      const img = node.image() as HTMLImageElement;
      // The image keeps its proportions: its height follows its width.
      node.position(ref.origin);
      node.size({ width: ref.widthIn, height: (ref.widthIn * img.naturalHeight) / Math.max(1, img.naturalWidth) });
      node.opacity(ref.opacity);
    }
    return true;
  }

  /** Points out paths and marks over the drawing (e.g. the seam of a join), or nothing with null. */
  setHighlight(highlight: BoardHighlight | null): void {
    this.highlight = highlight && (highlight.paths.length > 0 || highlight.marks.length > 0) ? highlight : null;
    this.schedule();
  }

  /**
   * Shows the patches in one of the document's colourways (null: its own fabrics). Only the fills change:
   * the sections' drawings are kept and the layers drawn once more. An id the document does not have
   * shows its own fabrics.
   */
  setColourway(id: string | null): void {
    if (id === this.colourwayId) return;
    this.colourwayId = id;
    this.schedule();
  }

  /** Resizes the stage to the editor's size. */
  resize(): void {
    this.stage.size(this.editor.sizePx);
    this.renderNow();
  }

  /** Draws on the next animation frame (coalescing bursts of pointer events). */
  schedule(): void {
    if (this.frame) return;
    this.frame = requestAnimationFrame(() => {
      this.frame = 0;
      this.renderNow();
    });
  }

  /** Draws now. */
  renderNow(): void {
    if (this.frame) {
      cancelAnimationFrame(this.frame);
      this.frame = 0;
    }
    const ed = this.editor;
    const v = ed.viewport;
    const doc = ed.store.document;
    const size = ed.sizePx;
    const viewKey = `${v.scale}|${v.originX}|${v.originY}|${v.mirrored}|${v.mirrorWidthIn}|${size.width}|${size.height}|${ed.settings.unit}|${doc.canvas.widthIn}|${doc.canvas.heightIn}`;
    const viewChanged = viewKey !== this.lastViewKey;
    this.lastViewKey = viewKey;
    let staticDirty = viewChanged;
    let activeDirty = viewChanged;

    if (viewChanged) {
      for (const g of [this.staticContent, this.activeContent, this.referenceContent]) {
        g.position({ x: v.originX + (v.mirrored ? v.mirrorWidthIn * v.scale : 0), y: v.originY });
        g.scale({ x: v.mirrored ? -v.scale : v.scale, y: v.scale });
      }
      const a = toDocument(v, { x: -CULL_MARGIN_PX, y: -CULL_MARGIN_PX });
      const b = toDocument(v, { x: size.width + CULL_MARGIN_PX, y: size.height + CULL_MARGIN_PX });
      this.sectionView = { scale: v.scale, mirrored: v.mirrored, visible: { minX: Math.min(a.x, b.x), minY: a.y, maxX: Math.max(a.x, b.x), maxY: b.y } };
    }

    const selection = ed.store.selection;
    const activeId = ed.store.gestureSectionId ?? selection.sectionId;
    const fabricsKey = this.fabricsFor?.key;
    if (this.fabricMap(doc).key !== fabricsKey) {
      // Other fabric colours: every section restyles its fills at its next draw, none is built again.
      staticDirty = true;
      activeDirty = true;
    }
    const settings = ed.settings.showSeamAllowance ? String(doc.seamAllowanceIn) : 'off';
    const pass = ++this.pass;
    const sections = doc.sections;
    let checkTime = 0;
    for (let i = 0; i < sections.length; i++) {
      const section = sections[i];
      const active = section.id === activeId;
      const patchIndex = active ? selection.patchIndex : null;
      const old = this.entries.get(section.id);
      // Sections keep the order they were added in; a section going back from the active layer lands on top.
      if (old && old.section === section && old.active === active && old.settings === settings && old.patchIndex === patchIndex) {
        old.pass = pass;
        continue;
      }
      if (old) {
        old.node?.destroy();
        if (old.active) activeDirty = true;
        else staticDirty = true;
      }
      let checked = active || this.checked.has(section);
      if (!checked && checkTime < this.syncCheckBudgetMs) {
        const t0 = performance.now();
        ed.analysis.sewability(section);
        checkTime += performance.now() - t0;
        this.checked.add(section);
        checked = true;
      }
      if (!checked) this.unchecked.push(section);
      const options = {
        analysis: ed.analysis,
        fabrics: this.shownFabrics,
        selected: active,
        selectedPatchIndex: patchIndex,
        allowanceIn: ed.settings.showSeamAllowance ? doc.seamAllowanceIn : null,
        sewability: checked,
        view: () => this.sectionView,
      };
      let node: Konva.Shape | null = null;
      if (active) {
        node = createSectionShape(section, options);
        this.activeContent.add(node);
        activeDirty = true;
      } else {
        staticDirty = true;
      }
      this.entries.set(section.id, { section, paint: node ? () => undefined : createSectionPainter(section, options), node, active, settings, patchIndex, pass });
    }
    if (sections !== this.drawnSections) {
      // Another order of the same sections (e.g. one brought forward) is drawn again too.
      if (!staticDirty && !sameOrder(sections, this.drawnSections)) staticDirty = true;
      this.drawnSections = sections;
    }
    if (this.entries.size !== sections.length) {
      for (const [id, e] of this.entries) {
        if (e.pass === pass) continue;
        e.node?.destroy();
        this.entries.delete(id);
        if (e.active) activeDirty = true;
        else staticDirty = true;
      }
    }

    if (this.placeReferenceImage(doc)) staticDirty = true;
    if (viewChanged) this.draws.grid++;
    if (staticDirty) {
      this.baseLayer.draw();
      this.draws.static++;
    }
    if (activeId !== null && !this.activeLayer.hasCanvas) {
      this.activeLayer.ensureCanvas();
      activeDirty = true;
    }
    if (activeDirty && this.activeLayer.hasCanvas) {
      this.activeLayer.draw();
      this.draws.active++;
    }
    if (!this.topLayer.hasCanvas && (activeId !== null || this.overlayHasContent())) this.topLayer.ensureCanvas();
    if (this.topLayer.hasCanvas) {
      this.topLayer.draw();
      this.draws.overlay++;
    }
    this.scheduleChecks();
  }

  /**
   * Resolves once the work left for later is done: every drawn section checked, failing ones drawn
   * again, and no frame waiting (for tests and the benchmark).
   */
  settled(): Promise<void> {
    return new Promise((resolve) => {
      const poll = () => {
        if (this.unchecked.length === 0 && this.checkTimer === null && !this.frame) resolve();
        else setTimeout(poll, 10);
      };
      poll();
    });
  }

  /** Sections checked after they were first drawn, still to check. */
  get pendingChecks(): number {
    return this.unchecked.length;
  }

  private scheduleChecks(): void {
    if (this.checkTimer !== null || this.unchecked.length === 0) return;
    this.checkTimer = setTimeout(() => this.runChecks(), 0);
  }

  /** Checks a slice of the sections drawn unchecked; a failing one is drawn again on the next frame. */
  private runChecks(): void {
    this.checkTimer = null;
    const until = performance.now() + CHECK_SLICE_MS;
    let redraw = false;
    while (this.unchecked.length > 0 && performance.now() < until) {
      const section = this.unchecked.pop()!;
      const entry = this.entries.get(section.id);
      if (this.checked.has(section) || entry?.section !== section) continue;
      this.checked.add(section);
      if (!this.editor.analysis.sewability(section).ok) {
        // Made again (now with its check) on the next render.
        entry.settings = '';
        redraw = true;
      }
    }
    if (redraw) this.schedule();
    this.scheduleChecks();
  }

  /**
   * The shown fabrics by id (the document's own, or in the chosen colourway through the piecing
   * library's `applyColourway`) and a key of their colours, made again only when the document's fabrics,
   * its colourways or the choice change.
   */
  private fabricMap(doc: PatternDocument): { map: Map<string, Fabric>; key: string } {
    let f = this.fabricsFor;
    if (!f || f.doc.fabrics !== doc.fabrics || f.doc.colourways !== doc.colourways || f.colourwayId !== this.colourwayId) {
      const known = this.colourwayId !== null && doc.colourways?.some((c) => c.id === this.colourwayId) ? this.colourwayId : null;
      const shown = applyColourway({ fabrics: doc.fabrics, colourways: doc.colourways }, known).fabrics;
      f = { doc: { fabrics: doc.fabrics, colourways: doc.colourways }, colourwayId: this.colourwayId, map: new Map(shown.map((x) => [x.id, x])), key: fabricKey(shown) };
      this.fabricsFor = f;
    }
    return f;
  }

  /** Whether the overlay has anything to draw now (the pointer, a tool preview, a snap marker, a highlight). */
  private overlayHasContent(): boolean {
    const ed = this.editor;
    return this.highlight !== null || ed.cursor !== null || ed.tool.preview() !== null || ed.lastSnap !== null;
  }

  /** The overlay in screen space: highlight, the active section's handles, the tool preview, the snap marker and the cursor. */
  private drawOverlay(ctx: CanvasRenderingContext2D): void {
    const ed = this.editor;
    const v = ed.viewport;
    this.drawHighlight(ctx);
    const doc = ed.store.document;
    const activeId = ed.store.gestureSectionId ?? ed.store.selection.sectionId;
    if (this.activeSection?.doc !== doc || this.activeSection.id !== activeId) {
      this.activeSection = { doc, id: activeId, section: activeId ? doc.sections.find((s) => s.id === activeId) : undefined };
    }
    const selected = this.activeSection.section;
    if (selected && ed.tool.id === 'select' && !ed.readOnly) {
      ctx.fillStyle = '#ffffff';
      ctx.strokeStyle = BOARD_COLOURS.handle;
      ctx.lineWidth = 1.5;
      for (const h of sectionHandles(selected.geometry)) {
        const p = toScreen(v, h.point);
        ctx.fillRect(p.x - 4, p.y - 4, 8, 8);
        ctx.strokeRect(p.x - 4, p.y - 4, 8, 8);
      }
    }
    const preview = ed.tool.preview();
    if (preview) this.drawPreview(ctx, preview);
    const snap = ed.lastSnap;
    if (snap && snap.kind !== 'none' && snap.kind !== 'grid') {
      const p = toScreen(v, snap.point);
      ctx.beginPath();
      ctx.arc(p.x, p.y, 5, 0, Math.PI * 2);
      ctx.strokeStyle = BOARD_COLOURS.snap;
      ctx.lineWidth = 2;
      ctx.stroke();
    }
    const cursor = ed.cursor;
    if (cursor) {
      const p = toScreen(v, cursor);
      // Where the pointer is, marked on both rulers, and a small cross at the pointer.
      ctx.beginPath();
      ctx.moveTo(p.x, 0);
      ctx.lineTo(p.x, RULER_PX);
      ctx.moveTo(0, p.y);
      ctx.lineTo(RULER_PX, p.y);
      ctx.moveTo(p.x - 6, p.y);
      ctx.lineTo(p.x + 6, p.y);
      ctx.moveTo(p.x, p.y - 6);
      ctx.lineTo(p.x, p.y + 6);
      ctx.strokeStyle = BOARD_COLOURS.snap;
      ctx.lineWidth = 1;
      ctx.stroke();
    }
  }

  /** The highlight in screen space: a light halo under a bold line, so it reads on any fabric. */
  private drawHighlight(ctx: CanvasRenderingContext2D): void {
    const h = this.highlight;
    if (!h) return;
    const v = this.editor.viewport;
    ctx.lineCap = 'round';
    ctx.lineJoin = 'round';
    for (const path of h.paths) {
      ctx.beginPath();
      path.forEach((q, i) => {
        const s = toScreen(v, q);
        if (i === 0) ctx.moveTo(s.x, s.y);
        else ctx.lineTo(s.x, s.y);
      });
      ctx.strokeStyle = HIGHLIGHT_HALO;
      ctx.lineWidth = 10;
      ctx.stroke();
      ctx.strokeStyle = HIGHLIGHT_INK;
      ctx.lineWidth = 4;
      ctx.stroke();
    }
    ctx.lineCap = 'butt';
    ctx.lineJoin = 'miter';
    for (const m of h.marks) {
      const s = toScreen(v, m);
      ctx.beginPath();
      ctx.arc(s.x, s.y, 5, 0, Math.PI * 2);
      ctx.fillStyle = HIGHLIGHT_INK;
      ctx.fill();
      ctx.strokeStyle = HIGHLIGHT_HALO;
      ctx.lineWidth = 2;
      ctx.stroke();
    }
  }

  private drawPreview(ctx: CanvasRenderingContext2D, preview: ToolPreview): void {
    const v = this.editor.viewport;
    const path = (pts: readonly Point[], closed: boolean) => {
      ctx.beginPath();
      pts.forEach((q, i) => {
        const s = toScreen(v, q);
        if (i === 0) ctx.moveTo(s.x, s.y);
        else ctx.lineTo(s.x, s.y);
      });
      if (closed) ctx.closePath();
    };
    const dashed = (colour: string) => {
      ctx.strokeStyle = colour;
      ctx.lineWidth = 2;
      ctx.setLineDash([6, 4]);
      ctx.stroke();
      ctx.setLineDash([]);
    };
    switch (preview.kind) {
      case 'polyline':
        path(preview.points, preview.closed);
        dashed(BOARD_COLOURS.preview);
        ctx.fillStyle = BOARD_COLOURS.preview;
        for (const q of preview.points) {
          const s = toScreen(v, q);
          ctx.beginPath();
          ctx.arc(s.x, s.y, 3, 0, Math.PI * 2);
          ctx.fill();
        }
        return;
      case 'geometry':
        path(this.editor.analysis.outline(preview), true);
        ctx.fillStyle = 'rgba(31,122,140,0.12)';
        ctx.fill();
        dashed(BOARD_COLOURS.preview);
        return;
      case 'seam':
        path([preview.a, preview.b], false);
        ctx.strokeStyle = preview.valid ? BOARD_COLOURS.preview : BOARD_COLOURS.previewInvalid;
        ctx.lineWidth = 2;
        ctx.stroke();
        return;
      case 'marker': {
        const s = toScreen(v, preview.point);
        ctx.beginPath();
        ctx.arc(s.x, s.y, 6, 0, Math.PI * 2);
        ctx.strokeStyle = BOARD_COLOURS.preview;
        ctx.lineWidth = 2;
        ctx.stroke();
        ctx.font = '12px Arial';
        ctx.textAlign = 'left';
        ctx.textBaseline = 'top';
        ctx.fillStyle = BOARD_COLOURS.preview;
        ctx.fillText(preview.label, s.x + 8, s.y - 16);
        return;
      }
    }
  }

  /** Stops drawing and frees the stage. */
  destroy(): void {
    if (this.frame) cancelAnimationFrame(this.frame);
    if (this.checkTimer !== null) clearTimeout(this.checkTimer);
    this.unchecked.length = 0;
    for (const u of this.unsubscribe) u();
    this.stage.destroy();
  }
}

/** Colours of a highlight: a deep blue none of the board's other marks use, on a paper-coloured halo. */
const HIGHLIGHT_INK = '#1d4fd8';
const HIGHLIGHT_HALO = 'rgba(255,253,248,0.9)';

/** Ruler band thickness, re-exported for the board component's pointer maths. */
export const BOARD_RULER_PX = RULER_PX;

/** Whether two section lists hold the same ids in the same order. */
function sameOrder(a: readonly Section[], b: readonly Section[]): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i].id !== b[i].id) return false;
  return true;
}

function fabricKey(fabrics: readonly Fabric[]): string {
  return fabrics.map((f) => `${f.id}:${f.colour}`).join(',');
}
