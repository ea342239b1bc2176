import type { Point } from '../document/index';
import { boundingRect, distanceToRing, insideRing } from './layout-geometry';
import type { RectIn } from './paper';

/*
 * A conservative raster of the free room on a sheet, for fitting more templates into the gaps left
 * between boxes (the empty corners of arcs and wedges). A cell is blocked when anything already
 * placed comes within the gap (plus half a cell diagonal) of its centre; a shape claims every cell
 * whose centre lies within half a diagonal of it. So a shape whose cells are all free keeps at least
 * the gap from everything placed.
 */

export interface OccupancyGrid {
  x0: number;
  y0: number;
  cellIn: number;
  cols: number;
  rows: number;
  blocked: Uint8Array;
}

/** Cells claimed by a shape, relative to its box's top-left cell. */
export interface ShapeMask {
  cols: number;
  rows: number;
  /** Row-major offsets (r, c) of claimed cells, boundary cells first (they meet obstacles first). */
  cells: Int32Array;
}

export function occupancyGrid(area: RectIn, cellIn: number): OccupancyGrid {
  const cols = Math.floor(area.width / cellIn + 1e-9);
  const rows = Math.floor(area.height / cellIn + 1e-9);
  return { x0: area.x, y0: area.y, cellIn, cols, rows, blocked: new Uint8Array(cols * rows) };
}

/** Blocks every cell whose centre is inside the ring or within `gapIn` + half a diagonal of it. */
export function blockRing(grid: OccupancyGrid, ring: readonly Point[], gapIn: number): void {
  const reach = gapIn + (grid.cellIn * Math.SQRT2) / 2;
  const box = boundingRect(ring);
  const c0 = Math.max(0, Math.floor((box.x - reach - grid.x0) / grid.cellIn));
  const c1 = Math.min(grid.cols - 1, Math.ceil((box.x + box.width + reach - grid.x0) / grid.cellIn));
  const r0 = Math.max(0, Math.floor((box.y - reach - grid.y0) / grid.cellIn));
  const r1 = Math.min(grid.rows - 1, Math.ceil((box.y + box.height + reach - grid.y0) / grid.cellIn));
  for (let r = r0; r <= r1; r++) {
    for (let c = c0; c <= c1; c++) {
      const i = r * grid.cols + c;
      if (grid.blocked[i]) continue;
      const p = { x: grid.x0 + (c + 0.5) * grid.cellIn, y: grid.y0 + (r + 0.5) * grid.cellIn };
      if (insideRing(p, ring) || distanceToRing(p, ring) < reach) grid.blocked[i] = 1;
    }
  }
}

/**
 * The mask of a ring whose box starts at (0, 0); `growIn` widens the claim (when the ring is a
 * simplified stand-in for the real outline, by how far the real one may stray).
 */
export function shapeMask(ring: readonly Point[], cellIn: number, growIn = 0): ShapeMask {
  const box = boundingRect(ring);
  const cols = Math.ceil((box.width + growIn) / cellIn - 1e-9);
  const rows = Math.ceil((box.height + growIn) / cellIn - 1e-9);
  const half = (cellIn * Math.SQRT2) / 2 + growIn;
  const edge: number[] = [];
  const inner: number[] = [];
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < cols; c++) {
      const p = { x: box.x + (c + 0.5) * cellIn, y: box.y + (r + 0.5) * cellIn };
      const inside = insideRing(p, ring);
      const d = distanceToRing(p, ring);
      if (inside && d >= half) inner.push(r, c);
      else if (inside || d < half) edge.push(r, c);
    }
  }
  return { cols, rows, cells: Int32Array.from([...edge, ...inner]) };
}

/** The first free spot for a mask, row by row from the top-left, as a grid (row, column), or null. */
export function findSpot(grid: OccupancyGrid, mask: ShapeMask): { row: number; col: number } | null {
  const { cols, rows, blocked } = grid;
  const cells = mask.cells;
  for (let r0 = 0; r0 + mask.rows <= rows; r0++) {
    for (let c0 = 0; c0 + mask.cols <= cols; c0++) {
      let free = true;
      for (let k = 0; k < cells.length; k += 2) {
        if (blocked[(r0 + cells[k]) * cols + c0 + cells[k + 1]]) {
          free = false;
          break;
        }
      }
      if (free) return { row: r0, col: c0 };
    }
  }
  return null;
}

