import Konva from 'konva';
import { polygonBounds, type Bounds, type Fabric, type Point, type Section } from '@seamwright/piecing';
import type { BoardPatch, BoardSewability, SectionAnalysis } from '../../core/public-api';
import { BOARD_COLOURS } from './board-colours';

/** The view a section is drawn in, read at every draw (a zoom or pan redraws without a rebuild). */
export interface SectionView {
  /** Pixels per inch. */
  scale: number;
  mirrored: boolean;
  /** The part of the document on screen, in inches (sections wholly outside it are not drawn). */
  visible: Bounds;
}

/** What a section's shape shows besides the section itself. */
export interface SectionShapeOptions {
  analysis: SectionAnalysis;
  /**
   * The fabrics the board shows by id (the pattern's own, or a colourway's), read at every draw: a new
   * map restyles the fills without building the section's drawing again.
   */
  fabrics: () => ReadonlyMap<string, Fabric>;
  selected: boolean;
  selectedPatchIndex: number | null;
  /** Cutting line of each placement, when the seam allowance preview is on. */
  allowanceIn: number | null;
  /**
   * Whether to show the sewability check (the failing patch, and its reason on the selected section).
   * The board checks static sections after the first draw of a large pattern and then redraws them.
   */
  sewability: boolean;
  view: () => SectionView;
}

/** Smallest patch size on screen, in pixels, that still shows its number. */
export const MIN_LABELLED_PATCH_PX = 26;

/** Label type: bold 12 px on a 3 px paper-coloured halo, the same size on screen at every zoom. */
const LABEL_FONT = 'bold 12px Roboto, sans-serif';
const REASON_FONT = '11px Roboto, sans-serif';
/** The reason box: text wrapped to this width (padding included), below the failing patch's number. */
const REASON_WIDTH_PX = 240;
const REASON_PADDING_PX = 6;
const REASON_LINE_PX = 11;
const REASON_DROP_PX = 14;

interface PatchDrawing {
  patch: BoardPatch;
  path: Path2D;
  fill: string;
  bands: Array<{ path: Path2D; fabricId: string; fill: string }> | null;
  guides: Path2D | null;
  /** The smaller side of the patch's bounding box, in inches (labels of smaller patches are hidden). */
  sizeIn: number;
  failing: boolean;
}

interface CopyDrawing {
  alpha: number;
  patches: PatchDrawing[];
  /** Every patch's outline in one path: the seams, stroked once after the fills. */
  seams: Path2D;
  /** The outline filled blank when the section has no patches (a half-drawn or invalid outline). */
  blank: Path2D | null;
  outline: Path2D;
  cutting: Path2D | null;
}

interface SectionDrawing {
  copies: CopyDrawing[];
  /** The fabric map the fills were taken from. */
  fabrics: ReadonlyMap<string, Fabric>;
  bounds: Bounds;
  reason: { text: string; at: Point } | null;
}

/** The smaller side of the bounding box of `points`. */
function smallerSide(points: readonly Point[]): number {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const q of points) {
    if (q.x < minX) minX = q.x;
    if (q.x > maxX) maxX = q.x;
    if (q.y < minY) minY = q.y;
    if (q.y > maxY) maxY = q.y;
  }
  return Math.min(maxX - minX, maxY - minY);
}

/** Adds the closed ring `points` to `path` (returned). */
function ringPath(points: readonly Point[], path = new Path2D()): Path2D {
  for (let i = 0; i < points.length; i++) {
    if (i === 0) path.moveTo(points[i].x, points[i].y);
    else path.lineTo(points[i].x, points[i].y);
  }
  path.closePath();
  return path;
}

function patchFill(p: BoardPatch, fabrics: ReadonlyMap<string, Fabric>): string {
  if (p.stripSet) return fabrics.get(p.stripSet.strips[0]?.fabricId ?? '')?.colour ?? BOARD_COLOURS.emptyPatch;
  return (p.fabricId && fabrics.get(p.fabricId)?.colour) || BOARD_COLOURS.emptyPatch;
}

function bandFill(fabricId: string, fabrics: ReadonlyMap<string, Fabric>): string {
  return fabrics.get(fabricId)?.colour ?? BOARD_COLOURS.emptyPatch;
}

/** Takes the fills of a built drawing from another fabric map (a colourway shown, a fabric's colour changed). */
function restyle(d: SectionDrawing, fabrics: ReadonlyMap<string, Fabric>): void {
  d.fabrics = fabrics;
  for (const copy of d.copies) {
    for (const p of copy.patches) {
      p.fill = patchFill(p.patch, fabrics);
      if (p.bands) for (const band of p.bands) band.fill = bandFill(band.fabricId, fabrics);
    }
  }
}

/** Everything one section draws, in document inches, from the analysis' cached facts. */
function buildDrawing(section: Section, o: SectionShapeOptions, fabrics: ReadonlyMap<string, Fabric>): SectionDrawing {
  const sewability: BoardSewability = o.sewability ? o.analysis.sewability(section) : { ok: true };
  const failingNumber = sewability.ok ? null : (sewability.failingPatchNumber ?? null);
  const outlines: Point[] = [];
  const copies = o.analysis.placements(section).map((placement, copyIndex): CopyDrawing => {
    const patches = o.analysis.patches(placement);
    const outline = o.analysis.outline(placement);
    for (const q of outline) outlines.push(q);
    const cut = o.allowanceIn !== null ? o.analysis.cuttingLine(placement, o.allowanceIn) : null;
    if (cut) for (const q of cut) outlines.push(q);
    const seams = new Path2D();
    return {
      alpha: copyIndex === 0 ? 1 : 0.55,
      seams,
      patches: patches.map((p) => {
        let guides: Path2D | null = null;
        if (p.guideLines.length > 0) {
          guides = new Path2D();
          for (const [a, c] of p.guideLines) {
            guides.moveTo(a.x, a.y);
            guides.lineTo(c.x, c.y);
          }
        }
        const path = ringPath(p.polygon);
        // The ring drawn into the seams path again: cheaper than Path2D.addPath, which copies a path.
        ringPath(p.polygon, seams);
        return {
          patch: p,
          path,
          fill: patchFill(p, fabrics),
          bands: p.stripBands ? p.stripBands.map((band) => ({ path: ringPath(band.polygon), fabricId: band.fabricId, fill: bandFill(band.fabricId, fabrics) })) : null,
          guides,
          sizeIn: smallerSide(p.polygon),
          failing: copyIndex === 0 && failingNumber === p.number,
        };
      }),
      blank: patches.length === 0 && outline.length > 2 ? ringPath(outline) : null,
      outline: ringPath(outline),
      cutting: cut ? ringPath(cut) : null,
    };
  });
  let reason: SectionDrawing['reason'] = null;
  // The reason in words goes with the selected section; others show the outline and a red number.
  if (o.selected && !sewability.ok && sewability.reason) {
    const own = copies[0]?.patches ?? [];
    const failing = own.find((d) => d.failing);
    const at = failing?.patch.labelPoint ?? o.analysis.outline(section)[0];
    if (at) reason = { text: sewability.reason, at };
  }
  return { copies, fabrics, bounds: outlines.length > 0 ? polygonBounds(outlines) : { minX: 0, minY: 0, maxX: 0, maxY: 0 }, reason };
}

function overlaps(a: Bounds, b: Bounds): boolean {
  return a.minX <= b.maxX && b.minX <= a.maxX && a.minY <= b.maxY && b.minY <= a.maxY;
}

/** Strokes `path` `px` screen pixels wide (dashes in screen pixels too) under a content transform of `scale`. */
function strokeScreen(ctx: CanvasRenderingContext2D, path: Path2D, colour: string, px: number, scale: number, dash: readonly number[] | null): void {
  ctx.strokeStyle = colour;
  ctx.lineWidth = px / scale;
  if (dash) ctx.setLineDash(dash.map((d) => d / scale));
  ctx.stroke(path);
  if (dash) ctx.setLineDash([]);
}

/** Runs `draw` with the origin at `at` and one unit = one screen pixel, unmirrored (labels keep their size on screen). */
function inScreenUnits(ctx: CanvasRenderingContext2D, at: Point, v: SectionView, draw: () => void): void {
  ctx.save();
  ctx.translate(at.x, at.y);
  ctx.scale((v.mirrored ? -1 : 1) / v.scale, 1 / v.scale);
  draw();
  ctx.restore();
}

function drawLabel(ctx: CanvasRenderingContext2D, text: string, at: Point, colour: string, v: SectionView): void {
  inScreenUnits(ctx, at, v, () => {
    ctx.font = LABEL_FONT;
    ctx.textAlign = 'center';
    ctx.textBaseline = 'middle';
    ctx.lineJoin = 'round';
    ctx.strokeStyle = BOARD_COLOURS.labelHalo;
    ctx.lineWidth = 3;
    ctx.strokeText(text, 0, 0);
    ctx.fillStyle = colour;
    ctx.fillText(text, 0, 0);
  });
}

/** Words in lines no wider than `width` pixels as `ctx` measures them. */
export function wrapWords(ctx: Pick<CanvasRenderingContext2D, 'measureText'>, text: string, width: number): string[] {
  const lines: string[] = [];
  let line = '';
  for (const word of text.split(/\s+/).filter((w) => w.length > 0)) {
    const next = line ? `${line} ${word}` : word;
    if (line && ctx.measureText(next).width > width) {
      lines.push(line);
      line = word;
    } else {
      line = next;
    }
  }
  if (line) lines.push(line);
  return lines;
}

/** The sewability reason in a small box under the failing patch's number, wrapped to 240 px. */
function drawReason(ctx: CanvasRenderingContext2D, reason: { text: string; at: Point }, v: SectionView): void {
  inScreenUnits(ctx, reason.at, v, () => {
    ctx.font = REASON_FONT;
    const lines = wrapWords(ctx, reason.text, REASON_WIDTH_PX - 2 * REASON_PADDING_PX);
    const height = lines.length * REASON_LINE_PX + 2 * REASON_PADDING_PX;
    ctx.beginPath();
    ctx.roundRect(0, REASON_DROP_PX, REASON_WIDTH_PX, height, 3);
    ctx.fillStyle = '#fff4f0';
    ctx.fill();
    ctx.strokeStyle = BOARD_COLOURS.failing;
    ctx.lineWidth = 1;
    ctx.stroke();
    ctx.fillStyle = BOARD_COLOURS.failing;
    ctx.textAlign = 'left';
    ctx.textBaseline = 'middle';
    lines.forEach((line, i) => ctx.fillText(line, REASON_PADDING_PX, REASON_DROP_PX + REASON_PADDING_PX + (i + 0.5) * REASON_LINE_PX));
  });
}

function drawSection(ctx: CanvasRenderingContext2D, d: SectionDrawing, o: SectionShapeOptions, v: SectionView): void {
  const s = v.scale;
  for (let copyIndex = 0; copyIndex < d.copies.length; copyIndex++) {
    const copy = d.copies[copyIndex];
    ctx.globalAlpha = copy.alpha;
    for (const p of copy.patches) {
      ctx.fillStyle = p.fill;
      ctx.fill(p.path);
      if (p.bands) {
        ctx.save();
        ctx.clip(p.path);
        for (const band of p.bands) {
          ctx.fillStyle = band.fill;
          ctx.fill(band.path);
        }
        ctx.restore();
      }
    }
    if (copy.patches.length > 0) strokeScreen(ctx, copy.seams, BOARD_COLOURS.seam, 1, s, null);
    for (const p of copy.patches) if (p.guides) strokeScreen(ctx, p.guides, BOARD_COLOURS.guideLine, 1.5, s, [6, 3]);
    if (copy.blank) {
      ctx.fillStyle = BOARD_COLOURS.emptyPatch;
      ctx.fill(copy.blank);
    }
    const selectedOutline = o.selected && copyIndex === 0;
    strokeScreen(ctx, copy.outline, selectedOutline ? BOARD_COLOURS.selection : BOARD_COLOURS.ink, selectedOutline ? 3 : 2, s, null);
    if (copy.cutting) strokeScreen(ctx, copy.cutting, BOARD_COLOURS.cuttingLine, 1, s, [8, 4]);
    if (copyIndex !== 0) continue;
    for (const p of copy.patches) {
      if (p.failing) strokeScreen(ctx, p.path, BOARD_COLOURS.failing, 3, s, [7, 4]);
      if (o.selected && o.selectedPatchIndex === p.patch.index) {
        ctx.fillStyle = 'rgba(31,122,140,0.18)';
        ctx.fill(p.path);
        strokeScreen(ctx, p.path, BOARD_COLOURS.selection, 1.5, s, [4, 3]);
      }
      // A label is placed (its label point found) only once its patch is large enough on screen to show it.
      if (o.selected || p.sizeIn * s >= MIN_LABELLED_PATCH_PX) drawLabel(ctx, p.patch.label, p.patch.labelPoint, p.failing ? BOARD_COLOURS.failing : BOARD_COLOURS.label, v);
    }
  }
  ctx.globalAlpha = 1;
  if (d.reason) drawReason(ctx, d.reason, v);
}

/** Draws one section onto a canvas whose transform maps document inches to the screen. */
export type SectionPainter = (ctx: CanvasRenderingContext2D) => void;

/**
 * What one section draws: its patches filled with their fabrics, the outline, the seams, strip-set
 * bands and guide lines, patch numbers, the sewability failure, ring-repeat copies and (when asked) the
 * cutting line, in one pass. A section wholly off screen is skipped before anything is derived for it
 * (its outline's bounds decide, unless the cutting line or a reason box may reach further); what it
 * draws is worked out at its first draw on screen and kept (the painter is replaced when its section
 * changes; other fabrics only restyle the fills).
 */
export function createSectionPainter(section: Section, o: SectionShapeOptions): SectionPainter {
  let drawing: SectionDrawing | null = null;
  // Outline bounds of every placement: known without splitting the section.
  let reach: Bounds | null = null;
  return (ctx) => {
    const v = o.view();
    if (!drawing && o.allowanceIn === null && !o.selected) {
      reach ??= placementBounds(section, o.analysis);
      if (!overlaps(reach, v.visible)) return;
    }
    const fabrics = o.fabrics();
    drawing ??= buildDrawing(section, o, fabrics);
    if (drawing.fabrics !== fabrics) restyle(drawing, fabrics);
    if (!overlaps(drawing.bounds, v.visible) && !drawing.reason) return;
    drawSection(ctx, drawing, o, v);
  };
}

function placementBounds(section: Section, analysis: SectionAnalysis): Bounds {
  const b = { minX: Infinity, minY: Infinity, maxX: -Infinity, maxY: -Infinity };
  for (const placement of analysis.placements(section)) {
    for (const q of analysis.outline(placement)) {
      if (q.x < b.minX) b.minX = q.x;
      if (q.x > b.maxX) b.maxX = q.x;
      if (q.y < b.minY) b.minY = q.y;
      if (q.y > b.maxY) b.maxY = q.y;
    }
  }
  return b;
}

/**
 * The Konva shape of one section ({@link createSectionPainter}), for the active layer. Never
 * listening: the board hit-tests in the editor core.
 */
export function createSectionShape(section: Section, o: SectionShapeOptions): Konva.Shape {
  const paint = createSectionPainter(section, o);
  return new Konva.Shape({
    name: 'section',
    id: `section-${section.id}`,
    listening: false,
    perfectDrawEnabled: false,
    sceneFunc(context) {
      paint(context._context);
    },
  });
}
