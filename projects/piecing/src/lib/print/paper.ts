/**
 * Paper sizes and the printable area of a sheet. Sizes are exact: ISO 216 sizes come from their
 * millimetre definitions (1 in. = 25.4 mm exactly), North American sizes from their inch definitions.
 */

/** Paper a print set can be printed on. */
export type PaperName = 'letter' | 'legal' | 'tabloid' | 'a4' | 'a3';

/** Every paper name, in the order the app offers them. */
export const PAPER_NAMES: readonly PaperName[] = ['letter', 'legal', 'tabloid', 'a4', 'a3'];

/** Points per inch in PDF user space (ISO 32000-1:2008, 8.3.2.3). */
export const POINTS_PER_INCH = 72;

/** Millimetres per inch, exactly (international inch, 1959). */
export const MM_PER_INCH = 25.4;

/** Portrait size of a paper, short side first. */
export interface PaperSize {
  name: PaperName;
  /** Human name shown on the cover sheet. */
  displayName: string;
  widthIn: number;
  heightIn: number;
}

const mm = (value: number): number => value / MM_PER_INCH;

/** Portrait sizes: ISO 216 (A4, A3), ANSI/ASME Y14.1 (Letter, Tabloid), North American practice (Legal). */
export const PAPER_SIZES: Readonly<Record<PaperName, PaperSize>> = {
  letter: { name: 'letter', displayName: 'Letter (8.5 × 11 in.)', widthIn: 8.5, heightIn: 11 },
  legal: { name: 'legal', displayName: 'Legal (8.5 × 14 in.)', widthIn: 8.5, heightIn: 14 },
  tabloid: { name: 'tabloid', displayName: 'Tabloid (11 × 17 in.)', widthIn: 11, heightIn: 17 },
  a4: { name: 'a4', displayName: 'A4 (210 × 297 mm)', widthIn: mm(210), heightIn: mm(297) },
  a3: { name: 'a3', displayName: 'A3 (297 × 420 mm)', widthIn: mm(297), heightIn: mm(420) },
};

/** Which way a sheet is turned. */
export type SheetOrientation = 'portrait' | 'landscape';

/** A sheet's size in inches for an orientation. */
export function sheetSizeIn(paper: PaperName, orientation: SheetOrientation): { widthIn: number; heightIn: number } {
  const p = PAPER_SIZES[paper];
  return orientation === 'portrait'
    ? { widthIn: p.widthIn, heightIn: p.heightIn }
    : { widthIn: p.heightIn, heightIn: p.widthIn };
}

/** An axis-aligned rectangle in inches, origin top-left, y down. */
export interface RectIn {
  x: number;
  y: number;
  width: number;
  height: number;
}

/** The part of a sheet inside the margins: where anything may be printed. */
export function printableArea(paper: PaperName, orientation: SheetOrientation, marginIn: number): RectIn {
  const { widthIn, heightIn } = sheetSizeIn(paper, orientation);
  const width = widthIn - 2 * marginIn;
  const height = heightIn - 2 * marginIn;
  if (width <= 0 || height <= 0) {
    throw new RangeError(`a margin of ${marginIn} in. leaves nothing printable on ${PAPER_SIZES[paper].displayName}`);
  }
  return { x: marginIn, y: marginIn, width, height };
}

/** Printable area in square inches (the same for both orientations). */
export function printableAreaSqIn(paper: PaperName, marginIn: number): number {
  const r = printableArea(paper, 'portrait', marginIn);
  return r.width * r.height;
}
