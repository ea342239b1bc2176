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
  /** Free cells from each cell rightwards along its row (0 where blocked); rebuilt when `stale`. */
  runs: Int32Array;
  stale: boolean;
}

/** Cells claimed by a shape, relative to its box's top-left cell. */
export interface ShapeMask {
  cols: number;
  rows: number;
  /** Row-major offsets (r, c) of claimed cells, boundary cells first (they meet obstacles first). */
  cells: Int32Array;
  /** The same cells as runs along rows: (row, first column, length) triples, built on first use. */
  spans?: Int32Array;
}

export function occupancyGrid(area: RectIn, cellIn: number): OccupancyGrid {
  const cols = Math.floor(area.width / cellIn + 1e-9);
  const rows = Math.floor(area.height / cellIn + 1e-9);
  return { x0: area.x, y0: area.y, cellIn, cols, rows, blocked: new Uint8Array(cols * rows), runs: new Int32Array(cols * rows), stale: true };
}

/** Blocks every cell whose centre is inside the ring or within `gapIn` + half a diagonal of it. */
export function blockRing(grid: OccupancyGrid, ring: readonly Point[], gapIn: number): void {
  const reach = gapIn + (grid.cellIn * Math.SQRT2) / 2;
  const { cols, rows, blocked } = grid;
  const mark = (r: number, c: number) => {
    blocked[r * cols + c] = 1;
  };
  coverRing(ring, grid.x0, grid.y0, grid.cellIn, cols, rows, reach, mark, mark);
  grid.stale = true;
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
): void {
  // Cells visited this call carry this call's stamp (one buffer for every call: no clearing, no garbage).
  if (stamps.length < cols * rows) stamps = new Uint32Array(cols * rows);
  if (stamp >= 0xfffffffe) {
    stamps.fill(0);
    stamp = 0;
  }
  const seen = stamps;
  const now = ++stamp;
  const centre = { x: 0, y: 0 };
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
        if (seen[k] === now) continue;
        centre.x = x0 + (c + 0.5) * cell;
        centre.y = y0 + (r + 0.5) * cell;
        if (pointSegmentDistanceSq(centre, a, b) < reach2) {
          seen[k] = now;
          near(r, c);
        }
      }
    }
  }
  if (n < 3) return;
  // Inside: crossings of each row's centre line (even–odd rule, as insideRing).
  const xs: number[] = [];
  let top = Infinity;
  let bottom = -Infinity;
  for (const p of ring) {
    if (p.y < top) top = p.y;
    if (p.y > bottom) bottom = p.y;
  }
  // Only rows whose centre line crosses the ring can hold inside cells.
  const rFrom = Math.max(0, Math.floor((top - y0) / cell - 0.5));
  const rTo = Math.min(rows - 1, Math.ceil((bottom - y0) / cell - 0.5));
  for (let r = rFrom; r <= rTo; r++) {
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
        if (seen[idx] === now) continue;
        seen[idx] = now;
        inside(r, c);
      }
    }
  }
}

let stamps = new Uint32Array(0);
let stamp = 0;

/**
 * The mask of a ring whose box starts at (0, 0); `growIn` widens the claim (when the ring is a
 * simplified stand-in for the real outline, by how far the real one may stray). Without `near`, only
 * the cells whose centres lie inside the ring: a hopeful mask, for finding spots that are then checked
 * against the real outlines.
 */
export function shapeMask(ring: readonly Point[], cellIn: number, growIn = 0, near = true): ShapeMask {
  const box = boundingRect(ring);
  const cols = Math.ceil((box.width + growIn) / cellIn - 1e-9);
  const rows = Math.ceil((box.height + growIn) / cellIn - 1e-9);
  const half = near ? (cellIn * Math.SQRT2) / 2 + growIn : 0;
  const edge: number[] = [];
  const inner: number[] = [];
  coverRing(ring, box.x, box.y, cellIn, cols, rows, half, (r, c) => edge.push(r, c), (r, c) => inner.push(r, c));
  return { cols, rows, cells: Int32Array.from([...edge, ...inner]) };
}

/**
 * The mask of several rings drawn in one piece's own frame, the piece's box being [0, width] × [0, height]
 * (a tile: its clipped outline, caption, marks and join lines); `growIn` as for {@link shapeMask}.
 */
export function ringsMask(rings: readonly (readonly Point[])[], width: number, height: number, cellIn: number, growIn = 0, near = true): ShapeMask {
  const cols = Math.ceil((width + growIn) / cellIn - 1e-9);
  const rows = Math.ceil((height + growIn) / cellIn - 1e-9);
  const half = near ? (cellIn * Math.SQRT2) / 2 + growIn : 0;
  const claimed = new Uint8Array(cols * rows);
  const claim = (r: number, c: number) => {
    claimed[r * cols + c] = 1;
  };
  for (const ring of rings) coverRing(ring, 0, 0, cellIn, cols, rows, half, claim, claim);
  const cells: number[] = [];
  for (let r = 0; r < rows; r++) for (let c = 0; c < cols; c++) if (claimed[r * cols + c]) cells.push(r, c);
  return { cols, rows, cells: Int32Array.from(cells) };
}

/** A mask's cells as runs along rows, (row, first column, length) triples. */
function spansOf(mask: ShapeMask): Int32Array {
  if (mask.spans) return mask.spans;
  const byRow: number[][] = Array.from({ length: mask.rows }, () => []);
  for (let k = 0; k < mask.cells.length; k += 2) byRow[mask.cells[k]].push(mask.cells[k + 1]);
  const out: number[] = [];
  byRow.forEach((cols, r) => {
    cols.sort((a, b) => a - b);
    for (let i = 0; i < cols.length; ) {
      let j = i;
      while (j + 1 < cols.length && cols[j + 1] <= cols[j] + 1) j++;
      out.push(r, cols[i], cols[j] - cols[i] + 1);
      i = j + 1;
    }
  });
  mask.spans = Int32Array.from(out);
  return mask.spans;
}

function refreshRuns(grid: OccupancyGrid): void {
  if (!grid.stale) return;
  const { cols, rows, blocked, runs } = grid;
  for (let r = 0; r < rows; r++) {
    let run = 0;
    for (let c = cols - 1; c >= 0; c--) {
      const k = r * cols + c;
      run = blocked[k] ? 0 : run + 1;
      runs[k] = run;
    }
  }
  grid.stale = false;
}

/**
 * The first free spot for a mask, row by row from the top-left (from a given row and column on), as a
 * grid (row, column), or null.
 * Each row of the mask is checked as runs of cells against the grid's free runs; where one fails at a
 * blocked cell, every column up to that cell fails too and the scan skips past it.
 */
export function findSpot(grid: OccupancyGrid, mask: ShapeMask, fromRow = 0, fromCol = 0): { row: number; col: number } | null {
  refreshRuns(grid);
  const { cols, rows, runs } = grid;
  const spans = spansOf(mask);
  for (let r0 = fromRow; r0 + mask.rows <= rows; r0++) {
    let c0 = r0 === fromRow ? fromCol : 0;
    scan: while (c0 + mask.cols <= cols) {
      for (let k = 0; k < spans.length; k += 3) {
        const free = runs[(r0 + spans[k]) * cols + c0 + spans[k + 1]];
        if (free < spans[k + 2]) {
          c0 += free + 1;
          continue scan;
        }
      }
      return { row: r0, col: c0 };
    }
  }
  return null;
}
