import Konva from 'konva';
import { polygonBounds, type Fabric, type Point, type Section } from '@seamwright/piecing';
import type { BoardPatch, BoardSewability, SectionAnalysis } from '../../core/public-api';
import { BOARD_COLOURS } from './board-colours';

/** What a section's node shows besides the section itself. */
export interface SectionNodeOptions {
  analysis: SectionAnalysis;
  fabrics: ReadonlyMap<string, Fabric>;
  selected: boolean;
  selectedPatchIndex: number | null;
  /** Cutting line of each placement, when the seam allowance preview is on. */
  allowanceIn: number | null;
  /** Pixels per inch now, for labels that keep their screen size. */
  scale: number;
  mirrored: boolean;
}

function flat(points: readonly Point[]): number[] {
  const out = new Array<number>(points.length * 2);
  for (let i = 0; i < points.length; i++) {
    out[2 * i] = points[i].x;
    out[2 * i + 1] = points[i].y;
  }
  return out;
}

/** Scale that keeps a label `1/scale` of the content transform, so it stays the same size on screen. */
export function labelScale(scale: number, mirrored: boolean): { x: number; y: number } {
  return { x: (mirrored ? -1 : 1) / scale, y: 1 / scale };
}

function patchFill(p: BoardPatch, fabrics: ReadonlyMap<string, Fabric>): string {
  if (p.stripSet) return fabrics.get(p.stripSet.strips[0]?.fabricId ?? '')?.colour ?? BOARD_COLOURS.emptyPatch;
  return (p.fabricId && fabrics.get(p.fabricId)?.colour) || BOARD_COLOURS.emptyPatch;
}

/** Smallest patch size on screen, in pixels, that still shows its number. */
const MIN_LABELLED_PATCH_PX = 26;

/** The smaller side of a patch's bounding box, in inches. */
function patchSizeIn(polygon: readonly Point[]): number {
  const b = polygonBounds(polygon);
  return Math.min(b.maxX - b.minX, b.maxY - b.minY);
}

function addLabel(group: Konva.Group, text: string, at: Point, o: SectionNodeOptions, colour: string = BOARD_COLOURS.label, sizeIn = Infinity): void {
  const s = labelScale(o.scale, o.mirrored);
  const node = new Konva.Text({
    name: 'patch-label',
    text,
    x: at.x,
    y: at.y,
    fontSize: 12,
    fontFamily: 'Roboto, sans-serif',
    fontStyle: 'bold',
    fill: colour,
    stroke: BOARD_COLOURS.labelHalo,
    strokeWidth: 3,
    fillAfterStrokeEnabled: true,
    scaleX: s.x,
    scaleY: s.y,
    listening: false,
    perfectDrawEnabled: false,
  });
  node.offsetX(node.width() / 2);
  node.offsetY(node.height() / 2);
  node.setAttr('patchSizeIn', sizeIn);
  node.visible(sizeIn * o.scale >= MIN_LABELLED_PATCH_PX);
  group.add(node);
}

/**
 * The Konva group of one section: its patches filled with their fabrics, the outline, the seams,
 * strip-set guide lines, patch numbers, the sewability failure, ring-repeat copies and (when asked)
 * the cutting line. Never listening: the board hit-tests in the editor core.
 */
export function createSectionNode(section: Section, o: SectionNodeOptions): Konva.Group {
  const group = new Konva.Group({ name: 'section', id: `section-${section.id}`, listening: false });
  const placements = o.analysis.placements(section);
  const sewability: BoardSewability = o.analysis.sewability(section);
  placements.forEach((placement, copyIndex) => {
    const copy = new Konva.Group({ listening: false, opacity: copyIndex === 0 ? 1 : 0.55 });
    const patches = o.analysis.patches(placement);
    const outline = o.analysis.outline(placement);
    for (const p of patches) {
      copy.add(
        new Konva.Line({
          name: 'patch',
          points: flat(p.polygon),
          closed: true,
          fill: patchFill(p, o.fabrics),
          stroke: BOARD_COLOURS.seam,
          strokeWidth: 1,
          strokeScaleEnabled: false,
          listening: false,
          perfectDrawEnabled: false,
        }),
      );
      if (p.stripBands) {
        const ring = p.polygon;
        const bands = new Konva.Group({
          listening: false,
          clipFunc: (ctx) => {
            ctx.beginPath();
            ring.forEach((q, i) => (i === 0 ? ctx.moveTo(q.x, q.y) : ctx.lineTo(q.x, q.y)));
            ctx.closePath();
          },
        });
        for (const band of p.stripBands) {
          bands.add(new Konva.Line({ points: flat(band.polygon), closed: true, fill: o.fabrics.get(band.fabricId)?.colour ?? BOARD_COLOURS.emptyPatch, listening: false, perfectDrawEnabled: false }));
        }
        copy.add(bands);
      }
      for (const [a, b] of p.guideLines) {
        copy.add(new Konva.Line({ points: [a.x, a.y, b.x, b.y], stroke: BOARD_COLOURS.guideLine, strokeWidth: 1.5, dash: [6, 3], strokeScaleEnabled: false, listening: false }));
      }
    }
    if (patches.length === 0 && outline.length > 2) {
      copy.add(new Konva.Line({ points: flat(outline), closed: true, fill: BOARD_COLOURS.emptyPatch, listening: false }));
    }
    copy.add(
      new Konva.Line({
        name: 'outline',
        points: flat(outline),
        closed: true,
        stroke: o.selected && copyIndex === 0 ? BOARD_COLOURS.selection : BOARD_COLOURS.ink,
        strokeWidth: o.selected && copyIndex === 0 ? 3 : 2,
        strokeScaleEnabled: false,
        listening: false,
        perfectDrawEnabled: false,
      }),
    );
    if (o.allowanceIn !== null) {
      const cut = o.analysis.cuttingLine(placement, o.allowanceIn);
      if (cut) copy.add(new Konva.Line({ name: 'cutting-line', points: flat(cut), closed: true, stroke: BOARD_COLOURS.cuttingLine, strokeWidth: 1, dash: [8, 4], strokeScaleEnabled: false, listening: false }));
    }
    if (copyIndex === 0) {
      for (const p of patches) {
        const failing = !sewability.ok && sewability.failingPatchNumber === p.number;
        if (failing) {
          copy.add(new Konva.Line({ name: 'failing-patch', points: flat(p.polygon), closed: true, stroke: BOARD_COLOURS.failing, strokeWidth: 3, dash: [7, 4], strokeScaleEnabled: false, listening: false }));
        }
        if (o.selected && o.selectedPatchIndex === p.index) {
          copy.add(new Konva.Line({ name: 'selected-patch', points: flat(p.polygon), closed: true, fill: 'rgba(31,122,140,0.18)', stroke: BOARD_COLOURS.selection, strokeWidth: 1.5, dash: [4, 3], strokeScaleEnabled: false, listening: false }));
        }
        addLabel(copy, p.label, p.labelPoint, o, failing ? BOARD_COLOURS.failing : BOARD_COLOURS.label, o.selected ? Infinity : patchSizeIn(p.polygon));
      }
      // The reason in words goes with the selected section; others show the outline and a red number.
      if (o.selected && !sewability.ok && sewability.reason) {
        const failing = patches.find((p) => p.number === sewability.failingPatchNumber);
        const at = failing?.labelPoint ?? outline[0];
        if (at) addReason(copy, sewability.reason, at, o);
      }
    }
    group.add(copy);
  });
  return group;
}

function addReason(group: Konva.Group, reason: string, at: Point, o: SectionNodeOptions): void {
  const s = labelScale(o.scale, o.mirrored);
  const label = new Konva.Label({ name: 'sewability-reason', x: at.x, y: at.y, scaleX: s.x, scaleY: s.y, listening: false });
  label.add(new Konva.Tag({ fill: '#fff4f0', stroke: BOARD_COLOURS.failing, strokeWidth: 1, cornerRadius: 3, listening: false }));
  label.add(new Konva.Text({ text: reason, width: 240, padding: 6, fontSize: 11, fontFamily: 'Roboto, sans-serif', fill: BOARD_COLOURS.failing, listening: false }));
  label.offsetY(-14);
  group.add(label);
}

/** Updates the labels of a section node after a zoom, without rebuilding it. */
export function rescaleLabels(group: Konva.Group, scale: number, mirrored: boolean): void {
  const s = labelScale(scale, mirrored);
  group.find('.patch-label, .sewability-reason').forEach((n) => {
    n.scale(s);
    const sizeIn = n.getAttr('patchSizeIn');
    if (typeof sizeIn === 'number') n.visible(sizeIn * scale >= MIN_LABELLED_PATCH_PX);
  });
}
