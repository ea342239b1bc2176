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

/**
 * Space kept between the test squares and the nearest template box when the squares hang in the top-left
 * corner. The squares are measured, never cut out, so they need less room than two templates; a box keeps
 * 0.02 in. more round its cutting line (TEMPLATE_CLEARANCE_IN), so no printed template line comes nearer
 * than 0.08 in. (2 mm).
 */
export const TEST_BLOCK_GAP_IN = 0.06;

/**
 * How near the paper's edge the test squares may come: they may reach into the margin band, never
 * nearer the edge than ¼ in. Most home printers cannot print the outer eighth to quarter inch of a sheet
 * (common practice, from memory); templates always stay inside the margins the quilter chose.
 */
export const EDGE_SAFE_IN = 0.25;

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
  /**
   * Where the test squares may go: the printable area grown into the margin band up to
   * {@link EDGE_SAFE_IN} from the paper's edge (the printable area itself when the margin is narrower).
   */
  testArea: RectIn;
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
  const inset = Math.min(marginIn, EDGE_SAFE_IN);
  const grow = marginIn - inset;
  const testArea: RectIn = { x: printable.x - grow, y: printable.y - grow, width: printable.width + 2 * grow, height: printable.height + 2 * grow };
  return {
    orientation,
    widthIn: printable.width + 2 * marginIn,
    heightIn: printable.height + 2 * marginIn,
    printable,
    header,
    content,
    testBlock,
    testArea,
  };
}

/**
 * Where the test block's top goes when it hangs in the top-left corner beside the header's text:
 * 'header' at the top of the printable area, 'edge' as high into the margin band as
 * {@link EDGE_SAFE_IN} allows (used only where that leaves room for more templates).
 */
export type CornerHang = 'header' | 'edge';

/** The top of a test block hanging in the top-left corner, inches from the page's top. */
export function cornerBlockTopIn(frame: SheetFrame, hang: CornerHang): number {
  return hang === 'edge' ? frame.testArea.y : frame.header.y;
}

/**
 * How much of the content area's top a test block hanging in the top-left corner takes, its gap to
 * the templates below it included (zero when it ends above the content area less the gap), inches.
 */
export function cornerBlockDepthIn(frame: SheetFrame, hang: CornerHang = 'edge', blockHeightIn = frame.testBlock.height): number {
  return Math.max(0, cornerBlockTopIn(frame, hang) + blockHeightIn + TEST_BLOCK_GAP_IN - frame.content.y);
}
