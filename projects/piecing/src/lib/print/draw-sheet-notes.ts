import type { PlannedSheet } from './layout-types';
import type { RectIn } from './paper';
import type { PdfPen } from './pdf-pen';
import type { SheetFrame } from './sheet-frame';
import { rectsOverlap, sheetObstacles } from './sheet-obstacles';

const SIZE_PT = 7.5;
const LINE_IN = (SIZE_PT * 1.3) / 72;

/** A designer's note for a section, to print on the sheets carrying its template. */
export interface SectionNote {
  label: string;
  note: string;
}

/**
 * Writes the designer's notes of the sections on a template sheet in the lowest free band of the
 * sheet (clear of every template, caption and the test squares); when no band is free, in the bottom
 * margin below the printable area. `avoid`: more boxes to keep clear of (tile maps drawn among the
 * templates). Returns where it wrote them.
 */
export function drawSheetNotes(pen: PdfPen, frame: SheetFrame, sheet: PlannedSheet, notes: readonly SectionNote[], avoid: readonly RectIn[] = []): RectIn | null {
  if (notes.length === 0) return null;
  const text = notes.map((n) => `Section ${n.label} — designer's note: ${n.note.trim()}`);
  const obstacles: RectIn[] = [...sheetObstacles(frame, sheet), ...avoid];
  const c = frame.content;
  for (const share of [1, 0.5, 0.34]) {
    const width = c.width * share;
    const lines = text.flatMap((t) => pen.wrap(t, width - 0.1, SIZE_PT));
    const height = lines.length * LINE_IN + 0.08;
    for (let y = c.y + c.height - height; y >= c.y; y -= 0.1) {
      for (let x = c.x; x + width <= c.x + c.width + 1e-9; x += 0.25) {
        const band = { x, y, width, height };
        if (obstacles.some((o) => rectsOverlap(o, band, 0.06))) continue;
        write(pen, lines, band);
        return band;
      }
    }
  }
  // No free band: the bottom margin, shortened to one line per note.
  const margin = frame.heightIn - (frame.printable.y + frame.printable.height);
  if (margin < 0.3) return null;
  const band = { x: c.x, y: frame.printable.y + frame.printable.height + 0.03, width: c.width, height: Math.min(margin - 0.1, LINE_IN * notes.length) };
  const lines = text.map((t) => pen.wrap(t, c.width, SIZE_PT)[0] ?? '').slice(0, Math.max(1, Math.floor(band.height / LINE_IN)));
  write(pen, lines, band);
  return band;
}

function write(pen: PdfPen, lines: readonly string[], band: RectIn): void {
  lines.forEach((line, i) => pen.text(line, { x: band.x + 0.05, y: band.y + 0.04 + LINE_IN * (i + 0.8) }, { sizePt: SIZE_PT, bold: i === 0 || line.startsWith('Section ') }));
}
