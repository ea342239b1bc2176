import type { SheetPlacement } from '@seamwright/piecing';

/** Width of a sheet preview on screen, CSS px (the drawing is scaled to it). */
export const SHEET_PREVIEW_PX = 200;

/** Smallest rendered size of any text in a sheet preview, CSS px (readable drawings: 9 px or more). */
export const MIN_LABEL_PX = 10;

/**
 * Average advance of a bold Roboto character, in ems (digits are 0.56 em, capitals up to 0.7 em);
 * used to judge whether a label fits inside its print before the browser lays it out.
 */
const CHAR_EM = 0.64;

/** Where and how a print's label is drawn on a sheet preview. */
export interface SheetLabel {
  /** The text drawn. */
  text: string;
  /** The whole label (shown on hover), which `text` may shorten. */
  full: string;
  /** Baseline start of the text, sheet inches. */
  x: number;
  y: number;
  /** Whether the label sits outside its print, joined to it by the leader line. */
  outside: boolean;
  /** From the label to the print's middle, when outside. */
  leader?: { x1: number; y1: number; x2: number; y2: number };
}

/** The font size in sheet inches that renders at `MIN_LABEL_PX` on a preview of a sheet `sheetWidthIn` wide. */
export function labelFontIn(sheetWidthIn: number): number {
  return (MIN_LABEL_PX * sheetWidthIn) / SHEET_PREVIEW_PX;
}

/** The label's longest form and the shorter forms tried when it does not fit, longest first. */
function labelForms(p: SheetPlacement): string[] {
  const copy = `${p.sectionLabel} ${p.copy}/${p.copies}`;
  const full = p.tile ? `${copy} · tile ${p.tile.row},${p.tile.column}` : copy;
  return [...new Set([full, copy, p.sectionLabel])];
}

/**
 * Places a print's label at a size that stays readable: inside the print (its caption strip, or its
 * top-left) in the longest form that fits; where even the section letter does not fit, outside the
 * print, above it (below at the sheet's top edge), with a leader line to the print's middle. The
 * label never gets smaller than `fontIn`.
 */
export function placeSheetLabel(p: SheetPlacement, fontIn: number): SheetLabel {
  const forms = labelForms(p);
  const full = forms[0];
  const box: SheetPlacement['rect'] = p.caption?.rect ?? p.rect;
  const room = p.rect.width - 0.1;
  const width = (t: string) => t.length * CHAR_EM * fontIn;
  if (p.rect.height >= fontIn * 1.2) {
    const text = forms.find((t) => width(t) <= room);
    if (text) return { text, full, x: p.rect.x + 0.05, y: box.y + fontIn * 0.9, outside: false };
  }
  const text = forms[forms.length - 1];
  const middle = { x: p.rect.x + p.rect.width / 2, y: p.rect.y + p.rect.height / 2 };
  const above = p.rect.y - fontIn * 0.4 >= fontIn;
  const y = above ? p.rect.y - fontIn * 0.4 : p.rect.y + p.rect.height + fontIn * 1.2;
  const x = p.rect.x + p.rect.width + 0.05;
  return { text, full, x, y, outside: true, leader: { x1: x, y1: above ? y : y - fontIn * 0.9, x2: middle.x, y2: middle.y } };
}
