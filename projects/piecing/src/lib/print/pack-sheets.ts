/// <reference path="./maxrects-packer-esm.d.ts" />
// maxrects-packer's "main" is a UMD file inside a "type": "module" package, which Node's ESM loader
// reads as an empty module; its ES build works in Node, vitest and the browser alike.
import { MaxRectsBin, PACKING_LOGIC, Rectangle } from 'maxrects-packer/dist/maxrects-packer.mjs';
import type { PaperName, SheetOrientation } from './paper';
import { ITEM_GAP_IN, sheetFrame, type SheetFrame } from './sheet-frame';

/** Something to place on a sheet: its size in inches and whether a quarter turn is allowed. */
export interface PackItem<T> {
  width: number;
  height: number;
  quarterTurns: boolean;
  data: T;
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
  block: { x: number; y: number };
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
export function packSheets<T>(items: readonly PackItem<T>[], paper: PaperName, marginIn: number): PackedSheet<T>[] {
  const frames: Record<SheetOrientation, SheetFrame> = {
    portrait: sheetFrame(paper, 'portrait', marginIn),
    landscape: sheetFrame(paper, 'landscape', marginIn),
  };
  for (const item of items) {
    if (!fitsAlone(item, frames.portrait) && !fitsAlone(item, frames.landscape)) {
      throw new RangeError(`a ${item.width.toFixed(2)} × ${item.height.toFixed(2)} in. piece does not fit on one sheet`);
    }
  }
  const orders = ORDERS.map((order) => [...items].sort(order));
  const left = new Set<PackItem<T>>(items);
  const sheets: PackedSheet<T>[] = [];
  while (left.size > 0) {
    let best: { frame: SheetFrame; tried: Try<T>; area: number } | null = null;
    for (const orientation of ['portrait', 'landscape'] as const) {
      const frame = frames[orientation];
      for (const order of orders) {
        const remaining = order.filter((i) => left.has(i));
        for (const logic of LOGICS) {
          for (const blockFirst of [true, false]) {
            const tried = packOne(remaining, frame, logic, blockFirst);
            if (!tried) continue;
            const area = tried.placed.reduce((s, p) => s + p.width * p.height, 0);
            if (!best || area > best.area + 1e-9) best = { frame, tried, area };
          }
        }
      }
    }
    if (!best || best.tried.placed.length === 0) throw new RangeError('packing made no progress');
    for (const p of best.tried.placed) left.delete(p.item);
    const testBlock = { ...best.frame.testBlock, ...best.tried.block };
    sheets.push({ frame: { ...best.frame, testBlock }, items: best.tried.placed });
  }
  return sheets;
}

function fitsAlone(item: PackItem<unknown>, frame: SheetFrame): boolean {
  return (packOne([item], frame, PACKING_LOGIC.MAX_EDGE, true)?.placed.length ?? 0) === 1;
}

function packOne<T>(items: readonly PackItem<T>[], frame: SheetFrame, logic: PACKING_LOGIC, blockFirst: boolean): Try<T> | null {
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
  block.allowRotation = false;
  if (blockFirst) bin.add(block);
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
  if (!blockFirst && !bin.add(block)) return null;
  return { placed, block: { x: frame.content.x + block.x, y: frame.content.y + block.y } };
}
