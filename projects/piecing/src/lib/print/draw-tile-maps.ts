import { drawTileMap, tileMapWidth } from './draw-sheet-frame';
import type { PlannedSheet, SheetPlacement } from './layout-types';
import type { RectIn } from './paper';
import type { PdfPen } from './pdf-pen';
import type { SheetFrame } from './sheet-frame';
import { rectsOverlap, sheetObstacles } from './sheet-obstacles';
import type { PrintTemplate } from './template-model';

/** Where one copy's tile map went: in the header, in free room of the content area, or only named in a note. */
export interface DrawnTileMap {
  label: string;
  where: 'header' | 'content' | 'note';
  /** The map's box (the note's line for 'note'), inches from the page's top-left. */
  area: RectIn;
}

/** Space kept round a map drawn among the templates. */
const MAP_GAP_IN = 0.08;

/**
 * Tile maps of the copies whose chosen tile is on this sheet ({@link TilePlacement.first}): in the header
 * between the title and the sheet number, right to left, while they keep right of 45 % of its width; the
 * rest in the highest free room of the content area, clear of every template box, caption and the test
 * squares. A map with no free room anywhere is named in one line in the bottom margin. Returns what it
 * drew, so the notes written after it keep clear of the maps.
 */
export function drawTileMaps(pen: PdfPen, frame: SheetFrame, sheet: PlannedSheet, byId: Map<string, PrintTemplate>): DrawnTileMap[] {
  const firsts = sheet.placements.filter((p) => p.tile?.first);
  if (firsts.length === 0) return [];
  const height = frame.header.height - 0.06;
  const drawn: DrawnTileMap[] = [];
  const labelOf = (p: SheetPlacement) => `${byId.get(p.templateId)!.sectionLabel}${p.copies > 1 ? ` copy ${p.copy}` : ''} tiles:`;
  // Right of the maps: "Sheet n of N" above the mirroring note (about 2.1 in. at 7 pt).
  let right = frame.header.x + frame.header.width - 2.3;
  let next = 0;
  for (; next < firsts.length; next++) {
    const p = firsts[next];
    const label = labelOf(p);
    const width = tileMapWidth(pen, label, p.tile!, height);
    const area = { x: right - width, y: frame.header.y + 0.02, width, height };
    if (area.x < frame.header.x + frame.header.width * 0.45) break;
    drawTileMap(pen, area, label, p.tile!);
    drawn.push({ label, where: 'header', area });
    right = area.x - 0.15;
  }
  const obstacles = sheetObstacles(frame, sheet);
  const unplaced: string[] = [];
  for (const p of firsts.slice(next)) {
    const label = labelOf(p);
    const width = tileMapWidth(pen, label, p.tile!, height);
    const area = freeRoom(frame.content, width, height, obstacles);
    if (!area) {
      unplaced.push(label.replace(/ tiles:$/, ''));
      continue;
    }
    drawTileMap(pen, area, label, p.tile!);
    drawn.push({ label, where: 'content', area });
    obstacles.push(area);
  }
  if (unplaced.length > 0) {
    // No room on the sheet: name the maps left out, so none is dropped without a word.
    const text = `Tile maps not shown (no room on this sheet): ${unplaced.join(', ')}. Each tile's caption names its row and column.`;
    const area = { x: frame.content.x, y: frame.printable.y + frame.printable.height + 0.03, width: frame.content.width, height: 0.12 };
    pen.text(text, { x: area.x, y: area.y + 0.09 }, { sizePt: 6.5, bold: true });
    drawn.push({ label: text, where: 'note', area });
  }
  return drawn;
}

/** The highest, then leftmost, box of this size inside `room` clear of every obstacle, or null. */
function freeRoom(room: RectIn, width: number, height: number, obstacles: readonly RectIn[]): RectIn | null {
  for (let y = room.y; y + height <= room.y + room.height + 1e-9; y += 0.05) {
    for (let x = room.x; x + width <= room.x + room.width + 1e-9; x += 0.1) {
      const box = { x, y, width, height };
      if (!obstacles.some((o) => rectsOverlap(o, box, MAP_GAP_IN))) return box;
    }
  }
  return null;
}
