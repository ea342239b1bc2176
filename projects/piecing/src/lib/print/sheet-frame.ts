import { printableArea, type PaperName, type RectIn, type SheetOrientation } from './paper';

/*
 * The fixed parts of every sheet: a header band across the top of the printable area and a block with
 * the two test squares in the top-left corner of the content area. Sizes in inches.
 */

/** Height of the header band (title, "Sheet n of N", sections, the print-at-100 % line). */
export const HEADER_HEIGHT_IN = 0.46;

/** Gap between the header band and the content area. */
export const HEADER_GAP_IN = 0.06;

/** Side of the imperial test square: 1 in. */
export const TEST_SQUARE_IN = 1;

/** Side of the metric test square: 2 cm = 20 / 25.4 in. (1 in. = 25.4 mm exactly). */
export const TEST_SQUARE_CM_IN = 20 / 25.4;

/** The block holding both test squares and their labels. */
export const TEST_BLOCK_IN = { width: 1 + 0.12 + 20 / 25.4, height: 1 } as const;

/** Space kept between things packed on a sheet, so neighbouring templates can be cut apart. */
export const ITEM_GAP_IN = 0.1;

/** Depth of the caption strip beside every template print: section label, copy, arrow, tile key. */
export const CAPTION_IN = 0.2;

/** The parts of one sheet, in inches from the page's top-left corner. */
export interface SheetFrame {
  orientation: SheetOrientation;
  widthIn: number;
  heightIn: number;
  /** Inside the margins. */
  printable: RectIn;
  header: RectIn;
  /** Where templates go (below the header). */
  content: RectIn;
  /** The test-square block, top-left of the content area. */
  testBlock: RectIn;
}

/** The frame of a sheet of this paper, orientation and margin. */
export function sheetFrame(paper: PaperName, orientation: SheetOrientation, marginIn: number): SheetFrame {
  const printable = printableArea(paper, orientation, marginIn);
  const header: RectIn = { x: printable.x, y: printable.y, width: printable.width, height: HEADER_HEIGHT_IN };
  const top = printable.y + HEADER_HEIGHT_IN + HEADER_GAP_IN;
  const content: RectIn = {
    x: printable.x,
    y: top,
    width: printable.width,
    height: printable.y + printable.height - top,
  };
  const testBlock: RectIn = { x: content.x, y: content.y, width: TEST_BLOCK_IN.width, height: TEST_BLOCK_IN.height };
  return {
    orientation,
    widthIn: printable.width + 2 * marginIn,
    heightIn: printable.height + 2 * marginIn,
    printable,
    header,
    content,
    testBlock,
  };
}

/**
 * How far the test block reaches below the top of the content area when it hangs in the top-left
 * corner of the printable area (its top in the header band), inches.
 */
export function cornerBlockDepthIn(frame: SheetFrame, blockHeightIn = frame.testBlock.height): number {
  return Math.max(0, frame.header.y + blockHeightIn - frame.content.y);
}
