// eslint-disable-next-line @typescript-eslint/triple-slash-reference -- ambient types for the ES build, a type-only file
/// <reference path="./maxrects-packer-esm.d.ts" />
// maxrects-packer's "main" is a UMD file inside a "type": "module" package, which Node's ESM loader
// reads as an empty module; its ES build works in Node, vitest and the browser alike.
import { MaxRectsBin, PACKING_LOGIC, Rectangle } from 'maxrects-packer/dist/maxrects-packer.mjs';
import type { Point } from '../document/index';
import { blockRing, findSpot, occupancyGrid, type ShapeMask } from './raster-fill';
import type { PaperName, RectIn, SheetOrientation } from './paper';
import { cornerBlockDepthIn, cornerBlockTopIn, ITEM_GAP_IN, sheetFrame, TEST_BLOCK_GAP_IN, type SheetFrame } from './sheet-frame';

/** Something to place on a sheet: its size in inches and whether a quarter turn is allowed. */
export interface PackItem<T> {
  width: number;
  height: number;
  quarterTurns: boolean;
  data: T;
  /** Smaller items this one may be broken into when that fills a sheet better (a nested pair → two copies). */
  parts?: PackItem<T>[];
  /** Area it really covers (inside its outlines), square inches; its box area when absent. */
  areaSqIn?: number;
  /**
   * Set when its sheet draws something in the header's middle (a tile map): such an item never goes on a
   * sheet whose test squares are raised into the margin band, where the header's text takes that room.
   */
  keepsHeader?: boolean;
}

/** Where an item landed: top-left in sheet inches, whether turned a quarter turn, placed size. */
export interface PackedItem<T> {
  item: PackItem<T>;
  x: number;
  y: number;
  turned: boolean;
  width: number;
  height: number;
}

/** One packed sheet; its frame's test block is where the block landed. */
export interface PackedSheet<T> {
  frame: SheetFrame;
  items: PackedItem<T>[];
}

interface Try<T> {
  placed: PackedItem<T>[];
  /** Where the test squares went; side by side when wider than tall, else one above the other. */
  block: { x: number; y: number; width: number; height: number };
}

const ORDERS: Array<(a: PackItem<unknown>, b: PackItem<unknown>) => number> = [
  (a, b) => b.width * b.height - a.width * a.height,
  (a, b) => Math.max(b.width, b.height) - Math.max(a.width, a.height),
  (a, b) => Math.min(b.width, b.height) - Math.min(a.width, a.height),
];
const LOGICS = [PACKING_LOGIC.MAX_EDGE, PACKING_LOGIC.MAX_AREA];

/**
 * Packs items onto as few sheets as it can, one sheet at a time: for each new sheet it tries both
 * orientations, a few item orders and two maxrects heuristics, with the test-square block placed
 * first (top-left) or last (in whatever room is left), keeps the try that covers the most area, and
 * moves on with what is left.
 * Deterministic: ties are broken by the fixed try order, never by chance.
 */
/**
 * The outlines a packed item really covers on the sheet (cutting lines, caption strips), so the test
 * squares may sit in the empty corners of its box.
 */
export type ItemOutlines<T> = (placed: PackedItem<T>) => Point[][];

/**
 * Fits more items into the gaps of a packed sheet (looking at real outlines, not boxes). Returns what
 * it placed, each with the item (or part of an item) of `left` it used up.
 */
export type SheetFill<T> = (
  frame: SheetFrame,
  placed: readonly PackedItem<T>[],
  left: readonly PackItem<T>[],
  lead?: number,
) => Array<{ taken: PackItem<T>; packed: PackedItem<T> }>;

export function packSheets<T>(
  items: readonly PackItem<T>[],
  paper: PaperName,
  marginIn: number,
  outlines?: ItemOutlines<T>,
  fill?: SheetFill<T>,
  quick = false,
): PackedSheet<T>[] {
  return packSheetsWithin(items, paper, marginIn, Infinity, outlines, fill, quick)!;
}

/**
 * {@link packSheets}, giving up (null) as soon as `maxSheets` sheets are full and items are left: for
 * trying other pieces against a packing already found, where only fewer sheets would count.
 */
export function packSheetsWithin<T>(
  items: readonly PackItem<T>[],
  paper: PaperName,
  marginIn: number,
  maxSheets: number,
  outlines?: ItemOutlines<T>,
  fill?: SheetFill<T>,
  quick = false,
): PackedSheet<T>[] | null {
  const frames: Record<SheetOrientation, SheetFrame> = {
    portrait: sheetFrame(paper, 'portrait', marginIn),
    landscape: sheetFrame(paper, 'landscape', marginIn),
  };
  for (const item of items) {
    if (!fitsAlone(item, frames.portrait) && !fitsAlone(item, frames.landscape)) {
      throw new RangeError(`a ${item.width.toFixed(2)} × ${item.height.toFixed(2)} in. piece does not fit on one sheet`);
    }
  }
  // Items still to place, in their original order (orders are re-derived from it each sheet).
  let left: PackItem<T>[] = [...items];
  const parentOf = new Map<PackItem<T>, PackItem<T>>();
  for (const item of items) for (const part of item.parts ?? []) parentOf.set(part, item);
  const sheets: PackedSheet<T>[] = [];
  while (left.length > 0) {
    const tries: Array<{ frame: SheetFrame; tried: Try<T> | Omit<Try<T>, 'block'>; area: number }> = [];
    const whole = left;
    const broken = left.flatMap((i) => i.parts ?? [i]);
    const variants = whole.some((i) => i.parts) ? [whole, broken] : [whole];
    search: for (const orientation of ['portrait', 'landscape'] as const) {
      const frame = frames[orientation];
      const seen: PackItem<T>[][] = [];
      for (const order of quick ? ORDERS.slice(0, 1) : ORDERS) for (const variant of variants) {
        const sorted = [...variant].sort(order);
        // Orders that come out the same (all items alike, say) are packed once.
        if (seen.some((o) => o.length === sorted.length && o.every((item, i) => item === sorted[i]))) continue;
        seen.push(sorted);
        const remaining = candidates(sorted, frame);
        for (const logic of quick ? LOGICS.slice(0, 1) : LOGICS) for (const stand of STANDS) {
          // Box area placed with no room kept for the block ('free'), and the best with the block inside the margins.
          let freeArea = -1;
          let marginArea = -1;
          for (const block of quick ? QUICK_BLOCK_MODES : BLOCK_MODES) {
            const raised = block === 'edge' || block === 'edge-band';
            // Raising the block helps only where keeping it inside the margins cost template area.
            if (raised && marginArea >= freeArea - 1e-9) continue;
            const tried = packOne(remaining, frame, logic, block, stand);
            if (!tried) continue;
            // Ranked by the box area placed (the gaps are filled by outlines afterwards).
            const area = tried.placed.reduce((s, p) => s + p.width * p.height, 0);
            if (block === 'free') freeArea = area;
            else if (!raised) marginArea = Math.max(marginArea, area);
            tries.push({ frame, tried, area });
            // Everything left fits this sheet, test block included: no try can do better.
            if ('block' in tried && tried.placed.length === sorted.length && variant === whole) break search;
            // Packed freely, the boxes left room for the block: reserving room first would not place more.
            if (block === 'free' && 'block' in tried) break;
          }
        }
      }
    }
    // Best first (stable sort keeps the fixed try order on ties); a try whose boxes left no room for
    // the test block counts only if the block finds a spot clear of the real outlines.
    tries.sort((a, b) => b.area - a.area);
    let chosen: { frame: SheetFrame; tried: Try<T> } | null = null;
    let scans = 0;
    for (const t of tries) {
      if ('block' in t.tried) {
        chosen = { frame: t.frame, tried: t.tried };
        break;
      }
      if (!outlines || ++scans > 2) continue; // a raster scan per try: only for the best few
      const spot = findBlockSpot(t.frame, t.tried.placed, outlines);
      if (spot) {
        chosen = { frame: t.frame, tried: { placed: t.tried.placed, block: spot } };
        break;
      }
    }
    if (!chosen || chosen.tried.placed.length === 0) throw new RangeError('packing made no progress');
    // Test squares raised into the margin band only where that places more: the same pieces packed with
    // no room kept for the block may leave room for it among their real outlines, inside the margins.
    if (outlines && chosen.tried.block.y < chosen.frame.printable.y - 1e-9) {
      const same = chosen.tried.placed.map((p) => p.item);
      rescan: for (const logic of LOGICS) for (const stand of STANDS) {
        const tried = packOne(same, chosen.frame, logic, 'free', stand);
        if (!tried || tried.placed.length < same.length) continue;
        const block = 'block' in tried ? tried.block : findBlockSpot(chosen.frame, tried.placed, outlines);
        if (block) {
          chosen = { frame: chosen.frame, tried: { placed: tried.placed, block } };
          break rescan;
        }
      }
    }
    // Boxes by maxrects, then the gaps filled by real outlines.
    const frame = { ...chosen.frame, testBlock: chosen.tried.block };
    const after = remainingAfter(left, chosen.tried.placed.map((p) => p.item), parentOf);
    const extra = fill && after.length > 0 ? fill(frame, chosen.tried.placed, after) : [];
    let sheet: PackedSheet<T> = { frame, items: [...chosen.tried.placed, ...extra.map((e) => e.packed)] };
    let taken = [...chosen.tried.placed.map((p) => p.item), ...extra.map((e) => e.taken)];
    // The same sheet laid out by real outlines alone (the test squares in the corner beside the header's
    // text): kept where it covers more template area than the boxes and their gaps did.
    // Only where something is left over and some piece leaves room inside its box (arcs, wedges,
    // triangles): boxes pack boxes best.
    if (fill && remainingAfter(left, taken, parentOf).length > 0 && left.some(roomInside)) {
      let bestArea = coveredArea(taken) + 1e-6;
      for (const orientation of ['portrait', 'landscape'] as const) for (let lead = 0; lead < NEST_LEADS; lead++) {
        const f = { ...frames[orientation], testBlock: cornerBlock(frames[orientation]) };
        const nested = fill(f, [], left, lead);
        if (nested.length === 0) continue;
        const area = coveredArea(nested.map((e) => e.taken));
        if (area > bestArea) {
          bestArea = area;
          sheet = { frame: f, items: nested.map((e) => e.packed) };
          taken = nested.map((e) => e.taken);
        }
      }
    }
    left = remainingAfter(left, taken, parentOf);
    sheets.push(sheet);
    if (sheets.length >= maxSheets && left.length > 0) return null;
  }
  return sheets;
}

/** Laying a sheet out by outlines alone, each of this many kinds of piece (the largest) is tried first. */
const NEST_LEADS = 2;

/** Whether an item's outlines cover clearly less than its box (so outlines may interlock where boxes cannot). */
function roomInside(item: PackItem<unknown>): boolean {
  return (item.parts ?? [item]).some((p) => p.areaSqIn !== undefined && p.areaSqIn < 0.95 * p.width * p.height);
}

/** Template area the items cover (inside their outlines where known), square inches. */
function coveredArea(items: readonly PackItem<unknown>[]): number {
  return items.reduce((s, i) => s + (i.areaSqIn ?? i.width * i.height), 0);
}

/** The test block side by side in the top-left corner, its top at the printable area's (beside the header's text). */
function cornerBlock(frame: SheetFrame): RectIn {
  return { x: frame.content.x, y: cornerBlockTopIn(frame, 'header'), width: frame.testBlock.width, height: frame.testBlock.height };
}

/** Up to this many items left, every try offers them all to the sheet. */
const CANDIDATES_ALL = 48;
/** Beyond that, a try offers the first items of its order whose boxes cover the sheet this many times over. */
const CANDIDATE_SHEETS = 3;

/**
 * The items a try offers one sheet: all of them for a short list; for a long one (a large pattern) the first
 * {@link CANDIDATES_ALL} of the order and as many more as it takes for their boxes to cover the content area
 * {@link CANDIDATE_SHEETS} times. A sheet holds no more than its area, so the items further down the order
 * could only go in gaps, which the outline fill looks at afterwards; without the cap each sheet would look at
 * every item left and planning would grow with the square of the pattern.
 */
function candidates<T>(order: readonly PackItem<T>[], frame: SheetFrame): readonly PackItem<T>[] {
  if (order.length <= CANDIDATES_ALL) return order;
  const enough = CANDIDATE_SHEETS * frame.content.width * frame.content.height;
  let area = 0;
  let n = 0;
  while (n < order.length && (n < CANDIDATES_ALL || area < enough)) {
    area += order[n].width * order[n].height;
    n++;
  }
  return order.slice(0, n);
}

/** What is left after a sheet took `placed`: whole items gone, broken items down to their unplaced parts. */
function remainingAfter<T>(left: readonly PackItem<T>[], placed: readonly PackItem<T>[], parentOf: Map<PackItem<T>, PackItem<T>>): PackItem<T>[] {
  const used = new Set(placed);
  const out: PackItem<T>[] = [];
  for (const item of left) {
    if (used.has(item)) continue;
    const parts = item.parts?.filter((p) => parentOf.get(p) === item);
    if (parts && parts.some((p) => used.has(p))) {
      out.push(...parts.filter((p) => !used.has(p)));
      continue;
    }
    out.push(item);
  }
  return out;
}

function fitsAlone(item: PackItem<unknown>, frame: SheetFrame): boolean {
  return BLOCK_MODES.some((mode) => {
    const tried = packOne([item], frame, PACKING_LOGIC.MAX_EDGE, mode);
    return tried !== null && 'block' in tried && tried.placed.length === 1;
  });
}

/** Raster cell for finding room for the test block among real outlines, inches. */
const BLOCK_CELL_IN = 0.1;

/**
 * The first spot (row by row from the top-left, on a 0.1 in. raster) where the test block, side by
 * side or stacked, keeps the gap from every outline; null when there is none.
 */
function findBlockSpot<T>(frame: SheetFrame, placed: readonly PackedItem<T>[], outlines: ItemOutlines<T>): RectIn | null {
  const grid = occupancyGrid(frame.content, BLOCK_CELL_IN);
  // Outlines may be simplified within 0.02 in.: widen the gap to match.
  for (const p of placed) for (const ring of outlines(p)) blockRing(grid, ring, ITEM_GAP_IN + 0.02);
  const { width, height } = frame.testBlock;
  for (const [w, h] of [[width, height], [height, width]]) {
    const spot = findSpot(grid, rectMask(w, h, BLOCK_CELL_IN));
    if (spot) return { x: grid.x0 + spot.col * BLOCK_CELL_IN, y: grid.y0 + spot.row * BLOCK_CELL_IN, width: w, height: h };
  }
  return null;
}

/** The cells a w × h rectangle at a cell corner claims (every cell it reaches into). */
function rectMask(w: number, h: number, cell: number): ShapeMask {
  const cols = Math.ceil(w / cell - 1e-9);
  const rows = Math.ceil(h / cell - 1e-9);
  const cells: number[] = [];
  for (let r = 0; r < rows; r++) for (let c = 0; c < cols; c++) cells.push(r, c);
  return { cols, rows, cells: Int32Array.from(cells) };
}

/**
 * Where the test block may go on a sheet:
 * - 'corner': side by side in the top-left corner of the printable area, its top in the header band
 *   (the header's text then starts to the right of it), so it takes only half an inch of content;
 * - 'band': the same corner, with nothing beside the block (rows of templates start below it);
 * - 'edge-band' and 'edge': 'band' and 'corner' with the block raised into the margin band, its top
 *   EDGE_SAFE_IN (¼ in.) from the paper's edge, so it takes less of the content area still (tried last:
 *   ties keep the block inside the margins, so it goes up only where that places more);
 * - 'free': nowhere at first — the boxes are packed alone and the block goes in any free room left.
 */
type BlockMode = 'corner' | 'band' | 'edge' | 'edge-band' | 'free';
const BLOCK_MODES: readonly BlockMode[] = ['free', 'band', 'corner', 'edge-band', 'edge'];
const QUICK_BLOCK_MODES: readonly BlockMode[] = ['free', 'corner', 'edge'];
const STANDS = [false, true];

/**
 * One maxrects packing of `items` (in order) on a sheet, the test block as `blockAt` says. With
 * `stand`, items that may turn are offered standing (long side down), which decides how maxrects
 * turns them when both ways score alike.
 */
function packOne<T>(items: readonly PackItem<T>[], frame: SheetFrame, logic: PACKING_LOGIC, blockAt: BlockMode, stand = false): Try<T> | Omit<Try<T>, 'block'> | null {
  const g = ITEM_GAP_IN;
  const c = frame.content;
  // Every piece grows by the gap and so does the bin: pieces keep the gap between them, not at the edge.
  const bin = new MaxRectsBin<Rectangle>(c.width + g, c.height + g, 0, {
    smart: false,
    pot: false,
    square: false,
    allowRotation: true,
    logic,
  });
  const tb = frame.testBlock;
  const [bw, bh] = [tb.width, tb.height];
  let block: RectIn | null = null;
  if (blockAt !== 'free') {
    // The block hangs from the top of the printable area (or of the room for test squares, 'edge'); it
    // takes `depth` of the content area, its gap included (bin coordinates: every box is grown by g).
    const hang = blockAt === 'edge' || blockAt === 'edge-band' ? 'edge' : 'header';
    const top = cornerBlockTopIn(frame, hang);
    const depth = cornerBlockDepthIn(frame, hang, bh);
    if (hang === 'edge' && top >= frame.header.y - 1e-9) return null; // no margin band: the same as 'corner'
    block = { x: c.x, y: top, width: bw, height: bh };
    if (depth > 0) {
      const below = new Rectangle(c.width + g, c.height + g - depth, 0, depth);
      bin.freeRects = blockAt === 'band' || blockAt === 'edge-band' ? [below] : [new Rectangle(c.width + g - (bw + TEST_BLOCK_GAP_IN), c.height + g, bw + TEST_BLOCK_GAP_IN, 0), below];
    }
  }
  const placed: PackedItem<T>[] = [];
  const raised = blockAt === 'edge' || blockAt === 'edge-band';
  for (const item of items) {
    if (raised && item.keepsHeader) continue;
    const swap = stand && item.quarterTurns && item.width > item.height;
    const rect = swap ? new Rectangle(item.height + g, item.width + g) : new Rectangle(item.width + g, item.height + g);
    rect.allowRotation = item.quarterTurns;
    const put = bin.add(rect);
    if (!put) continue;
    placed.push({
      item,
      x: c.x + put.x,
      y: c.y + put.y,
      turned: (put.rot === true) !== swap,
      width: put.width - g,
      height: put.height - g,
    });
  }
  if (block) return { placed, block };
  // Room for the block among the free rectangles maxrects kept (maximal, so one holds it if any room does).
  for (const [w, h] of [[tb.width, tb.height], [tb.height, tb.width]]) {
    const depth = cornerBlockDepthIn(frame, 'header', h);
    // The corner first: there the block hangs into the header band.
    const corner = bin.freeRects.find((f) => f.x <= 1e-9 && f.y <= 1e-9 && f.width >= w + TEST_BLOCK_GAP_IN - 1e-9 && f.height >= depth - 1e-9);
    if (corner) return { placed, block: { x: c.x, y: frame.header.y, width: w, height: h } };
  }
  for (const [w, h] of [[tb.width, tb.height], [tb.height, tb.width]]) {
    const room = bin.freeRects.find((f) => f.width >= w + g - 1e-9 && f.height >= h + g - 1e-9);
    if (room) return { placed, block: { x: c.x + room.x, y: c.y + room.y, width: w, height: h } };
  }
  return { placed };
}
