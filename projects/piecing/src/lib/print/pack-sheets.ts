// eslint-disable-next-line @typescript-eslint/triple-slash-reference -- ambient types for the ES build, a type-only file
/// <reference path="./maxrects-packer-esm.d.ts" />
// maxrects-packer's "main" is a UMD file inside a "type": "module" package, which Node's ESM loader
// reads as an empty module; its ES build works in Node, vitest and the browser alike.
import { MaxRectsBin, PACKING_LOGIC, Rectangle } from 'maxrects-packer/dist/maxrects-packer.mjs';
import type { Point } from '../document/index';
import { boundingRect } from './layout-geometry';
import { separated } from './nest-pair';
import type { PaperName, RectIn, SheetOrientation } from './paper';
import { ITEM_GAP_IN, sheetFrame, type SheetFrame } from './sheet-frame';

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
) => Array<{ taken: PackItem<T>; packed: PackedItem<T> }>;

export function packSheets<T>(
  items: readonly PackItem<T>[],
  paper: PaperName,
  marginIn: number,
  outlines?: ItemOutlines<T>,
  fill?: SheetFill<T>,
): PackedSheet<T>[] {
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
    for (const orientation of ['portrait', 'landscape'] as const) {
      const frame = frames[orientation];
      for (const order of ORDERS) for (const variant of variants) {
        const remaining = [...variant].sort(order);
        for (const logic of LOGICS) {
          for (const block of outlines ? (['first', 'last', 'free'] as const) : (['first', 'last'] as const)) {
            const tried = packOne(remaining, frame, logic, block);
            if (!tried) continue;
            const area = tried.placed.reduce((s, p) => s + p.width * p.height, 0);
            tries.push({ frame, tried, area });
          }
        }
      }
    }
    // Best first (stable sort keeps the fixed try order on ties); a try that left the test block out
    // counts only if the block finds a spot clear of the real outlines.
    tries.sort((a, b) => b.area - a.area);
    let chosen: { frame: SheetFrame; tried: Try<T> } | null = null;
    let scans = 0;
    for (const t of tries) {
      if ('block' in t.tried) {
        chosen = { frame: t.frame, tried: t.tried };
        break;
      }
      if (++scans > 4) continue; // scanning is the slow part: only for the few best tries
      const spot = findBlockSpot(t.frame, t.tried.placed, outlines!);
      if (spot) {
        chosen = { frame: t.frame, tried: { placed: t.tried.placed, block: spot } };
        break;
      }
    }
    const results: Array<{ frame: SheetFrame; items: PackedItem<T>[]; taken: PackItem<T>[] }> = [];
    if (chosen && chosen.tried.placed.length > 0) {
      // Boxes by maxrects, then the gaps filled by real outlines.
      const frame = { ...chosen.frame, testBlock: { ...chosen.frame.testBlock, ...chosen.tried.block } };
      const after = remainingAfter(left, chosen.tried.placed.map((p) => p.item), parentOf);
      const extra = fill && after.length > 0 ? fill(frame, chosen.tried.placed, after) : [];
      results.push({
        frame,
        items: [...chosen.tried.placed, ...extra.map((e) => e.packed)],
        taken: [...chosen.tried.placed.map((p) => p.item), ...extra.map((e) => e.taken)],
      });
    }
    if (results.length === 0) throw new RangeError('packing made no progress');
    const covered = (r: (typeof results)[number]) => r.items.reduce((s, p) => s + (p.item.areaSqIn ?? p.width * p.height), 0);
    let best = results[0];
    for (const r of results.slice(1)) if (covered(r) > covered(best) + 1e-9) best = r;
    left = remainingAfter(left, best.taken, parentOf);
    sheets.push({ frame: best.frame, items: best.items });
  }
  return sheets;
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
  return (packOne([item], frame, PACKING_LOGIC.MAX_EDGE, 'first')?.placed.length ?? 0) === 1;
}

/** The first spot (row by row from the top-left, 0.1 in. steps) where the test block clears every outline. */
function findBlockSpot<T>(frame: SheetFrame, placed: readonly PackedItem<T>[], outlines: ItemOutlines<T>): Try<T>['block'] | null {
  const obstacles = placed.flatMap((p) => outlines(p)).map((ring) => ({ ring, box: boundingRect(ring) }));
  const { width, height } = frame.testBlock;
  return scanBlock(frame, obstacles, width, height) ?? scanBlock(frame, obstacles, height, width);
}

function scanBlock(frame: SheetFrame, obstacles: Array<{ ring: Point[]; box: RectIn }>, bw: number, bh: number): Try<never>['block'] | null {
  const c = frame.content;
  const g = ITEM_GAP_IN;
  const step = 0.1;
  for (let y = c.y; y + bh <= c.y + c.height + 1e-9; y += step) {
    for (let x = c.x; x + bw <= c.x + c.width + 1e-9; x += step) {
      const rect = [{ x, y }, { x: x + bw, y }, { x: x + bw, y: y + bh }, { x, y: y + bh }];
      let clear = true;
      for (const o of obstacles) {
        if (o.box.x > x + bw + g || o.box.x + o.box.width < x - g || o.box.y > y + bh + g || o.box.y + o.box.height < y - g) continue;
        if (!separated(rect, o.ring, g)) {
          clear = false;
          break;
        }
      }
      if (clear) return { x, y, width: bw, height: bh };
    }
  }
  return null;
}

function packOne<T>(items: readonly PackItem<T>[], frame: SheetFrame, logic: PACKING_LOGIC, blockAt: 'first' | 'last' | 'free'): Try<T> | Omit<Try<T>, 'block'> | null {
  const g = ITEM_GAP_IN;
  // Every piece grows by the gap and so does the bin: pieces keep the gap between them, not at the edge.
  const bin = new MaxRectsBin<Rectangle>(frame.content.width + g, frame.content.height + g, 0, {
    smart: false,
    pot: false,
    square: false,
    allowRotation: true,
    logic,
  });
  const block = new Rectangle(frame.testBlock.width + g, frame.testBlock.height + g);
  // Placed first, the squares sit side by side top-left; placed last they may stand one above the other.
  block.allowRotation = blockAt !== 'first';
  if (blockAt === 'first') bin.add(block);
  const placed: PackedItem<T>[] = [];
  for (const item of items) {
    const rect = new Rectangle(item.width + g, item.height + g);
    rect.allowRotation = item.quarterTurns;
    const put = bin.add(rect);
    if (!put) continue;
    placed.push({
      item,
      x: frame.content.x + put.x,
      y: frame.content.y + put.y,
      turned: put.rot === true,
      width: put.width - g,
      height: put.height - g,
    });
  }
  if (blockAt === 'free') return { placed };
  if (blockAt === 'last' && !bin.add(block)) return null;
  return { placed, block: { x: frame.content.x + block.x, y: frame.content.y + block.y, width: block.width - g, height: block.height - g } };
}
