import type { Point } from '../document/index';
import { applyAffine, compose, rotation, translation, type Affine } from './affine';
import type { PlannedSheet, PrintLayout, SheetPlacement, TemplateSummary, TilePlacement } from './layout-types';
import { packSheets, packSheetsWithin, type PackedItem, type PackItem, type SheetFill } from './pack-sheets';
import { blockRing, findSpot, occupancyGrid, ringsMask, shapeMask, type ShapeMask } from './raster-fill';
import { boundingRect, clipRingToRect } from './layout-geometry';
import { printableAreaSqIn, type RectIn } from './paper';
import { nestPair, separatedAt, simplifyRing, type NestedPair } from './nest-pair';
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
  // Simplified cutting lines (within 0.02 in.) for finding room for the test squares; the gap is widened to match.
  const simple = new Map(templates.map((t) => [t.id, simplifyRing(t.cuttingLine, 0.02)]));
  const outlineOf = (id: string, m: Affine) => simple.get(id)!.map((q) => applyAffine(m, q));
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
  // Oversize templates: the tilings that pack best on their own, best first.
  const tilingOptions = new Map<string, TileGrid[]>();
  for (const template of templates) {
    if (template.copies < 1) continue;
    const prepared = prepareTemplate(template, mirrored);
    if (fitsWhole(prepared, portrait) || fitsWhole(prepared, landscape)) continue;
    tilingOptions.set(template.id, cachedTilings(template, mirrored, [portrait, landscape], tileOverlapIn, paper, marginIn));
  }
  // Shapes of pieces for the gap filler, shared by the packings tried (keyed by tile, pair or turn).
  const shapes = new Map<string, FillShape>();
  const gridsOf = (choice: ReadonlyMap<string, number>) => new Map([...tilingOptions].map(([id, grids]) => [id, grids[choice.get(id) ?? 0]]));
  const pack = (choice: ReadonlyMap<string, number>, maxSheets = Infinity) => {
    const grids = gridsOf(choice);
    const pieces = piecesOf(templates, grids, mirrored, portrait, landscape);
    const packed = packSheetsWithin(pieces, paper, marginIn, maxSheets, outlines, gapFiller(mirrored, outlines, outlineOf, shapes));
    return packed && { grids, packed };
  };
  const quickCount = (choice: ReadonlyMap<string, number>) =>
    packSheets(piecesOf(templates, gridsOf(choice), mirrored, portrait, landscape), paper, marginIn, undefined, undefined, true).length;
  const { grids, packed } = chooseTilingsByPacking(templates, options, tilingOptions, pack, quickCount);

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

/** The pieces to pack: whole copies, nested pairs of copies, and the tiles of oversize templates by `grids`. */
function piecesOf(templates: readonly PrintTemplate[], grids: ReadonlyMap<string, TileGrid>, mirrored: boolean, portrait: SheetFrame, landscape: SheetFrame): PackItem<Piece>[] {
  const pieces: PackItem<Piece>[] = [];
  for (const template of templates) {
    if (template.copies < 1) continue;
    const grid = grids.get(template.id);
    const prepared = grid ? grid.prepared : prepareTemplate(template, mirrored);
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
          // The copy's map tile carries the tile map in its sheet's header.
          keepsHeader: tile === mapTile(grid),
        });
      }
    }
  }
  return pieces;
}

/**
 * Tilings kept as alternatives to the best one (packed alone) of an oversize template: how a tiling
 * packs beside the other templates (its small tiles sharing rows with their prints) shows only in the
 * whole packing, so these few are also packed with everything else.
 */
const TILING_ALTERNATIVES = 3;
/** The whole packing is repeated for other tilings only up to this many pieces (its time grows with them). */
const JOINT_PIECES_MAX = 80;

/** The tiling picked for each oversize template of a pattern (index into its options), by whole packing. */
const jointCache = new Map<string, ReadonlyMap<string, number>>();
const JOINT_CACHE_SIZE = 64;

/**
 * Packs the pattern with each oversize template's best tiling, then, one template at a time, with
 * each of its alternatives (the others kept at their pick so far), and keeps the packing with the
 * fewest sheets (the first such on ties, so the tiling that packs best alone wins unless another
 * saves a sheet). An alternative is packed in full only where a quick packing of boxes alone takes
 * no more sheets with it than with the pick so far. The pick is cached by pattern and options.
 */
function chooseTilingsByPacking<T>(
  templates: readonly PrintTemplate[],
  options: LayoutOptions,
  tilingOptions: ReadonlyMap<string, TileGrid[]>,
  pack: (choice: ReadonlyMap<string, number>, maxSheets?: number) => { grids: Map<string, TileGrid>; packed: T[] } | null,
  quickCount: (choice: ReadonlyMap<string, number>) => number,
): { grids: Map<string, TileGrid>; packed: T[] } {
  const open = [...tilingOptions].filter(([, o]) => o.length > 1);
  const pieceCount = templates.reduce((s, t) => s + (tilingOptions.has(t.id) ? tilingOptions.get(t.id)![0].tiles.length * t.copies : Math.max(0, t.copies)), 0);
  if (open.length === 0 || pieceCount > JOINT_PIECES_MAX) return pack(new Map())!;
  const key = [
    options.paper,
    options.marginIn,
    options.tileOverlapIn,
    options.mirrored ? 1 : 0,
    ...templates.map((t) => `${t.id}:${t.copies}:${t.freeRotation ? 1 : 0}:${t.cuttingLine.map((p) => `${p.x},${p.y}`).join(';')}`),
  ].join('|');
  const known = jointCache.get(key);
  if (known) return pack(known)!;
  let choice: ReadonlyMap<string, number> = new Map();
  let best = pack(choice)!;
  for (const [id, grids] of open) {
    // A quick packing of boxes alone (one order, one heuristic, no gaps filled) screens the alternatives:
    // only those that take no more sheets than the current pick that way are packed in full.
    const quick = grids.map((_, i) => quickCount(new Map(choice).set(id, i)));
    for (let i = 1; i < grids.length; i++) {
      if (quick[i] > quick[choice.get(id) ?? 0]) continue;
      const trial = new Map(choice).set(id, i);
      // Only a packing on fewer sheets counts: a trial gives up once it has filled as many.
      const tried = pack(trial, best.packed.length - 1);
      if (tried) {
        best = tried;
        choice = trial;
      }
    }
  }
  if (jointCache.size >= JOINT_CACHE_SIZE) jointCache.delete(jointCache.keys().next().value!);
  jointCache.set(key, choice);
  return best;
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
  jointCache.clear();
  maskCache.clear();
}

/** Tilings already ranked, by outline, copies and options (the ranking is pure and packs trial sheets). */
interface TilingSpans {
  columns: Array<[number, number]>;
  rows: Array<[number, number]>;
  turn: number;
}
const tilingCache = new Map<string, TilingSpans[]>();
const TILING_CACHE_SIZE = 256;

/** The best tilings of an oversize template (see {@link rankTilings}), best first. */
function cachedTilings(template: PrintTemplate, mirrored: boolean, frames: SheetFrame[], overlapIn: number, paper: PrintOptions['paper'], marginIn: number): TileGrid[] {
  const key = [paper, marginIn, overlapIn, mirrored ? 1 : 0, template.freeRotation ? 1 : 0, template.copies, template.cuttingLine.map((p) => `${p.x},${p.y}`).join(';')].join('|');
  const known = tilingCache.get(key);
  if (known) return known.map((k) => tileGridFromSpans(prepareTemplate(template, mirrored, k.turn), k.columns, k.rows, overlapIn));
  const ranked = rankTilings(template, mirrored, frames, overlapIn, paper, marginIn);
  if (tilingCache.size >= TILING_CACHE_SIZE) tilingCache.delete(tilingCache.keys().next().value!);
  tilingCache.set(key, ranked.map(({ columns, rows, turn }) => ({ columns, rows, turn })));
  return ranked.map((r) => r.grid);
}

/**
 * Ranks tilings by the sheets they pack onto alone (then the fewest tiles, then the least printed
 * area) and returns the best, then up to {@link TILING_ALTERNATIVES} − 1 others that pack onto as
 * few sheets alone with other tile sizes (the same tiling turned a quarter counts once). Candidates:
 * the smallest equal grids that fit, equal grids a row or column finer (smaller tiles can
 * share sheets), and grids whose first or last row and column are as large as a sheet takes (the
 * rest of the template in fewer, smaller tiles), over the template unturned and turned a quarter.
 * Each candidate's tiles, for every copy, are packed on their own to count its sheets.
 */
function rankTilings(
  template: PrintTemplate,
  mirrored: boolean,
  frames: SheetFrame[],
  overlapIn: number,
  paper: PrintOptions['paper'],
  marginIn: number,
): Array<{ grid: TileGrid; columns: Array<[number, number]>; rows: Array<[number, number]>; turn: number }> {
  const ranked: Array<{ grid: TileGrid; columns: Array<[number, number]>; rows: Array<[number, number]>; turn: number; sheets: number; count: number; area: number }> = [];
  const packedBySizes = new Map<string, number>();
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
      // A quick packing (one order, one heuristic) ranks the candidates; the real one comes later. Tilings
      // with the same tile sizes (a symmetric template turned a quarter) pack alike: packed once.
      const sizes = grid.tiles.map((t) => `${t.used.width.toFixed(4)}x${t.used.height.toFixed(4)}`).sort().join(' ');
      let sheets = trials ? packedBySizes.get(sizes) : grid.tiles.length * template.copies;
      if (sheets === undefined) {
        const items = Array.from({ length: template.copies }, () => grid.tiles.map((t) => ({ width: t.used.width, height: t.used.height + CAPTION_IN, quarterTurns: false, data: null }))).flat();
        sheets = packSheets(items, paper, marginIn, undefined, undefined, true).length;
        packedBySizes.set(sizes, sheets);
      }
      const count = grid.tiles.length;
      const area = grid.tiles.reduce((s, t) => s + t.used.width * t.used.height, 0);
      ranked.push({ grid, columns, rows, turn, sheets, count, area });
    }
  }
  if (ranked.length === 0) throw new RangeError(`section ${template.sectionLabel} cannot be tiled on this paper with this margin`);
  // Stable: among equals the first found stays first.
  ranked.sort((a, b) => a.sheets - b.sheets || a.count - b.count || (Math.abs(a.area - b.area) > 1e-9 ? a.area - b.area : 0));
  const kept: typeof ranked = [];
  const sizes = new Set<string>();
  for (const r of ranked) {
    if (kept.length >= TILING_ALTERNATIVES || r.sheets > ranked[0].sheets) break;
    const key = r.grid.tiles.map((t) => `${t.used.width.toFixed(2)}x${t.used.height.toFixed(2)}`).sort().join(' ');
    if (sizes.has(key)) continue;
    sizes.add(key);
    kept.push(r);
  }
  return kept;
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

/**
 * The tile whose sheet carries the copy's tile map: the largest (the first in reading order among
 * equals). A large tile often has a sheet to itself, so copies' maps seldom crowd one header, whose
 * middle holds only a few.
 */
function mapTile(grid: TileGrid): TileCell {
  let best = grid.tiles[0];
  for (const t of grid.tiles) if (t.used.width * t.used.height > best.used.width * best.used.height + 1e-9) best = t;
  return best;
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
  const carrier = mapTile(grid);
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
      first: carrier.row === tile.row && carrier.column === tile.column,
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

/** A piece placed by the gap filler: a tile or pair as it is (a pair maybe turned), a copy at its own turn. */
function at(item: PackItem<Piece>, shape: FillShape, k: number, x: number, y: number): PackedItem<Piece> {
  if (item.data.tile || item.data.pair) return { item, x, y, turned: k === 1, width: shape.width, height: shape.height };
  const { prepared, copy } = item.data;
  return {
    item: {
      width: shape.width,
      height: shape.height,
      quarterTurns: false,
      data: { prepared, copy, free: { frame: shape.frame, width: shape.width, height: shape.height, turnDeg: shape.turnDeg } },
      areaSqIn: prepared.template.areaSqIn,
    },
    x,
    y,
    turned: false,
    width: shape.width,
    height: shape.height,
  };
}

/** Spots a turn of a piece checks against the outlines before giving up on that turn. */
const FILL_CHECKS_PER_TURN = 24;

/**
 * From `ok` (where `fits` holds) towards `toward`, the farthest value that still fits, to within a
 * few thousandths (by halving: where the piece first touches its neighbours' gap).
 */
function slide(ok: number, toward: number, fits: (v: number) => boolean): number {
  if (fits(toward)) return toward;
  let good = ok;
  let bad = toward;
  for (let i = 0; i < 5; i++) {
    const mid = (good + bad) / 2;
    if (fits(mid)) good = mid;
    else bad = mid;
  }
  return good;
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

/** One way a piece may lie in a gap: its raster mask and, for a whole copy, its frame and box at that turn. */
interface FillShape {
  mask: ShapeMask;
  frame: Affine;
  width: number;
  height: number;
  turnDeg: number;
  /** Its outlines with its box at the origin, each with its bounding box. */
  rings: Array<{ ring: Point[]; box: RectIn }>;
}

/** Rings with their bounding boxes. */
function withBoxes(rings: Point[][]): Array<{ ring: Point[]; box: RectIn }> {
  return rings.map((ring) => ({ ring, box: boundingRect(ring) }));
}

/**
 * Fills the gaps of a sheet with single copies and tiles, looking at the real cutting lines on a raster
 * (with nothing placed yet, it lays out a whole sheet by outline). Whole copies are tried at every
 * 22.5° from the turn that gives them their smallest box for arcs and wedges (so 180° is among them:
 * wedges and arcs interlock head to tail), at quarter turns for straight sections; tiles never turn.
 * The largest pieces go first, each copy at the first free spot row by row from the top-left.
 */
function gapFiller(
  mirrored: boolean,
  outlines: (p: PackedItem<Piece>) => Point[][],
  outlineOf: (id: string, m: Affine) => Point[],
  shapes = new Map<string, FillShape>(),
): SheetFill<Piece> {
  const outlineKeys = new Map<string, string>();
  const shapeAt = (prepared: PreparedTemplate, k: number, turns: number): FillShape => {
    const id = prepared.template.id;
    let entry = shapes.get(`${k}/${turns}|${id}`);
    if (entry) return entry;
    let outlineKey = outlineKeys.get(id);
    if (outlineKey === undefined) {
      const o = prepared.template.cuttingLine[0];
      outlineKey = prepared.template.cuttingLine.map((p) => `${(p.x - o.x).toFixed(6)},${(p.y - o.y).toFixed(6)}`).join(';');
      outlineKeys.set(id, outlineKey);
    }
    // Arcs and wedges turn from their smallest-box turn (what the box packing uses), straight sections from none.
    const baseDeg = prepared.template.freeRotation ? prepared.turnDeg : 0;
    const turnDeg = (baseDeg + (360 * k) / turns) % 360;
    const m = compose(rotation((turnDeg * Math.PI) / 180), mirrored ? MIRROR_X : IDENTITY);
    const ring = prepared.template.cuttingLine.map((p) => applyAffine(m, p));
    const box = boundingRect(ring);
    const frame = compose(translation(-box.x, -box.y), m);
    const key = `${mirrored ? 1 : 0}@${k}/${turns}+hopeful|${outlineKey}`;
    let mask = maskCache.get(key);
    if (!mask) {
      const local = simplifyRing(ring.map((p) => ({ x: p.x - box.x, y: p.y - box.y })), 0.02);
      mask = shapeMask(local, FILL_CELL_IN, 0, false);
      if (maskCache.size >= MASK_CACHE_SIZE) maskCache.delete(maskCache.keys().next().value!);
      maskCache.set(key, mask);
    }
    entry = { mask, frame, width: box.width, height: box.height, turnDeg, rings: withBoxes([outlineOf(prepared.template.id, frame)]) };
    shapes.set(`${k}/${turns}|${id}`, entry);
    return entry;
  };
  /** A tile (never turned) or a nested pair (unturned or turned a quarter), its outlines with its box at the origin. */
  const boxShape = (item: PackItem<Piece>, turned: boolean): FillShape => {
    const { prepared, tile } = item.data;
    // A tile's key names its cell, so the tilings tried for one template never share a shape.
    const key = tile ? `tile|${prepared.template.id}|${prepared.turnDeg}|${tile.row},${tile.column}|${[tile.used.x, tile.used.y, tile.used.width, tile.used.height].join(',')}` : `pair|${prepared.template.id}|${turned}`;
    let entry = shapes.get(key);
    if (entry) return entry;
    const [w, h] = turned ? [item.height, item.width] : [item.width, item.height];
    const rings = outlines({ item, x: 0, y: 0, turned, width: w, height: h });
    entry = { mask: ringsMask(rings, w, h, FILL_CELL_IN, 0, false), frame: IDENTITY, width: w, height: h, turnDeg: turned ? 90 : 0, rings: withBoxes(rings) };
    shapes.set(key, entry);
    return entry;
  };
  const turnsOf = (item: PackItem<Piece>) => (item.data.tile ? 1 : item.data.pair ? 2 : item.data.prepared.template.freeRotation ? 16 : 4);
  const shapeOf = (item: PackItem<Piece>, k: number) => (item.data.tile || item.data.pair ? boxShape(item, k === 1) : shapeAt(item.data.prepared, k, turnsOf(item)));
  const emptySheets = new Map<string, Array<{ group: number; k: number; x: number; y: number }>>();
  return (frame, placed, left, lead = 0) => {
    const c = frame.content;
    // A hopeful raster proposes spots (a cell is blocked only where its centre lies within the gap of
    // something placed; a piece claims only the cells whose centres it covers); each spot is then
    // checked against the outlines themselves, and the piece slid up and left as far as they allow.
    const grid = occupancyGrid(c, FILL_CELL_IN);
    const halfDiagonal = (FILL_CELL_IN * Math.SQRT2) / 2;
    // Outlines are simplified within 0.02 in. (both sides of a gap): the gap checked is wider by that twice.
    const gap = ITEM_GAP_IN + 0.04;
    const blockGap = TEST_BLOCK_GAP_IN + TEMPLATE_CLEARANCE_IN + 0.02;
    const obstacles: Array<{ ring: Point[]; box: RectIn; gap: number }> = [];
    const addObstacle = (ring: Point[], g: number) => {
      obstacles.push({ ring, box: boundingRect(ring), gap: g });
      blockRing(grid, ring, Math.max(0, g - halfDiagonal));
    };
    for (const p of placed) for (const ring of outlines(p)) addObstacle(ring, gap);
    addObstacle(rectRing(frame.testBlock), blockGap);
    /** Whether a shape with its box's corner at (x, y) lies in the content area and keeps the gaps. */
    const clear = (shape: FillShape, x: number, y: number): boolean => {
      if (x < c.x - 1e-9 || y < c.y - 1e-9 || x + shape.width > c.x + c.width + 1e-9 || y + shape.height > c.y + c.height + 1e-9) return false;
      for (const { ring, box } of shape.rings) {
        for (const o of obstacles) {
          const b = o.box;
          if (box.x + x > b.x + b.width + o.gap || b.x > box.x + x + box.width + o.gap || box.y + y > b.y + b.height + o.gap || b.y > box.y + y + box.height + o.gap) continue;
          if (!separatedAt(ring, x, y, o.ring, o.gap, box, o.box)) return false;
        }
      }
      return true;
    };
    // A first tile carries the tile map in the header, which raised test squares leave no room for.
    const raised = frame.testBlock.y < frame.printable.y - 1e-9;
    // Nested pairs are offered whole (their outlines interlock) and as their two copies: whichever is
    // placed first uses the copies up.
    const byShape = new Map<string, PackItem<Piece>[]>();
    const parentOf = new Map<PackItem<Piece>, PackItem<Piece>>();
    const offer = (key: string, item: PackItem<Piece>) => {
      const list = byShape.get(key) ?? [];
      list.push(item);
      byShape.set(key, list);
    };
    for (const item of left) {
      if (item.data.pair) offer(`pair|${item.data.prepared.template.id}`, item);
      for (const part of item.parts ?? [item]) {
        if (part.data.pair || (raised && part.keepsHeader)) continue;
        if (part !== item) parentOf.set(part, item);
        const tile = part.data.tile;
        offer(tile ? `${part.data.prepared.template.id}#${tile.row},${tile.column}` : part.data.prepared.template.id, part);
      }
    }
    const used = new Set<PackItem<Piece>>();
    const free = (i: PackItem<Piece>) => !used.has(i) && !(parentOf.has(i) && used.has(parentOf.get(i)!)) && !(i.parts?.some((p) => used.has(p)) ?? false);
    const areaOf = (i: PackItem<Piece>) => i.areaSqIn ?? i.width * i.height;
    const order = [...byShape.entries()].sort((x, y) => areaOf(y[1][0]) - areaOf(x[1][0])).slice(0, FILL_TEMPLATES_PER_SHEET);
    if (lead > 0) {
      if (lead >= order.length) return [];
      order.unshift(...order.splice(lead, 1));
    }
    const out: Array<{ taken: PackItem<Piece>; packed: PackedItem<Piece> }> = [];
    const put = (item: PackItem<Piece>, shape: FillShape, k: number, x: number, y: number) => {
      used.add(item);
      out.push({ taken: item, packed: at(item, shape, k, x, y) });
      for (const { ring } of shape.rings) addObstacle(ring.map((q) => ({ x: q.x + x, y: q.y + y })), gap);
    };
    // A sheet laid out from empty depends only on the kinds of piece left and how many of each: sheets
    // alike (the same pieces, other copies) reuse the first one's moves.
    const memoKey = placed.length === 0 ? [frame.orientation, frame.testBlock.x, frame.testBlock.y, lead, ...order.map(([key, g]) => `${key}:${g.filter(free).length}`)].join('|') : null;
    const known = memoKey === null ? undefined : emptySheets.get(memoKey);
    if (known) {
      for (const move of known) {
        const item = order[move.group][1].find(free)!;
        put(item, shapeOf(item, move.k), move.k, move.x, move.y);
      }
      return out;
    }
    const moves: Array<{ group: number; k: number; x: number; y: number }> = [];
    for (const [groupIndex, [, group]] of order.entries()) {
      const available = group.filter(free);
      if (available.length === 0) continue;
      const turns = turnsOf(available[0]);
      while (available.length > 0) {
        if (!free(available[0])) {
          available.shift();
          continue;
        }
        const item = available[0];
        let best: { row: number; col: number; bottom: number; shape: FillShape; k: number } | null = null;
        for (let k = 0; k < turns; k++) {
          const shape = shapeOf(item, k);
          let from = { row: 0, col: 0 };
          for (let tries = 0; tries < FILL_CHECKS_PER_TURN; tries++) {
            const spot = findSpot(grid, shape.mask, from.row, from.col);
            // The spot whose bottom edge is highest wins, then the leftmost. Spots come row by row: once
            // past the best so far, this turn cannot beat it.
            if (!spot) break;
            const bottom = spot.row + shape.mask.rows;
            if (best && (bottom > best.bottom || (bottom === best.bottom && spot.col >= best.col))) break;
            if (clear(shape, grid.x0 + spot.col * FILL_CELL_IN, grid.y0 + spot.row * FILL_CELL_IN)) {
              best = { ...spot, bottom, shape, k };
              break;
            }
            from = { row: spot.row, col: spot.col + 1 };
          }
        }
        if (!best) break;
        const { shape, k } = best;
        // Slide up, then left, as far as the outlines allow (the raster's rows and columns are 0.1 in. apart).
        let x = grid.x0 + best.col * FILL_CELL_IN;
        let y = grid.y0 + best.row * FILL_CELL_IN;
        y = slide(y, Math.max(c.y, y - FILL_CELL_IN), (v) => clear(shape, x, v));
        x = slide(x, Math.max(c.x, x - FILL_CELL_IN), (v) => clear(shape, v, y));
        available.shift();
        put(item, shape, k, x, y);
        moves.push({ group: groupIndex, k, x, y });
      }
    }
    if (memoKey !== null) emptySheets.set(memoKey, moves);
    return out;
  };
}
