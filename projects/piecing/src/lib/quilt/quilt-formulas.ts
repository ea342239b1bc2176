/*
 * The formulas of a quilt layout (design §11, docs/quilt-layout.md), each a small pure function so the
 * tests can hold it to its check values. Lengths in inches.
 */
import { INCHES_PER_YARD, YARDAGE_STEP_IN, roundUpToEighthInch, roundUpToStep } from '../fabrication/shared/rounding';
import type { BackingSeams, SizeIn } from './quilt-types';

/** Drops float noise from a length (1e-6 in. is far below any cut). */
export function cleanLength(v: number): number {
  const r = Math.round(v * 1e6) / 1e6;
  return r === 0 ? 0 : r;
}

/** Yards to buy for a length of fabric: rounded up to ⅛ yd (common practice), as a decimal. */
export function yardsToBuy(lengthIn: number): number {
  return roundUpToStep(lengthIn, YARDAGE_STEP_IN) / INCHES_PER_YARD;
}

/**
 * Finished size inside the borders. Straight: columns·w + (columns − 1)·s across, rows·h + (rows − 1)·s
 * down (s the sashing width). On point: columns·D + s·√2 by rows·D + s·√2, with D = (w + s)·√2 the
 * diagonal of a sashed unit (block + sashing); the s·√2 is the sashing that frames the outer blocks
 * (docs/quilt-layout.md; plane geometry). Without sashing this is columns·d by rows·d, d = w·√2 (design §11).
 */
export function quiltCentreSize(setting: 'straight' | 'on-point', columns: number, rows: number, block: SizeIn, sashingIn: number): SizeIn {
  if (setting === 'on-point') {
    const D = (block.width + sashingIn) * Math.SQRT2;
    const frame = sashingIn * Math.SQRT2;
    return { width: cleanLength(columns * D + frame), height: cleanLength(rows * D + frame) };
  }
  return {
    width: cleanLength(columns * block.width + (columns - 1) * sashingIn),
    height: cleanLength(rows * block.height + (rows - 1) * sashingIn),
  };
}

/** Block positions: columns·rows straight; columns·rows + (columns − 1)(rows − 1) on point (design §11). */
export function quiltPositions(setting: 'straight' | 'on-point', columns: number, rows: number): number {
  return setting === 'on-point' ? columns * rows + (columns - 1) * (rows - 1) : columns * rows;
}

/**
 * On-point setting triangles for a square block of finished side w (design §11, common practice):
 * side triangles 2(columns − 1) + 2(rows − 1), cut from squares of D + 1¼ in. cut twice on the diagonal
 * (4 each); 4 corner triangles from 2 squares of L + ⅞ in. cut once; cut sizes rounded up to ⅛ in.
 * Without sashing D = d = w·√2 and L = d/2. With sashing of width s the triangles are sized for the sashed
 * grid (docs/quilt-layout.md, plane geometry): a side triangle fills the notch between two sashed units of
 * side u = w + s, so its long side is D = u·√2; a corner triangle's long side runs along the outer block
 * with its sashing on both sides, w + 2s, so its short sides are L = (w + 2s)/√2.
 */
export function settingTriangleCuts(blockSideIn: number, columns: number, rows: number, sashingIn = 0) {
  const D = (blockSideIn + sashingIn) * Math.SQRT2;
  const L = (blockSideIn + 2 * sashingIn) / Math.SQRT2;
  const sideTriangles = 2 * (columns - 1) + 2 * (rows - 1);
  return {
    sideTriangles,
    sideCutSquareIn: roundUpToEighthInch(cleanLength(D + 1.25)),
    sideSquares: Math.ceil(sideTriangles / 4),
    cornerTriangles: 4,
    cornerCutSquareIn: roundUpToEighthInch(cleanLength(L + 0.875)),
    cornerSquares: 2,
  };
}

/**
 * Sashing of an on-point quilt (docs/quilt-layout.md): every block framed by strips, with a cornerstone
 * at every corner, so the edge the setting triangles are sewn to is straight. In the turned grid each of
 * the columns·rows + (columns − 1)(rows − 1) blocks has four sides; the (columns − 1)(rows − 1) blocks
 * of the in-between rows share each side with a neighbour, so strips = 4·positions − 4(columns − 1)(rows − 1)
 * = 4·columns·rows; cornerstones (corners of the grid, Euler: V = 1 + E − F) = 1 + strips − positions
 * = 2·columns·rows + columns + rows.
 */
export function onPointSashingCounts(columns: number, rows: number) {
  const strips = 4 * columns * rows;
  return { strips, cornerstones: 2 * columns * rows + columns + rows };
}

/**
 * One border's cuts (design §11, common practice): side strips first, cut to the height measured through
 * the centre; then top and bottom, cut to the width measured through the centre with the side borders on.
 * Measured lengths are the finished size plus a seam allowance at each end. All four are cut from one long
 * strip of strips across the WOF joined end to end: ceil(total / usable WOF) strips, strips − 1 joins.
 */
export function borderCuts(inner: SizeIn, widthIn: number, allowanceIn: number, usableWofIn: number) {
  // Cut lengths round up to ⅛ in. (an on-point centre measures an irrational length).
  const sideCutLengthIn = roundUpToEighthInch(cleanLength(inner.height + 2 * allowanceIn));
  const topCutLengthIn = roundUpToEighthInch(cleanLength(inner.width + 2 * widthIn + 2 * allowanceIn));
  const totalLengthIn = cleanLength(2 * sideCutLengthIn + 2 * topCutLengthIn);
  const strips = Math.ceil(totalLengthIn / usableWofIn - 1e-9);
  return { cutWidthIn: cleanLength(widthIn + 2 * allowanceIn), sideCutLengthIn, topCutLengthIn, totalLengthIn, strips, joins: Math.max(0, strips - 1) };
}

/** Binding (design §11, common practice): ceil((perimeter + extra) / usable WOF) strips of the strip width. */
export function bindingCuts(finished: SizeIn, stripWidthIn: number, extraIn: number, usableWofIn: number) {
  const perimeterIn = cleanLength(2 * (finished.width + finished.height));
  const lengthIn = roundUpToEighthInch(cleanLength(perimeterIn + extraIn));
  const strips = Math.ceil(lengthIn / usableWofIn - 1e-9);
  return { perimeterIn, lengthIn, strips, yards: yardsToBuy(strips * stripWidthIn) };
}

/**
 * Backing (design §11, common practice): quilt + 2·margin each way, pieced from full widths of its usable
 * WOF. Widths running down the quilt (seams lengthwise) need ceil(width / WOF) of them, each as long as the
 * backing is high; widths running across (seams across, horizontal) need ceil(height / WOF), each as long as
 * the backing is wide. The way that takes less fabric wins (lengthwise on a tie); when one width covers the
 * backing there is no seam.
 */
export function backingCuts(finished: SizeIn, marginIn: number, usableWofIn: number) {
  // Rounded up to ⅛ in.: a backing a hair larger is harmless, and an on-point quilt's size is irrational.
  const widthIn = roundUpToEighthInch(cleanLength(finished.width + 2 * marginIn));
  const heightIn = roundUpToEighthInch(cleanLength(finished.height + 2 * marginIn));
  const down = { widths: Math.ceil(widthIn / usableWofIn - 1e-9), widthLengthIn: heightIn, seams: 'lengthwise' as BackingSeams };
  const across = { widths: Math.ceil(heightIn / usableWofIn - 1e-9), widthLengthIn: widthIn, seams: 'across' as BackingSeams };
  let best = down.widths * down.widthLengthIn <= across.widths * across.widthLengthIn ? down : across;
  if (best.widths === 1) best = { ...best, seams: 'none' };
  const lengthIn = cleanLength(best.widths * best.widthLengthIn);
  return { widthIn, heightIn, widths: best.widths, seams: best.seams, widthLengthIn: best.widthLengthIn, lengthIn, yards: yardsToBuy(lengthIn) };
}
