import { drawTileMap, tileMapWidth } from './draw-sheet-frame';
import type { PlannedSheet } from './layout-types';
import type { PdfPen } from './pdf-pen';
import type { SheetFrame } from './sheet-frame';
import type { PrintTemplate } from './template-model';

/** Tile maps of the first tiles on a sheet, in the header between the title and the sheet number. */
export function drawTileMaps(pen: PdfPen, frame: SheetFrame, sheet: PlannedSheet, byId: Map<string, PrintTemplate>): void {
  const firsts = sheet.placements.filter((p) => p.tile?.first);
  if (firsts.length === 0) return;
  const height = frame.header.height - 0.06;
  // Right of the maps: "Sheet n of N" above the mirroring note (about 2.1 in. at 7 pt).
  let right = frame.header.x + frame.header.width - 2.3;
  for (const p of firsts) {
    const label = `${byId.get(p.templateId)!.sectionLabel}${p.copies > 1 ? ` copy ${p.copy}` : ''} tiles:`;
    const width = tileMapWidth(pen, label, p.tile!, height);
    const area = { x: right - width, y: frame.header.y + 0.02, width, height };
    if (area.x < frame.header.x + frame.header.width * 0.45) break;
    drawTileMap(pen, area, label, p.tile!);
    right = area.x - 0.15;
  }
}
