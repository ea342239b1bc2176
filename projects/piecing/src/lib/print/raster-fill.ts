import type { Point } from '../document/index';
import { boundingRect, pointSegmentDistanceSq } from './layout-geometry';
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
  const { cols, rows, blocked } = grid;
  const mark = (r: number, c: number) => {
    blocked[r * cols + c] = 1;
  };
  coverRing(ring, grid.x0, grid.y0, grid.cellIn, cols, rows, reach, mark, mark);
}

/**
 * Visits the cells (centres on a raster from x0, y0) of a ring: `near` for each cell whose centre lies
 * within `reach` of the ring's outline, `inside` for each other cell whose centre is inside it. Works
 * along the outline and row by row across it, so it costs the ring's perimeter and area in cells,
 * not cells × edges. A cell may be visited more than once.
 */
function coverRing(
  ring: readonly Point[],
  x0: number,
  y0: number,
  cell: number,
  cols: number,
  rows: number,
  reach: number,
  near: (r: number, c: number) => void,
  inside: (r: number, c: number) => void,
): Uint8Array {
  const seen = new Uint8Array(cols * rows);
  const reach2 = reach * reach;
  const n = ring.length;
  for (let i = 0; i < n; i++) {
    const a = ring[i];
    const b = ring[(i + 1) % n];
    const c0 = Math.max(0, Math.floor((Math.min(a.x, b.x) - reach - x0) / cell));
    const c1 = Math.min(cols - 1, Math.ceil((Math.max(a.x, b.x) + reach - x0) / cell));
    const r0 = Math.max(0, Math.floor((Math.min(a.y, b.y) - reach - y0) / cell));
    const r1 = Math.min(rows - 1, Math.ceil((Math.max(a.y, b.y) + reach - y0) / cell));
    for (let r = r0; r <= r1; r++) {
      for (let c = c0; c <= c1; c++) {
        const k = r * cols + c;
        if (seen[k]) continue;
        if (pointSegmentDistanceSq({ x: x0 + (c + 0.5) * cell, y: y0 + (r + 0.5) * cell }, a, b) < reach2) {
          seen[k] = 1;
          near(r, c);
        }
      }
    }
  }
  if (n < 3) return seen;
  // Inside: crossings of each row's centre line (even–odd rule, as insideRing).
  const xs: number[] = [];
  for (let r = 0; r < rows; r++) {
    const y = y0 + (r + 0.5) * cell;
    xs.length = 0;
    for (let i = 0, j = n - 1; i < n; j = i++) {
      const p = ring[i];
      const q = ring[j];
      if (p.y > y !== q.y > y) xs.push(((q.x - p.x) * (y - p.y)) / (q.y - p.y) + p.x);
    }
    if (xs.length < 2) continue;
    xs.sort((u, v) => u - v);
    for (let k = 0; k + 1 < xs.length; k += 2) {
      // Centres strictly between the crossings.
      const cFrom = Math.max(0, Math.ceil((xs[k] - x0) / cell - 0.5 + 1e-12));
      const cTo = Math.min(cols - 1, Math.floor((xs[k + 1] - x0) / cell - 0.5 - 1e-12));
      for (let c = cFrom; c <= cTo; c++) {
        const idx = r * cols + c;
        if (seen[idx]) continue;
        seen[idx] = 1;
        inside(r, c);
      }
    }
  }
  return seen;
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
  coverRing(ring, box.x, box.y, cellIn, cols, rows, half, (r, c) => edge.push(r, c), (r, c) => inner.push(r, c));
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

