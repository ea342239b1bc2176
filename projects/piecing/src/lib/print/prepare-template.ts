import type { Point } from '../document/index';
import { radToDeg } from '../geometry/index';
import { applyAffine, compose, IDENTITY, MIRROR_X, rotation, translation, type Affine } from './affine';
import { boundingRect, clippedBounds, minimumAreaTurn } from './layout-geometry';
import type { RectIn } from './paper';
import type { PrintTemplate } from './template-model';

/** Clearance kept between a template's cutting line and the edge of its box, inches (line width). */
export const TEMPLATE_CLEARANCE_IN = 0.02;

/**
 * A template mirrored (when asked) and turned for the sheet, with its box moved to the origin:
 * `frame` maps the drawing plane onto [0, width] × [0, height].
 */
export interface PreparedTemplate {
  template: PrintTemplate;
  frame: Affine;
  turnDeg: number;
  width: number;
  height: number;
  /** Whether the packer may still turn it by a quarter turn. */
  quarterTurns: boolean;
  /** Cutting line in the frame. */
  ring: Point[];
}

/**
 * Mirrors the template when `mirrored`, then turns it: arcs and wedges by the angle that gives the
 * smallest box, straight sections not at all (the packer may still turn those by 90°).
 */
export function prepareTemplate(template: PrintTemplate, mirrored: boolean, extraTurnRad = 0): PreparedTemplate {
  const base = mirrored ? MIRROR_X : IDENTITY;
  const mirroredRing = template.cuttingLine.map((p) => applyAffine(base, p));
  const turn = (template.freeRotation ? minimumAreaTurn(mirroredRing) : 0) + extraTurnRad;
  const turned = compose(rotation(turn), base);
  const box = boundingRect(template.cuttingLine.map((p) => applyAffine(turned, p)));
  const frame = compose(translation(TEMPLATE_CLEARANCE_IN - box.x, TEMPLATE_CLEARANCE_IN - box.y), turned);
  return {
    template,
    frame,
    turnDeg: normaliseDeg(radToDeg(turn)),
    width: box.width + 2 * TEMPLATE_CLEARANCE_IN,
    height: box.height + 2 * TEMPLATE_CLEARANCE_IN,
    quarterTurns: true,
    ring: template.cuttingLine.map((p) => applyAffine(frame, p)),
  };
}

function normaliseDeg(deg: number): number {
  const d = ((deg % 360) + 360) % 360;
  return Math.abs(d - 360) < 1e-9 ? 0 : d;
}

/** One tile of a grid over a prepared template, in its frame. */
export interface TileCell {
  row: number;
  column: number;
  /** The grid cell, overlap included. */
  cell: RectIn;
  /** The part of the cell the template reaches into (what gets printed). */
  used: RectIn;
}

/** A grid of tiles over a prepared template. */
export interface TileGrid {
  prepared: PreparedTemplate;
  rows: number;
  columns: number;
  overlapIn: number;
  tiles: TileCell[];
}

/**
 * Splits a prepared template into a grid whose cells are at most `maxWidth` × `maxHeight`, neighbours
 * overlapping by `overlapIn`. Cells the cutting line does not reach are left out; every other cell is
 * trimmed to what it holds.
 */
export function tileTemplate(prepared: PreparedTemplate, maxWidth: number, maxHeight: number, overlapIn: number): TileGrid | null {
  if (maxWidth <= overlapIn * 2 || maxHeight <= overlapIn * 2) return null;
  const columns = Math.max(1, Math.ceil((prepared.width - overlapIn) / (maxWidth - overlapIn) - 1e-9));
  const rows = Math.max(1, Math.ceil((prepared.height - overlapIn) / (maxHeight - overlapIn) - 1e-9));
  return tileGrid(prepared, columns, rows, overlapIn);
}

/** A grid of `columns` × `rows` equal cells over a prepared template, neighbours overlapping by `overlapIn`. */
export function tileGrid(prepared: PreparedTemplate, columns: number, rows: number, overlapIn: number): TileGrid {
  return tileGridFromSpans(prepared, equalSpans(prepared.width, columns, overlapIn), equalSpans(prepared.height, rows, overlapIn), overlapIn);
}

/** `count` equal spans over [0, length], neighbours overlapping by `overlapIn`. */
export function equalSpans(length: number, count: number, overlapIn: number): Array<[number, number]> {
  const cell = count === 1 ? length : (length + (count - 1) * overlapIn) / count;
  return Array.from({ length: count }, (_, k) => [k * (cell - overlapIn), k * (cell - overlapIn) + cell] as [number, number]);
}

/**
 * A grid over a prepared template from its column spans (x from–to) and row spans (y from–to), which
 * the caller makes overlap. Cells the cutting line does not reach are left out; every other cell is
 * trimmed to what it holds.
 */
export function tileGridFromSpans(prepared: PreparedTemplate, columns: ReadonlyArray<[number, number]>, rows: ReadonlyArray<[number, number]>, overlapIn: number): TileGrid {
  const tiles: TileCell[] = [];
  rows.forEach(([y0, y1], r) => {
    columns.forEach(([x0, x1], c) => {
      const cell: RectIn = { x: x0, y: y0, width: x1 - x0, height: y1 - y0 };
      const reached = clippedBounds(prepared.ring, cell);
      if (reached) tiles.push({ row: r + 1, column: c + 1, cell, used: grow(reached, cell) });
    });
  });
  return { prepared, rows: rows.length, columns: columns.length, overlapIn, tiles };
}

/** The reached box grown by the clearance, kept inside the cell. */
function grow(box: RectIn, cell: RectIn): RectIn {
  const x0 = Math.max(cell.x, box.x - TEMPLATE_CLEARANCE_IN);
  const y0 = Math.max(cell.y, box.y - TEMPLATE_CLEARANCE_IN);
  const x1 = Math.min(cell.x + cell.width, box.x + box.width + TEMPLATE_CLEARANCE_IN);
  const y1 = Math.min(cell.y + cell.height, box.y + box.height + TEMPLATE_CLEARANCE_IN);
  return { x: x0, y: y0, width: x1 - x0, height: y1 - y0 };
}

/** Intersection of two rectangles, or null when they only touch or miss. */
export function intersectRects(p: RectIn, q: RectIn): RectIn | null {
  const x0 = Math.max(p.x, q.x);
  const y0 = Math.max(p.y, q.y);
  const x1 = Math.min(p.x + p.width, q.x + q.width);
  const y1 = Math.min(p.y + p.height, q.y + q.height);
  return x1 - x0 > 1e-9 && y1 - y0 > 1e-9 ? { x: x0, y: y0, width: x1 - x0, height: y1 - y0 } : null;
}
