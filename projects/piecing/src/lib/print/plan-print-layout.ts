import type { Point } from '../document/index';
import { applyAffine, compose, rotation, translation, type Affine } from './affine';
import type { PlannedSheet, PrintLayout, SheetPlacement, TemplateSummary, TilePlacement } from './layout-types';
import { packSheets, type PackedItem, type PackItem, type SheetFill } from './pack-sheets';
import { blockRing, findSpot, occupancyGrid, shapeMask, type ShapeMask } from './raster-fill';
import { boundingRect, clipRingToRect } from './layout-geometry';
import { printableAreaSqIn, type RectIn } from './paper';
import { nestPair, simplifyRing, type NestedPair } from './nest-pair';
import { IDENTITY, MIRROR_X } from './affine';
import { equalSpans, intersectRects, prepareTemplate, TEMPLATE_CLEARANCE_IN, tileGridFromSpans, tileTemplate, type PreparedTemplate, type TileCell, type TileGrid } from './prepare-template';
import type { PrintOptions } from './print-options';
import { cornerBlockDepthIn, ITEM_GAP_IN, sheetFrame, CAPTION_IN, TEST_BLOCK_GAP_IN, type SheetFrame } from './sheet-frame';
import type { PrintTemplate } from './template-model';

/** What one packed piece stands for: a whole copy of a template, or one tile of a copy. */
interface Piece {
  prepared: PreparedTemplate;
  copy: number;
  grid?: TileGrid;
  tile?: TileCell;
  /** Set when this piece is two copies (copy and copy + 1) nested head to tail. */
  pair?: NestedPair;
  /** Set when the piece was fitted into a gap at its own turn: its frame and box replace the prepared ones. */
  free?: { frame: Affine; width: number; height: number; turnDeg: number };
}

type LayoutOptions = Pick<PrintOptions, 'paper' | 'marginIn' | 'mirrored' | 'tileOverlapIn'>;

/**
 * Lays templates out on sheets: each copy is placed whole where it fits one sheet (packed with
 * others, quarter turns allowed, arcs and wedges turned to their smallest box), and split into
 * overlapping tiles where it does not. Pure: the same templates and options give the same plan.
 * Sheets are numbered from `firstPageNumber` (the print set's booklet comes before them).
 */
export function layoutTemplates(templates: readonly PrintTemplate[], options: LayoutOptions, firstPageNumber = 2): PrintLayout {
  const { paper, marginIn, mirrored, tileOverlapIn } = options;
  const portrait = sheetFrame(paper, 'portrait', marginIn);
  const landscape = sheetFrame(paper, 'landscape', marginIn);
  const pieces: PackItem<Piece>[] = [];
  const grids = new Map<string, TileGrid>();
  // Simplified cutting lines (within 0.02 in.) for finding room for the test squares; the gap is widened to match.
  const simple = new Map(templates.map((t) => [t.id, simplifyRing(t.cuttingLine, 0.02)]));
  const outlineOf = (id: string, m: Affine) => simple.get(id)!.map((q) => applyAffine(m, q));
  for (const template of templates) {
    if (template.copies < 1) continue;
    const prepared = prepareTemplate(template, mirrored);
    const whole = fitsWhole(prepared, portrait) || fitsWhole(prepared, landscape);
    const grid = whole ? null : cachedTiling(template, mirrored, [portrait, landscape], tileOverlapIn, paper, marginIn);
    if (grid) grids.set(template.id, grid);
    const pair = !grid && template.copies >= 2 ? nestedPairFor(prepared, mirrored, portrait, landscape) : null;
    for (let copy = 1; copy <= template.copies; copy++) {
      if (pair && copy < template.copies) {
        const single = (c: number): PackItem<Piece> => ({ width: prepared.width, height: prepared.height, quarterTurns: true, data: { prepared, copy: c }, areaSqIn: template.areaSqIn });
        pieces.push({
          width: pair.width,
          height: pair.height,
          quarterTurns: true,
          data: { prepared, copy, pair },
          areaSqIn: 2 * template.areaSqIn,
          parts: [single(copy), single(copy + 1)],
        });
        copy++;
        continue;
      }
      if (!grid) {
        pieces.push({ width: prepared.width, height: prepared.height, quarterTurns: true, data: { prepared, copy }, areaSqIn: template.areaSqIn });
        continue;
      }
      for (const tile of grid.tiles) {
        pieces.push({
          width: tile.used.width,
          height: tile.used.height + CAPTION_IN,
          quarterTurns: false,
          data: { prepared: grid.prepared, copy, grid, tile },
          // The first tile of a copy carries the tile map in its sheet's header.
          keepsHeader: tile === grid.tiles[0],
        });
      }
    }
  }

  const outlines = (p: PackedItem<Piece>): Point[][] => {
    const placements = p.item.data.tile ? [placeTile(p.item.data, p.x, p.y, new Map())] : placeWhole(p.item.data, p.x, p.y, p.turned);
    const rings: Point[][] = [];
    for (const pl of placements) {
      if (pl.caption) rings.push(rectRing(pl.caption.rect));
      if (pl.tile) rings.push(...tileOutlines(pl, outlineOf(pl.templateId, pl.transform)));
      else rings.push(outlineOf(pl.templateId, pl.transform));
    }
    return rings;
  };
  const packed = packSheets(pieces, paper, marginIn, outlines, gapFiller(mirrored, outlines));
  const pageOfTile = new Map<string, number>();
  packed.forEach((sheet, i) => {
    for (const p of sheet.items) {
      if (p.item.data.tile) pageOfTile.set(tileKey(p.item.data.prepared.template.id, p.item.data.copy, p.item.data.tile), i + firstPageNumber);
    }
  });

  const sheets: PlannedSheet[] = packed.map((sheet, i) => {
    const placements = sheet.items.flatMap((p) =>
      p.item.data.tile
        ? [placeTile(p.item.data, p.x, p.y, pageOfTile)]
        : placeWhole(p.item.data, p.x, p.y, p.turned),
    );
    const sectionLabels = [...new Set(placements.map((pl) => pl.sectionLabel))];
    return { pageNumber: i + firstPageNumber, frame: sheet.frame, placements, sectionLabels };
  });

  const totalTemplateAreaSqIn = templates.reduce((s, t) => s + t.areaSqIn * Math.max(0, t.copies), 0);
  const areaPerSheet = printableAreaSqIn(paper, marginIn);
  const summaries: TemplateSummary[] = templates
    .filter((t) => t.copies >= 1)
    .map((t) => {
      const grid = grids.get(t.id);
      return {
        templateId: t.id,
        sectionLabel: t.sectionLabel,
        copies: t.copies,
        tilesPerCopy: grid ? grid.tiles.length : 1,
        ...(grid ? { tileGrid: { rows: grid.rows, columns: grid.columns } } : {}),
        pageNumbers: sheets.filter((s) => s.placements.some((p) => p.templateId === t.id)).map((s) => s.pageNumber),
      };
    });
  return {
    paper,
    marginIn,
    mirrored,
    tileOverlapIn,
    sheets,
    templateSheetCount: sheets.length,
    lowerBoundSheets: Math.max(0, Math.ceil(totalTemplateAreaSqIn / areaPerSheet - 1e-9)),
    totalTemplateAreaSqIn,
    printableAreaSqIn: areaPerSheet,
    templates: summaries,
  };
}

/**
 * Nested pairs already found, by outline and options: the search is pure and costs far more than
 * the key, and the same pattern is laid out again whenever the quilter changes a print option.
 */
const pairCache = new Map<string, NestedPair | null>();
const PAIR_CACHE_SIZE = 256;

/** Two copies nested head to tail, when that beats two boxes and still fits a sheet. */
function nestedPairFor(prepared: PreparedTemplate, mirrored: boolean, ...frames: SheetFrame[]): NestedPair | null {
  const t = prepared.template;
  const key = `${mirrored ? 1 : 0}|${t.freeRotation ? 1 : 0}|${t.cuttingLine.map((p) => `${p.x},${p.y}`).join(';')}`;
  let pair = pairCache.get(key);
  if (pair === undefined) {
    pair = searchPair(prepared, mirrored);
    if (pairCache.size >= PAIR_CACHE_SIZE) pairCache.delete(pairCache.keys().next().value!);
    pairCache.set(key, pair);
  }
  if (!pair) return null;
  const box = { width: pair.width, height: pair.height } as PreparedTemplate;
  return frames.some((f) => fitsWhole(box, f)) ? pair : null;
}

function searchPair(prepared: PreparedTemplate, mirrored: boolean): NestedPair | null {
  return nestPair(
    prepared.template.cuttingLine,
    mirrored ? MIRROR_X : IDENTITY,
    prepared.template.freeRotation,
    ITEM_GAP_IN,
    TEMPLATE_CLEARANCE_IN,
    prepared.width * prepared.height,
  );
}

function fitsWhole(p: Pick<PreparedTemplate, 'width' | 'height'>, frame: SheetFrame): boolean {
  const { width: W, height: H } = frame.content;
  const tb = frame.testBlock;
  const fits = (w: number, h: number) =>
    (w <= W && h <= H - cornerBlockDepthIn(frame)) || (w <= W - tb.width - TEST_BLOCK_GAP_IN && h <= H);
  return fits(p.width, p.height) || fits(p.height, p.width);
}

/** Forgets every cached search (nested pairs, tilings, raster masks): for measuring a first layout. */
export function clearLayoutCaches(): void {
  pairCache.clear();
  tilingCache.clear();
  maskCache.clear();
}

/** Tilings already chosen, by outline, copies and options (the choice is pure and packs trial sheets). */
const tilingCache = new Map<string, { columns: Array<[number, number]>; rows: Array<[number, number]>; turn: number }>();
const TILING_CACHE_SIZE = 256;

function cachedTiling(template: PrintTemplate, mirrored: boolean, frames: SheetFrame[], overlapIn: number, paper: PrintOptions['paper'], marginIn: number): TileGrid {
  const key = [paper, marginIn, overlapIn, mirrored ? 1 : 0, template.freeRotation ? 1 : 0, template.copies, template.cuttingLine.map((p) => `${p.x},${p.y}`).join(';')].join('|');
  const known = tilingCache.get(key);
  if (known) return tileGridFromSpans(prepareTemplate(template, mirrored, known.turn), known.columns, known.rows, overlapIn);
  const { grid, columns, rows, turn } = chooseTiling(template, mirrored, frames, overlapIn, paper, marginIn);
  if (tilingCache.size >= TILING_CACHE_SIZE) tilingCache.delete(tilingCache.keys().next().value!);
  tilingCache.set(key, { columns, rows, turn });
  return grid;
}

/**
 * Picks the tiling that packs onto the fewest sheets (then the fewest tiles, then the least printed
 * area): the smallest equal grids that fit, equal grids a row or column finer (smaller tiles can
 * share sheets), and grids whose first or last row and column are as large as a sheet takes (the
 * rest of the template in fewer, smaller tiles), over the template unturned and turned a quarter.
 * Each candidate's tiles, for every copy, are packed on their own to count its sheets.
 */
function chooseTiling(
  template: PrintTemplate,
  mirrored: boolean,
  frames: SheetFrame[],
  overlapIn: number,
  paper: PrintOptions['paper'],
  marginIn: number,
): { grid: TileGrid; columns: Array<[number, number]>; rows: Array<[number, number]>; turn: number } {
  let best: { grid: TileGrid; columns: Array<[number, number]>; rows: Array<[number, number]>; turn: number; sheets: number; count: number; area: number } | null = null;
  for (const turn of [0, Math.PI / 2]) {
    const prepared = prepareTemplate(template, mirrored, turn);
    // The smallest grid for each sheet orientation and each way of leaving room for the test squares.
    const bases: Array<[number, number]> = [];
    const limits: Array<[number, number]> = [];
    for (const frame of frames) {
      const { width: W, height: H } = frame.content;
      const tb = frame.testBlock;
      for (const [cw, ch] of [[W, H - cornerBlockDepthIn(frame, 'header') - CAPTION_IN], [W - tb.width - TEST_BLOCK_GAP_IN, H - CAPTION_IN]] as const) {
        limits.push([cw, ch]);
        const grid = tileTemplate(prepared, cw, ch, overlapIn);
        if (grid && !bases.some(([c, r]) => c === grid.columns && r === grid.rows)) bases.push([grid.columns, grid.rows]);
      }
    }
    // Equal cells: the smallest grids that fit, and grids a row or column finer.
    const candidates: Array<{ columns: Array<[number, number]>; rows: Array<[number, number]> }> = [];
    for (const [minCols, minRows] of bases) {
      // Trial packing is only worth its time for modest grids; a huge template takes the smallest grid.
      const extra = minCols * minRows * template.copies <= 120 ? 1 : 0;
      for (let columns = minCols; columns <= minCols + extra; columns++) {
        for (let rows = minRows; rows <= minRows + extra; rows++) {
          candidates.push({ columns: equalSpans(prepared.width, columns, overlapIn), rows: equalSpans(prepared.height, rows, overlapIn) });
        }
      }
    }
    // Uneven cells: the first (or last) column and row as large as a sheet takes, the rest equal.
    for (const [cw, ch] of limits) {
      for (const columns of longEndSpans(prepared.width, cw, overlapIn)) {
        for (const rows of longEndSpans(prepared.height, ch, overlapIn)) candidates.push({ columns, rows });
      }
    }
    const seen = new Set<string>();
    for (const { columns, rows } of candidates) {
      const key = [...columns, ...rows].map(([a, b]) => `${a.toFixed(4)}-${b.toFixed(4)}`).join(',') + `|${columns.length}`;
      if (seen.has(key)) continue;
      seen.add(key);
      const grid = tileGridFromSpans(prepared, columns, rows, overlapIn);
      if (!grid.tiles.every((t) => frames.some((f) => fitsTile(t.used.width, t.used.height + CAPTION_IN, f)))) continue;
      const trials = columns.length * rows.length * template.copies <= 160;
      const items = Array.from({ length: template.copies }, () => grid.tiles.map((t) => ({ width: t.used.width, height: t.used.height + CAPTION_IN, quarterTurns: false, data: null }))).flat();
      // A quick packing (one order, one heuristic) ranks the candidates; the real one comes later.
      const sheets = trials ? packSheets(items, paper, marginIn, undefined, undefined, true).length : items.length;
      const count = grid.tiles.length;
      const area = grid.tiles.reduce((s, t) => s + t.used.width * t.used.height, 0);
      const better =
        !best || sheets < best.sheets || (sheets === best.sheets && (count < best.count || (count === best.count && area < best.area - 1e-9)));
      if (better) best = { grid, columns, rows, turn, sheets, count, area };
    }
  }
  if (!best) throw new RangeError(`section ${template.sectionLabel} cannot be tiled on this paper with this margin`);
  return best;
}

/**
 * Cuts of [0, length] into the fewest overlapping spans of at most `max` with the first (or the
 * last) span as long as allowed and the rest equal; none when one span is enough.
 */
function longEndSpans(length: number, max: number, overlapIn: number): Array<Array<[number, number]>> {
  const limit = max - 1e-6;
  if (limit <= overlapIn * 2 || length <= limit) return [];
  const fewest = Math.ceil((length - overlapIn) / (limit - overlapIn) - 1e-9);
  const rest = equalSpans(length - limit + overlapIn, fewest - 1, overlapIn);
  const shift = limit - overlapIn;
  return [
    [[0, limit], ...rest.map(([a, b]) => [a + shift, b + shift] as [number, number])],
    [...rest, [length - limit, length] as [number, number]],
  ];
}

/**
 * Whether a tile (which never turns) fits a sheet beside the test squares kept inside the margins: a
 * copy's first tile carries the tile map, so its sheet never raises them into the margin band.
 */
function fitsTile(w: number, h: number, frame: SheetFrame): boolean {
  const { width: W, height: H } = frame.content;
  const tb = frame.testBlock;
  return (w <= W && h <= H - cornerBlockDepthIn(frame, 'header')) || (w <= W - tb.width - TEST_BLOCK_GAP_IN && h <= H);
}

function placeWhole(piece: Piece, x: number, y: number, turned: boolean): SheetPlacement[] {
  const { prepared, pair, free } = piece;
  if (free) {
    return [
      {
        templateId: prepared.template.id,
        sectionLabel: prepared.template.sectionLabel,
        copies: prepared.template.copies,
        copy: piece.copy,
        rect: { x, y, width: free.width, height: free.height },
        transform: compose(translation(x, y), free.frame),
        turnDeg: free.turnDeg,
      },
    ];
  }
  const w = pair ? pair.width : prepared.width;
  const h = pair ? pair.height : prepared.height;
  // A quarter turn maps the box [0, w] × [0, h] onto [0, h] × [0, w]. Whole templates carry their
  // label inside (see draw-template.ts), so the box is the drawing alone.
  const onSheet: Affine = turned ? compose(translation(x + h, y), rotation(Math.PI / 2)) : translation(x, y);
  const rect: RectIn = turned ? { x, y, width: h, height: w } : { x, y, width: w, height: h };
  const base = {
    templateId: prepared.template.id,
    sectionLabel: prepared.template.sectionLabel,
    copies: prepared.template.copies,
    rect,
  };
  const extra = turned ? 90 : 0;
  if (!pair) {
    return [
      {
        ...base,
        copy: piece.copy,
        transform: compose(onSheet, prepared.frame),
        turnDeg: (prepared.turnDeg + extra) % 360,
      },
    ];
  }
  return [
    {
      ...base,
      copy: piece.copy,
      transform: compose(onSheet, pair.frames[0]),
      turnDeg: (pair.turnDeg[0] + extra) % 360,
      nestedWith: piece.copy + 1,
    },
    {
      ...base,
      copy: piece.copy + 1,
      transform: compose(onSheet, pair.frames[1]),
      turnDeg: (pair.turnDeg[1] + extra) % 360,
      nestedWith: piece.copy,
    },
  ];
}

function tileKey(templateId: string, copy: number, tile: { row: number; column: number }): string {
  return `${templateId}#${copy}#${tile.row},${tile.column}`;
}

function placeTile(piece: Piece, x: number, y: number, pageOfTile: Map<string, number>): SheetPlacement {
  const grid = piece.grid!;
  const tile = piece.tile!;
  const { prepared } = grid;
  const content: RectIn = { x, y: y + CAPTION_IN, width: tile.used.width, height: tile.used.height };
  const onSheet = translation(content.x - tile.used.x, content.y - tile.used.y);
  const toSheet = (p: Point) => applyAffine(onSheet, p);
  const occupied = Array.from({ length: grid.rows }, () => Array.from({ length: grid.columns }, () => false));
  const pageOf: Record<string, number> = {};
  for (const t of grid.tiles) {
    occupied[t.row - 1][t.column - 1] = true;
    pageOf[`${t.row},${t.column}`] = pageOfTile.get(tileKey(prepared.template.id, piece.copy, t)) ?? 0;
  }
  const alignmentMarks: Point[] = [];
  const joinLines: TilePlacement['joinLines'] = [];
  for (const other of grid.tiles) {
    const dr = other.row - tile.row;
    const dc = other.column - tile.column;
    if (Math.abs(dr) + Math.abs(dc) !== 1) continue;
    const shared = intersectRects(tile.used, other.used);
    if (!shared) continue;
    const neighbour = `row ${other.row}, column ${other.column}`;
    const horizontal = dc !== 0; // neighbour to the left or right: the shared strip is tall
    const along = horizontal ? shared.height : shared.width;
    const fractions = along >= 1.5 ? [0.2, 0.8] : [0.5];
    for (const f of fractions) {
      const m = horizontal
        ? { x: shared.x + shared.width / 2, y: shared.y + shared.height * f }
        : { x: shared.x + shared.width * f, y: shared.y + shared.height / 2 };
      alignmentMarks.push(toSheet(m));
    }
    // The neighbour's far edge of the shared strip is where its paper ends over this tile.
    const edge =
      dc === 1 ? [{ x: other.used.x, y: shared.y }, { x: other.used.x, y: shared.y + shared.height }]
      : dc === -1 ? [{ x: other.used.x + other.used.width, y: shared.y }, { x: other.used.x + other.used.width, y: shared.y + shared.height }]
      : dr === 1 ? [{ x: shared.x, y: other.used.y }, { x: shared.x + shared.width, y: other.used.y }]
      : [{ x: shared.x, y: other.used.y + other.used.height }, { x: shared.x + shared.width, y: other.used.y + other.used.height }];
    joinLines.push({ a: toSheet(edge[0]), b: toSheet(edge[1]), neighbour });
  }
  const firstTile = grid.tiles[0];
  return {
    templateId: prepared.template.id,
    sectionLabel: prepared.template.sectionLabel,
    copy: piece.copy,
    copies: prepared.template.copies,
    rect: content,
    transform: compose(onSheet, prepared.frame),
    turnDeg: prepared.turnDeg,
    caption: { rect: { x, y, width: tile.used.width, height: CAPTION_IN }, vertical: false },
    tile: {
      row: tile.row,
      column: tile.column,
      rows: grid.rows,
      columns: grid.columns,
      occupied,
      pageOf,
      first: firstTile.row === tile.row && firstTile.column === tile.column,
      alignmentMarks,
      joinLines,
    },
  };
}

/**
 * What a tile really covers: the part of its cutting line inside the tile, its alignment marks
 * (a cross 0.15 in. each way) and its join lines with their "edge of …" labels; the rest of the
 * tile's box stays free for other templates.
 */
function tileOutlines(placement: SheetPlacement, outline: Point[]): Point[][] {
  const rings: Point[][] = [];
  const body = clipRingToRect(outline, placement.rect);
  if (body.length >= 3) rings.push(body);
  const tile = placement.tile!;
  for (const m of tile.alignmentMarks) rings.push(rectRing({ x: m.x - 0.16, y: m.y - 0.16, width: 0.32, height: 0.32 }));
  for (const line of tile.joinLines) {
    rings.push([line.a, line.b]);
    const vertical = Math.abs(line.b.x - line.a.x) < Math.abs(line.b.y - line.a.y);
    const mid = { x: (line.a.x + line.b.x) / 2, y: (line.a.y + line.b.y) / 2 };
    // The label: 5 pt text centred on the line's middle, just outside it (see draw-template.ts).
    rings.push(rectRing(vertical ? { x: mid.x - 0.12, y: mid.y - 0.45, width: 0.12, height: 0.9 } : { x: mid.x - 0.45, y: mid.y - 0.12, width: 0.9, height: 0.12 }));
  }
  return rings;
}

function rectRing(r: RectIn): Point[] {
  return [{ x: r.x, y: r.y }, { x: r.x + r.width, y: r.y }, { x: r.x + r.width, y: r.y + r.height }, { x: r.x, y: r.y + r.height }];
}

/** Raster cell for fitting templates into gaps, inches. */
const FILL_CELL_IN = 0.1;
/** Templates tried per sheet when filling gaps (the largest first). */
const FILL_TEMPLATES_PER_SHEET = 6;

/**
 * Raster masks of outlines at each turn, kept between layouts (pure, keyed by the outline's shape: its
 * points from the first one, to the micro-inch, so copies of one shape anywhere in the block share them).
 */
const maskCache = new Map<string, ShapeMask>();
const MASK_CACHE_SIZE = 1024;

/**
 * Fills the gaps of each packed sheet with single copies, at any turn (every 22.5° for arcs and
 * wedges, quarter turns for straight sections), looking at the real cutting lines on a raster.
 */
function gapFiller(mirrored: boolean, outlines: (p: PackedItem<Piece>) => Point[][]): SheetFill<Piece> {
  const outlineKeys = new Map<string, string>();
  const shapes = new Map<string, { mask: ShapeMask; frame: Affine; width: number; height: number; turnDeg: number }>();
  const shapeAt = (prepared: PreparedTemplate, k: number, turns: number) => {
    const id = prepared.template.id;
    let entry = shapes.get(`${k}/${turns}|${id}`);
    if (entry) return entry;
    let outlineKey = outlineKeys.get(id);
    if (outlineKey === undefined) {
      const o = prepared.template.cuttingLine[0];
      outlineKey = prepared.template.cuttingLine.map((p) => `${(p.x - o.x).toFixed(6)},${(p.y - o.y).toFixed(6)}`).join(';');
      outlineKeys.set(id, outlineKey);
    }
    const turn = (2 * Math.PI * k) / turns;
    const m = compose(rotation(turn), mirrored ? MIRROR_X : IDENTITY);
    const ring = prepared.template.cuttingLine.map((p) => applyAffine(m, p));
    const box = boundingRect(ring);
    const frame = compose(translation(-box.x, -box.y), m);
    const key = `${mirrored ? 1 : 0}@${k}/${turns}|${outlineKey}`;
    let mask = maskCache.get(key);
    if (!mask) {
      // The mask is made from the outline simplified within 0.02 in., grown by the same amount.
      const local = simplifyRing(ring.map((p) => ({ x: p.x - box.x, y: p.y - box.y })), 0.02);
      mask = shapeMask(local, FILL_CELL_IN, 0.02);
      if (maskCache.size >= MASK_CACHE_SIZE) maskCache.delete(maskCache.keys().next().value!);
      maskCache.set(key, mask);
    }
    entry = { mask, frame, width: box.width, height: box.height, turnDeg: (360 * k) / turns };
    shapes.set(`${k}/${turns}|${id}`, entry);
    return entry;
  };
  return (frame, placed, left) => {
    const grid = occupancyGrid(frame.content, FILL_CELL_IN);
    // Obstacles were simplified within 0.02 in.: widen the gap to match.
    const gap = ITEM_GAP_IN + 0.02;
    for (const p of placed) for (const ring of outlines(p)) blockRing(grid, ring, gap);
    blockRing(grid, rectRing(frame.testBlock), gap);
    const byShape = new Map<string, PackItem<Piece>[]>();
    for (const item of left) {
      for (const part of item.parts ?? [item]) {
        // Tiles are rectangles: the box packing already places them as well as a raster would.
        if (part.data.pair || part.data.tile) continue;
        const key = part.data.prepared.template.id;
        const list = byShape.get(key) ?? [];
        list.push(part);
        byShape.set(key, list);
      }
    }
    const areaOf = (i: PackItem<Piece>) => i.areaSqIn ?? i.width * i.height;
    const order = [...byShape.values()].sort((a, b) => areaOf(b[0]) - areaOf(a[0])).slice(0, FILL_TEMPLATES_PER_SHEET);
    const out: Array<{ taken: PackItem<Piece>; packed: PackedItem<Piece> }> = [];
    for (const available of order) {
      const prepared = available[0].data.prepared;
      const turns = prepared.template.freeRotation ? 16 : 4;
      while (available.length > 0) {
        let best: { row: number; col: number; k: number } | null = null;
        for (let k = 0; k < turns; k++) {
          const spot = findSpot(grid, shapeAt(prepared, k, turns).mask);
          if (spot && (!best || spot.row < best.row || (spot.row === best.row && spot.col < best.col))) best = { ...spot, k };
        }
        if (!best) break;
        const taken = available.shift()!;
        const shape = shapeAt(prepared, best.k, turns);
        const x = grid.x0 + best.col * FILL_CELL_IN;
        const y = grid.y0 + best.row * FILL_CELL_IN;
        const piece: Piece = { prepared, copy: taken.data.copy, free: { frame: shape.frame, width: shape.width, height: shape.height, turnDeg: shape.turnDeg } };
        const packedItem: PackedItem<Piece> = {
          item: { width: shape.width, height: shape.height, quarterTurns: false, data: piece, areaSqIn: prepared.template.areaSqIn },
          x,
          y,
          turned: false,
          width: shape.width,
          height: shape.height,
        };
        out.push({ taken, packed: packedItem });
        for (const ring of outlines(packedItem)) blockRing(grid, ring, gap);
      }
    }
    return out;
  };
}
