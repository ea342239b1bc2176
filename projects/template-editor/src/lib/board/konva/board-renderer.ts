import Konva from 'konva';
import type { Fabric, PatternDocument, Section } from '@seamwright/piecing';
import { sectionHandles, toScreen, type BoardEditor, type BoardHighlight, type ToolPreview } from '../../core/public-api';
import { BOARD_COLOURS } from './board-colours';
import { createGridShape, createRulerShape, RULER_PX, type GridView } from './grid-shape';
import { createSectionNode, rescaleLabels } from './section-node';

interface SectionEntry {
  section: Section;
  node: Konva.Group;
  active: boolean;
  key: string;
}

/**
 * Draws a {@link BoardEditor} on a Konva stage. Layers: grid (screen space), reference image, the
 * static sections, the active section (selected or being dragged), the tool overlay and the rulers.
 * A section is rebuilt only when its object changed, and only the layers that changed are redrawn:
 * a vertex drag redraws the active layer and the overlay, never the static sections.
 */
export class BoardRenderer {
  readonly stage: Konva.Stage;
  private readonly gridLayer = new Konva.Layer({ listening: false });
  private readonly referenceLayer = new Konva.Layer({ listening: false });
  private readonly staticLayer = new Konva.Layer({ listening: false });
  private readonly activeLayer = new Konva.Layer({ listening: false });
  private readonly overlayLayer = new Konva.Layer({ listening: false });
  private readonly rulerLayer = new Konva.Layer({ listening: false });
  private readonly staticContent = new Konva.Group({ listening: false });
  private readonly activeContent = new Konva.Group({ listening: false });
  private readonly referenceContent = new Konva.Group({ listening: false });
  private readonly entries = new Map<string, SectionEntry>();
  private highlight: BoardHighlight | null = null;
  private referenceImage: Konva.Image | null = null;
  private referenceUrl: string | null = null;
  /** Placement and opacity the trace image was last drawn with. */
  private referenceKey = '';
  private frame = 0;
  private lastViewKey = '';
  private lastScale = 0;
  private lastMirrored = false;
  private readonly unsubscribe: Array<() => void> = [];
  /** How many times each layer was drawn (for tests and the benchmark). */
  readonly draws = { grid: 0, static: 0, active: 0, overlay: 0 };

  constructor(
    container: HTMLDivElement,
    private readonly editor: BoardEditor,
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
    this.gridLayer.add(createGridShape(view));
    this.rulerLayer.add(createRulerShape(view));
    this.referenceLayer.add(this.referenceContent);
    this.staticLayer.add(this.staticContent);
    this.activeLayer.add(this.activeContent);
    this.stage.add(this.gridLayer, this.referenceLayer, this.staticLayer, this.activeLayer, this.rulerLayer, this.overlayLayer);
    this.unsubscribe.push(editor.store.subscribe(() => this.schedule()));
    this.unsubscribe.push(editor.onViewChange(() => this.schedule()));
    this.renderNow();
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
      this.referenceLayer.draw();
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
    const viewKey = `${v.scale}|${v.originX}|${v.originY}|${v.mirrored}|${v.mirrorWidthIn}|${ed.sizePx.width}|${ed.sizePx.height}|${ed.settings.unit}|${doc.canvas.widthIn}|${doc.canvas.heightIn}`;
    const viewChanged = viewKey !== this.lastViewKey;
    this.lastViewKey = viewKey;
    let staticDirty = viewChanged;
    let activeDirty = viewChanged;

    if (viewChanged) {
      for (const g of [this.staticContent, this.activeContent, this.referenceContent]) {
        g.position({ x: v.originX + (v.mirrored ? v.mirrorWidthIn * v.scale : 0), y: v.originY });
        g.scale({ x: v.mirrored ? -v.scale : v.scale, y: v.scale });
      }
      if (v.scale !== this.lastScale || v.mirrored !== this.lastMirrored) {
        for (const e of this.entries.values()) rescaleLabels(e.node, v.scale, v.mirrored);
        this.lastScale = v.scale;
        this.lastMirrored = v.mirrored;
      }
    }

    const selection = ed.store.selection;
    const activeId = ed.store.gestureSectionId ?? selection.sectionId;
    const fabrics = new Map<string, Fabric>(doc.fabrics.map((f) => [f.id, f]));
    const settingsKey = `${ed.settings.showSeamAllowance ? doc.seamAllowanceIn : 'off'}|${fabricKey(doc)}`;
    const seen = new Set<string>();
    doc.sections.forEach((section) => {
      seen.add(section.id);
      const active = section.id === activeId;
      const key = `${settingsKey}|${active ? `sel:${selection.patchIndex}` : ''}`;
      const old = this.entries.get(section.id);
      // Sections keep the order they were added in; a section going back from the active layer lands on top.
      if (old && old.section === section && old.active === active && old.key === key) return;
      if (old) {
        old.node.destroy();
        if (old.active) activeDirty = true;
        else staticDirty = true;
      }
      const node = createSectionNode(section, {
        analysis: ed.analysis,
        fabrics,
        selected: active,
        selectedPatchIndex: active ? selection.patchIndex : null,
        allowanceIn: ed.settings.showSeamAllowance ? doc.seamAllowanceIn : null,
        scale: v.scale,
        mirrored: v.mirrored,
      });
      (active ? this.activeContent : this.staticContent).add(node);
      if (active) activeDirty = true;
      else staticDirty = true;
      this.entries.set(section.id, { section, node, active, key });
    });
    for (const [id, e] of this.entries) {
      if (seen.has(id)) continue;
      e.node.destroy();
      this.entries.delete(id);
      if (e.active) activeDirty = true;
      else staticDirty = true;
    }

    if (this.placeReferenceImage(doc) && !viewChanged) this.referenceLayer.draw();

    if (viewChanged) {
      this.rulerLayer.draw();
      this.gridLayer.draw();
      this.referenceLayer.draw();
      this.draws.grid++;
    }
    if (staticDirty) {
      this.staticLayer.draw();
      this.draws.static++;
    }
    if (activeDirty) {
      this.activeLayer.draw();
      this.draws.active++;
    }
    this.drawOverlay(activeId);
  }

  private drawOverlay(activeId: string | null): void {
    const ed = this.editor;
    const v = ed.viewport;
    this.overlayLayer.destroyChildren();
    this.drawHighlight();
    const doc = ed.store.document;
    const selected = activeId ? doc.sections.find((s) => s.id === activeId) : undefined;
    if (selected && ed.tool.id === 'select' && !ed.readOnly) {
      for (const h of sectionHandles(selected.geometry)) {
        const p = toScreen(v, h.point);
        this.overlayLayer.add(new Konva.Rect({ name: 'handle', x: p.x - 4, y: p.y - 4, width: 8, height: 8, fill: '#ffffff', stroke: BOARD_COLOURS.handle, strokeWidth: 1.5, listening: false }));
      }
    }
    const preview = ed.tool.preview();
    if (preview) this.drawPreview(preview);
    const snap = ed.lastSnap;
    if (snap && snap.kind !== 'none' && snap.kind !== 'grid') {
      const p = toScreen(v, snap.point);
      this.overlayLayer.add(new Konva.Circle({ name: 'snap-marker', x: p.x, y: p.y, radius: 5, stroke: BOARD_COLOURS.snap, strokeWidth: 2, listening: false }));
    }
    const cursor = ed.cursor;
    if (cursor) {
      const p = toScreen(v, cursor);
      // Where the pointer is, marked on both rulers.
      this.overlayLayer.add(new Konva.Line({ points: [p.x, 0, p.x, RULER_PX], stroke: BOARD_COLOURS.snap, strokeWidth: 1, listening: false }));
      this.overlayLayer.add(new Konva.Line({ points: [0, p.y, RULER_PX, p.y], stroke: BOARD_COLOURS.snap, strokeWidth: 1, listening: false }));
      this.overlayLayer.add(new Konva.Line({ points: [p.x - 6, p.y, p.x + 6, p.y], stroke: BOARD_COLOURS.snap, strokeWidth: 1, listening: false }));
      this.overlayLayer.add(new Konva.Line({ points: [p.x, p.y - 6, p.x, p.y + 6], stroke: BOARD_COLOURS.snap, strokeWidth: 1, listening: false }));
    }
    this.overlayLayer.draw();
    this.draws.overlay++;
  }

  /** The highlight in screen space: a light halo under a bold line, so it reads on any fabric. */
  private drawHighlight(): void {
    const h = this.highlight;
    if (!h) return;
    const v = this.editor.viewport;
    for (const path of h.paths) {
      const points = path.flatMap((p) => {
        const s = toScreen(v, p);
        return [s.x, s.y];
      });
      this.overlayLayer.add(new Konva.Line({ points, stroke: HIGHLIGHT_HALO, strokeWidth: 10, lineCap: 'round', lineJoin: 'round', listening: false }));
      this.overlayLayer.add(new Konva.Line({ name: 'highlight', points, stroke: HIGHLIGHT_INK, strokeWidth: 4, lineCap: 'round', lineJoin: 'round', listening: false }));
    }
    for (const m of h.marks) {
      const s = toScreen(v, m);
      this.overlayLayer.add(new Konva.Circle({ name: 'highlight-mark', x: s.x, y: s.y, radius: 5, fill: HIGHLIGHT_INK, stroke: HIGHLIGHT_HALO, strokeWidth: 2, listening: false }));
    }
  }

  private drawPreview(preview: ToolPreview): void {
    const v = this.editor.viewport;
    const scr = (p: { x: number; y: number }) => toScreen(v, p);
    const flat = (pts: Array<{ x: number; y: number }>) => pts.flatMap((p) => {
      const s = scr(p);
      return [s.x, s.y];
    });
    switch (preview.kind) {
      case 'polyline':
        this.overlayLayer.add(new Konva.Line({ name: 'tool-preview', points: flat(preview.points), closed: preview.closed, stroke: BOARD_COLOURS.preview, strokeWidth: 2, dash: [6, 4], listening: false }));
        for (const p of preview.points) {
          const s = scr(p);
          this.overlayLayer.add(new Konva.Circle({ x: s.x, y: s.y, radius: 3, fill: BOARD_COLOURS.preview, listening: false }));
        }
        return;
      case 'geometry': {
        const outline = this.editor.analysis.outline(preview);
        this.overlayLayer.add(new Konva.Line({ name: 'tool-preview', points: flat(outline), closed: true, fill: 'rgba(31,122,140,0.12)', stroke: BOARD_COLOURS.preview, strokeWidth: 2, dash: [6, 4], listening: false }));
        return;
      }
      case 'seam':
        this.overlayLayer.add(new Konva.Line({ name: 'tool-preview', points: flat([preview.a, preview.b]), stroke: preview.valid ? BOARD_COLOURS.preview : BOARD_COLOURS.previewInvalid, strokeWidth: 2, listening: false }));
        return;
      case 'marker': {
        const s = scr(preview.point);
        this.overlayLayer.add(new Konva.Circle({ name: 'tool-preview', x: s.x, y: s.y, radius: 6, stroke: BOARD_COLOURS.preview, strokeWidth: 2, listening: false }));
        this.overlayLayer.add(new Konva.Text({ x: s.x + 8, y: s.y - 16, text: preview.label, fontSize: 12, fill: BOARD_COLOURS.preview, listening: false }));
        return;
      }
    }
  }

  /** Stops drawing and frees the stage. */
  destroy(): void {
    if (this.frame) cancelAnimationFrame(this.frame);
    for (const u of this.unsubscribe) u();
    this.stage.destroy();
  }
}

/** Colours of a highlight: a deep blue none of the board's other marks use, on a paper-coloured halo. */
const HIGHLIGHT_INK = '#1d4fd8';
const HIGHLIGHT_HALO = 'rgba(255,253,248,0.9)';

/** Ruler band thickness, re-exported for the board component's pointer maths. */
export const BOARD_RULER_PX = RULER_PX;

function fabricKey(doc: PatternDocument): string {
  return doc.fabrics.map((f) => `${f.id}:${f.colour}`).join(',');
}
