import type { Fabric, PatternDocument, QuiltLayout } from '../document/pattern-schema';
import { buildCuttingList } from '../fabrication/cutting-list/build-cutting-list';
import type { CuttingList } from '../fabrication/cutting-list/cutting-list-types';
import { planWofStrips } from '../fabrication/cutting-list/wof-strips';
import { YARDAGE_STEP_IN, roundUpToStep } from '../fabrication/shared/rounding';
import { blockDrawingBounds, defaultBlockSizeIn, type BlockBounds } from './block-size';
import { applyColourway } from './colourway';
import { backingCuts, bindingCuts, borderCuts, cleanLength, onPointSashingCounts, quiltCentreSize, quiltPositions, settingTriangleCuts, yardsToBuy } from './quilt-formulas';
import {
  QuiltPlanError,
  type AffineTransform,
  type QuiltCliJson,
  type QuiltFabricNeed,
  type QuiltPlan,
  type QuiltPlanBorder,
  type QuiltPlanCell,
  type QuiltPlanOptions,
  type QuiltPolygon,
  type QuiltRect,
  type QuiltSashing,
  type QuiltSettingPieceGroup,
  type QuiltSizeRow,
  type SizeIn,
} from './quilt-types';

/** Usable WOF when a part of the quilt names no fabric (common practice: 40–42 in.). */
const DEFAULT_USABLE_WOF_IN = 42;

/**
 * The quilt a pattern's layout makes, in one named size and one colourway (design §11,
 * docs/quilt-layout.md): finished size, blocks and cells (with the transforms to draw them), on-point
 * setting triangles, sashing and cornerstones, plain alternate blocks, borders (sides first), binding,
 * backing, batting, the block cutting list for every block and the whole quilt's yardage per fabric.
 * Throws {@link QuiltPlanError} when the document has no quilt or names an unknown size or colourway.
 */
export function quiltPlan(document: PatternDocument, options: QuiltPlanOptions = {}): QuiltPlan {
  if (!document.quilt) throw new QuiltPlanError('the pattern has no quilt layout', 'quilt');
  const doc = applyColourway(document, options.colourwayId);
  const layout = document.quilt;
  const sizeName = options.sizeName ?? null;
  let columns = layout.columns;
  let rows = layout.rows;
  if (sizeName !== null) {
    const size = layout.sizes.find((s) => s.name === sizeName);
    if (!size) {
      const known = layout.sizes.map((s) => `"${s.name}"`).join(', ') || 'none';
      throw new QuiltPlanError(`unknown size "${sizeName}" (the pattern has: ${known})`, 'sizeName');
    }
    columns = size.columns;
    rows = size.rows;
  }
  const problems: string[] = [];
  const onPoint = layout.setting === 'on-point';
  const allowanceIn = doc.seamAllowanceIn;
  const bounds = blockDrawingBounds(doc);
  const block: SizeIn = layout.blockSizeIn ?? defaultBlockSizeIn(doc);
  if (onPoint && Math.abs(block.width - block.height) > 1e-3) {
    problems.push(`the block is ${block.width} × ${block.height} in.; an on-point setting needs a square block, so its width is used both ways`);
  }
  const sashingIn = layout.sashing ? layout.sashing.widthIn : 0;
  const centre = quiltCentreSize(layout.setting, columns, rows, block, sashingIn);
  const bordersIn = layout.borders.reduce((s, b) => s + b.widthIn, 0);
  const finished: SizeIn = { width: cleanLength(centre.width + 2 * bordersIn), height: cleanLength(centre.height + 2 * bordersIn) };

  const cells = layoutCells(layout, columns, rows, block, bounds, bordersIn, sashingIn);
  if (!onPoint && Math.abs(block.width - block.height) > 1e-3 && cells.some((c) => c.rotateDeg === 90 || c.rotateDeg === 270)) {
    problems.push('a block turned a quarter does not fit the grid when the block is not square');
  }
  const positions = quiltPositions(layout.setting, columns, rows);
  const alternates = cells.filter((c) => c.alternate).length;
  const blockCount = positions - alternates;

  // Setting pieces, per fabric.
  const setting = new Map<string, QuiltSettingPieceGroup[]>();
  const fabricsById = new Map(doc.fabrics.map((f) => [f.id, f]));
  const wofOf = (fabricId: string | null | undefined) => (fabricId ? fabricsById.get(fabricId)?.usableWofIn : undefined) ?? DEFAULT_USABLE_WOF_IN;
  const addPieces = (fabricId: string | null, use: string, a: number, b: number, count: number) => {
    if (count <= 0) return;
    if (!fabricId) {
      problems.push(`${count} × ${use} have no fabric: they are left out of the yardage`);
      return;
    }
    const widthIn = cleanLength(Math.min(a, b));
    const lengthIn = cleanLength(Math.max(a, b));
    const list = setting.get(fabricId) ?? [];
    // Equal pieces for the same use share strips (sashing between blocks and between rows of square blocks).
    const same = list.findIndex((g) => g.use === use && g.widthIn === widthIn && g.lengthIn === lengthIn);
    if (same >= 0) {
      count += list[same]!.count;
      list.splice(same, 1);
    }
    const plan = planWofStrips({ widthIn, lengthIn, count }, wofOf(fabricId));
    list.push({
      use,
      widthIn,
      lengthIn,
      count,
      stripWidthIn: plan?.stripWidthIn ?? null,
      piecesPerStrip: plan?.piecesPerStrip ?? null,
      stripCount: plan?.stripCount ?? 0,
      lengthwiseIn: plan ? 0 : count * lengthIn,
    });
    setting.set(fabricId, list);
  };

  let sashing: QuiltSashing | null = null;
  const sashingRects: QuiltRect[] = [];
  const sashingPolygons: QuiltPolygon[] = [];
  if (layout.sashing && onPoint) {
    const s = layout.sashing;
    const cut = cleanLength(s.widthIn + 2 * allowanceIn);
    const cornerstoneFabric = s.cornerstoneFabricId ?? s.fabricId;
    const counts = onPointSashingCounts(columns, rows);
    const none = { count: 0, cutWidthIn: cut, cutLengthIn: cleanLength(block.width + 2 * allowanceIn) };
    sashing = {
      fabricId: s.fabricId,
      widthIn: s.widthIn,
      verticalStrips: none,
      horizontalStrips: { ...none },
      diagonalStrips: { count: counts.strips, cutWidthIn: cut, cutLengthIn: cleanLength(block.width + 2 * allowanceIn) },
      cornerstones: { count: counts.cornerstones, cutSquareIn: cut, fabricId: cornerstoneFabric },
    };
    addPieces(s.fabricId, 'sashing strips', cut, sashing.diagonalStrips!.cutLengthIn, counts.strips);
    addPieces(cornerstoneFabric, 'cornerstones', cut, cut, counts.cornerstones);
    sashingPolygons.push(...onPointSashing(cells, block.width, s.widthIn, s.fabricId, cornerstoneFabric));
  } else if (layout.sashing) {
    const s = layout.sashing;
    const cut = cleanLength(s.widthIn + 2 * allowanceIn);
    const cornerstoneFabric = s.cornerstoneFabricId ?? s.fabricId;
    sashing = {
      fabricId: s.fabricId,
      widthIn: s.widthIn,
      verticalStrips: { count: rows * (columns - 1), cutWidthIn: cut, cutLengthIn: cleanLength(block.height + 2 * allowanceIn) },
      horizontalStrips: { count: (rows - 1) * columns, cutWidthIn: cut, cutLengthIn: cleanLength(block.width + 2 * allowanceIn) },
      diagonalStrips: null,
      cornerstones: { count: (rows - 1) * (columns - 1), cutSquareIn: cut, fabricId: cornerstoneFabric },
    };
    addPieces(s.fabricId, 'sashing strips', cut, sashing.verticalStrips.cutLengthIn, sashing.verticalStrips.count);
    addPieces(s.fabricId, 'sashing strips', cut, sashing.horizontalStrips.cutLengthIn, sashing.horizontalStrips.count);
    addPieces(cornerstoneFabric, 'cornerstones', cut, cut, sashing.cornerstones.count);
    const step = { x: block.width + s.widthIn, y: block.height + s.widthIn };
    for (let r = 0; r < rows; r++) {
      for (let c = 0; c < columns; c++) {
        const x = bordersIn + c * step.x;
        const y = bordersIn + r * step.y;
        if (c < columns - 1) sashingRects.push(rect(x + block.width, y, s.widthIn, block.height, s.fabricId));
        if (r < rows - 1) sashingRects.push(rect(x, y + block.height, block.width, s.widthIn, s.fabricId));
        if (c < columns - 1 && r < rows - 1) sashingRects.push(rect(x + block.width, y + block.height, s.widthIn, s.widthIn, cornerstoneFabric));
      }
    }
  }

  const alternateBlocks =
    alternates > 0 && layout.alternateFabricId
      ? { fabricId: layout.alternateFabricId, count: alternates, cutWidthIn: cleanLength(block.width + 2 * allowanceIn), cutHeightIn: cleanLength(block.height + 2 * allowanceIn) }
      : null;
  if (alternateBlocks) addPieces(alternateBlocks.fabricId, 'plain alternate blocks', alternateBlocks.cutWidthIn, alternateBlocks.cutHeightIn, alternateBlocks.count);

  let settingTriangles: QuiltPlan['settingTriangles'] = null;
  const settingTrianglePolygons: QuiltPolygon[] = [];
  if (onPoint) {
    const t = settingTriangleCuts(block.width, columns, rows, sashingIn);
    const fabricId = layout.settingTrianglesFabricId ?? null;
    settingTriangles = { fabricId, ...t };
    addPieces(fabricId, 'squares for side setting triangles (cut twice on the diagonal)', t.sideCutSquareIn, t.sideCutSquareIn, t.sideSquares);
    addPieces(fabricId, 'squares for corner triangles (cut once on the diagonal)', t.cornerCutSquareIn, t.cornerCutSquareIn, t.cornerSquares);
    settingTrianglePolygons.push(...onPointTriangles((block.width + sashingIn) * Math.SQRT2, sashingIn / Math.SQRT2, columns, rows, bordersIn, fabricId));
  }

  // Borders, inside out: each sewn to the quilt as it is by then.
  const borders: QuiltPlanBorder[] = [];
  const borderRects: QuiltRect[] = [];
  let inner: SizeIn = centre;
  let outside = bordersIn;
  layout.borders.forEach((b, i) => {
    const wof = wofOf(b.fabricId);
    const cuts = borderCuts(inner, b.widthIn, allowanceIn, wof);
    borders.push({
      index: i + 1,
      fabricId: b.fabricId,
      widthIn: b.widthIn,
      cutWidthIn: cuts.cutWidthIn,
      innerSizeIn: inner,
      sides: { count: 2, cutLengthIn: cuts.sideCutLengthIn },
      topAndBottom: { count: 2, cutLengthIn: cuts.topCutLengthIn },
      totalLengthIn: cuts.totalLengthIn,
      strips: cuts.strips,
      joins: cuts.joins,
      usableWofIn: wof,
    });
    const o = outside - b.widthIn;
    borderRects.push(
      rect(o, o + b.widthIn, b.widthIn, inner.height, b.fabricId),
      rect(o + b.widthIn + inner.width, o + b.widthIn, b.widthIn, inner.height, b.fabricId),
      rect(o, o, inner.width + 2 * b.widthIn, b.widthIn, b.fabricId),
      rect(o, o + b.widthIn + inner.height, inner.width + 2 * b.widthIn, b.widthIn, b.fabricId),
    );
    outside = o;
    inner = { width: cleanLength(inner.width + 2 * b.widthIn), height: cleanLength(inner.height + 2 * b.widthIn) };
  });

  const bindingFabric = layout.binding.fabricId ?? null;
  const bindingWof = wofOf(bindingFabric);
  const bind = bindingCuts(finished, layout.binding.stripWidthIn, layout.binding.extraIn, bindingWof);
  const binding = {
    fabricId: bindingFabric,
    strips: bind.strips,
    stripWidthIn: layout.binding.stripWidthIn,
    perimeterIn: bind.perimeterIn,
    extraIn: layout.binding.extraIn,
    lengthIn: bind.lengthIn,
    usableWofIn: bindingWof,
    yards: bind.yards,
  };
  const backingFabric = layout.backing.fabricId ?? null;
  const backingWof = wofOf(backingFabric);
  const back = backingCuts(finished, layout.backing.marginIn, backingWof);
  const backing = {
    fabricId: backingFabric,
    marginIn: layout.backing.marginIn,
    widthIn: back.widthIn,
    heightIn: back.heightIn,
    usableWofIn: backingWof,
    widths: back.widths,
    seams: back.seams,
    widthLengthIn: back.widthLengthIn,
    lengthIn: back.lengthIn,
    yards: back.yards,
  };
  if (!bindingFabric) problems.push('the binding has no fabric: its yardage is shown apart');
  if (!backingFabric) problems.push('the backing has no fabric: its yardage is shown apart');

  const blockCuttingList = blockCuttingListFor(doc, blockCount);
  for (const p of blockCuttingList.problems) problems.push(p.message);

  const fabrics = doc.fabrics.map((f) =>
    fabricNeed(f, {
      blocksIn: blockCuttingList.fabrics.find((x) => x.fabricId === f.id)?.fabricLengthIn ?? 0,
      settingPieces: setting.get(f.id) ?? [],
      borders: borders.filter((b) => b.fabricId === f.id),
      bindingStrips: bindingFabric === f.id ? binding.strips * binding.stripWidthIn : 0,
      bindingStripCount: bindingFabric === f.id ? binding.strips : 0,
      backingIn: backingFabric === f.id ? backing.lengthIn : 0,
    }),
  );
  const totalYards = fabrics.reduce((s, f) => s + f.yards, 0) + (bindingFabric ? 0 : binding.yards) + (backingFabric ? 0 : backing.yards);

  return {
    title: doc.title,
    setting: layout.setting,
    sizeName,
    colourwayId: options.colourwayId ?? null,
    columns,
    rows,
    blockSizeIn: block,
    blockBoundsIn: bounds,
    blockDiagonalIn: onPoint ? cleanLength(block.width * Math.SQRT2) : null,
    unitDiagonalIn: onPoint ? cleanLength((block.width + sashingIn) * Math.SQRT2) : null,
    centreSizeIn: centre,
    finishedSizeIn: finished,
    positions,
    blockCount,
    cells,
    settingTriangles,
    settingTrianglePolygons,
    sashing,
    sashingRects,
    sashingPolygons,
    alternateBlocks,
    borders,
    borderRects,
    binding,
    backing,
    batting: { width: backing.widthIn, height: backing.heightIn },
    blockCuttingList,
    fabrics,
    totalYards: cleanLength(totalYards),
    problems,
  };
}

// The block cutting list is the costly part of a plan (every patch's rough cut); the size chart and a
// screen that re-plans as the designer types ask for the same few lists again. Documents are treated as
// immutable: an edit makes a new `sections` array, which misses this cache.
const cuttingLists = new WeakMap<PatternDocument['sections'], Map<string, CuttingList>>();
const CUTTING_LISTS_PER_DRAFT = 16;

/** `buildCuttingList` of the document for `blockCount` blocks, remembered per drafting (read-only result). */
function blockCuttingListFor(doc: PatternDocument, blockCount: number): CuttingList {
  const key = JSON.stringify([doc.title, doc.fabrics, doc.seamAllowanceIn, doc.piecingMarginIn, blockCount]);
  let lists = cuttingLists.get(doc.sections);
  if (!lists) cuttingLists.set(doc.sections, (lists = new Map()));
  const known = lists.get(key);
  if (known) return known;
  const list = buildCuttingList({ ...doc, blockCount });
  if (lists.size >= CUTTING_LISTS_PER_DRAFT) lists.delete(lists.keys().next().value!);
  lists.set(key, list);
  return list;
}

function fabricNeed(
  f: Fabric,
  parts: { blocksIn: number; settingPieces: QuiltSettingPieceGroup[]; borders: QuiltPlanBorder[]; bindingStrips: number; bindingStripCount: number; backingIn: number },
): QuiltFabricNeed {
  const settingIn = parts.settingPieces.reduce((s, g) => s + (g.stripWidthIn !== null ? g.stripCount * g.stripWidthIn : g.lengthwiseIn), 0);
  const borderStrips = parts.borders.reduce((s, b) => s + b.strips, 0);
  const bordersIn = parts.borders.reduce((s, b) => s + b.strips * b.cutWidthIn, 0);
  const fabricLengthIn = cleanLength(parts.blocksIn + settingIn + bordersIn + parts.bindingStrips + parts.backingIn);
  const yardageIn = roundUpToStep(fabricLengthIn, YARDAGE_STEP_IN);
  return {
    id: f.id,
    name: f.name,
    colour: f.colour,
    usableWofIn: f.usableWofIn,
    blocksIn: parts.blocksIn,
    settingPieces: parts.settingPieces,
    settingIn: cleanLength(settingIn),
    borderStrips,
    bordersIn: cleanLength(bordersIn),
    bindingStrips: parts.bindingStripCount,
    bindingIn: cleanLength(parts.bindingStrips),
    backingIn: parts.backingIn,
    fabricLengthIn,
    yardageIn,
    yards: yardsToBuy(fabricLengthIn),
  };
}

function rect(xIn: number, yIn: number, widthIn: number, heightIn: number, fabricId: string | null): QuiltRect {
  return { xIn: cleanLength(xIn), yIn: cleanLength(yIn), widthIn: cleanLength(widthIn), heightIn: cleanLength(heightIn), fabricId };
}

/** Every block position with its turn, mirroring, plainness, centre and drawing transform. */
function layoutCells(layout: QuiltLayout, columns: number, rows: number, block: SizeIn, bounds: BlockBounds, bordersIn: number, sashingIn: number): QuiltPlanCell[] {
  const given = new Map((layout.cells ?? []).map((c) => [`${c.row},${c.col}`, c]));
  const onPoint = layout.setting === 'on-point';
  // On point the blocks sit on a grid of sashed units (diagonal D); the outer sashing moves them m in.
  const D = (block.width + sashingIn) * Math.SQRT2;
  const m = sashingIn / Math.SQRT2;
  const out: QuiltPlanCell[] = [];
  const rowCount = onPoint ? 2 * rows - 1 : rows;
  for (let row = 0; row < rowCount; row++) {
    const inRow = onPoint && row % 2 === 1 ? columns - 1 : columns;
    for (let col = 0; col < inRow; col++) {
      const c = given.get(`${row},${col}`);
      const centreIn = onPoint
        ? { x: bordersIn + m + (row % 2 === 0 ? (col + 0.5) * D : (col + 1) * D), y: bordersIn + m + ((row + 1) * D) / 2 }
        : { x: bordersIn + col * (block.width + sashingIn) + block.width / 2, y: bordersIn + row * (block.height + sashingIn) + block.height / 2 };
      const rotateDeg = c?.rotateDeg ?? 0;
      const mirrored = c?.mirrored ?? false;
      out.push({
        row,
        col,
        rotateDeg,
        mirrored,
        alternate: (c?.alternate ?? false) && layout.alternateFabricId !== undefined,
        centreIn: { x: cleanLength(centreIn.x), y: cleanLength(centreIn.y) },
        transform: cellTransform(bounds, block, rotateDeg + (onPoint ? 45 : 0), mirrored, centreIn),
      });
    }
  }
  return out;
}

/**
 * Block drawing → quilt: scale the drawn bounds to the finished block, mirror left to right, turn clockwise
 * on screen (y down) by `turnDeg`, move the bounds' centre onto `centre`.
 */
export function cellTransform(bounds: BlockBounds, block: SizeIn, turnDeg: number, mirrored: boolean, centre: { x: number; y: number }): AffineTransform {
  const sx = bounds.width > 0 ? block.width / bounds.width : 1;
  const sy = bounds.height > 0 ? block.height / bounds.height : 1;
  const t = (turnDeg * Math.PI) / 180;
  const cos = snap(Math.cos(t));
  const sin = snap(Math.sin(t));
  const m = mirrored ? -1 : 1;
  const a = cos * m * sx;
  const b = sin * m * sx;
  const c = -sin * sy;
  const d = cos * sy;
  const bx = bounds.x + bounds.width / 2;
  const by = bounds.y + bounds.height / 2;
  return [a, b, c, d, centre.x - (a * bx + c * by), centre.y - (b * bx + d * by)].map(cleanTransform) as unknown as AffineTransform;
}

function snap(v: number): number {
  return Math.abs(v) < 1e-12 ? 0 : Math.abs(Math.abs(v) - 1) < 1e-12 ? Math.sign(v) : v;
}

function cleanTransform(v: number): number {
  const r = Math.round(v * 1e9) / 1e9;
  return r === 0 ? 0 : r;
}

/**
 * The side and corner setting triangles of an on-point quilt as drawn (finished), in quilt coordinates:
 * D the diagonal of a (sashed) unit, m the outer sashing's reach beyond the units (s/√2; 0 without sashing).
 */
function onPointTriangles(D: number, m: number, columns: number, rows: number, o: number, fabricId: string | null): QuiltPolygon[] {
  const h = D / 2;
  const c = m + h; // a corner triangle's short side
  const W = columns * D + 2 * m;
  const H = rows * D + 2 * m;
  const p = (x: number, y: number) => ({ x: cleanLength(o + x), y: cleanLength(o + y) });
  const out: QuiltPolygon[] = [];
  for (let j = 0; j < columns - 1; j++) {
    const x = m + (j + 1) * D;
    out.push({ points: [p(x - h, 0), p(x + h, 0), p(x, h)], fabricId });
    out.push({ points: [p(x - h, H), p(x, H - h), p(x + h, H)], fabricId });
  }
  for (let i = 0; i < rows - 1; i++) {
    const y = m + (i + 1) * D;
    out.push({ points: [p(0, y - h), p(h, y), p(0, y + h)], fabricId });
    out.push({ points: [p(W, y - h), p(W, y + h), p(W - h, y)], fabricId });
  }
  out.push(
    { points: [p(0, 0), p(c, 0), p(0, c)], fabricId },
    { points: [p(W - c, 0), p(W, 0), p(W, c)], fabricId },
    { points: [p(0, H - c), p(c, H), p(0, H)], fabricId },
    { points: [p(W, H - c), p(W, H), p(W - c, H)], fabricId },
  );
  return out;
}

/**
 * On-point sashing as drawn: round every block's centre the sashed unit (side w + s, turned 45°) has a
 * cornerstone (a square of side s turned 45°) at each corner and a strip (w × s) along each side; units
 * that touch share them, so each is drawn once.
 */
function onPointSashing(cells: readonly QuiltPlanCell[], w: number, s: number, stripFabric: string, cornerstoneFabric: string): QuiltPolygon[] {
  const D = (w + s) * Math.SQRT2;
  const m = s / Math.SQRT2; // half a cornerstone's diagonal
  const key = (x: number, y: number) => `${Math.round(x * 1e4)},${Math.round(y * 1e4)}`;
  const corners = new Map<string, { x: number; y: number }>();
  const sides = new Map<string, [{ x: number; y: number }, { x: number; y: number }]>();
  for (const cell of cells) {
    const { x, y } = cell.centreIn;
    const ring = [
      { x, y: y - D / 2 },
      { x: x + D / 2, y },
      { x, y: y + D / 2 },
      { x: x - D / 2, y },
    ];
    ring.forEach((a, i) => {
      const b = ring[(i + 1) % 4]!;
      corners.set(key(a.x, a.y), a);
      const k = [key(a.x, a.y), key(b.x, b.y)].sort().join('|');
      if (!sides.has(k)) sides.set(k, [a, b]);
    });
  }
  const p = (x: number, y: number) => ({ x: cleanLength(x), y: cleanLength(y) });
  const out: QuiltPolygon[] = [];
  for (const [a, b] of sides.values()) {
    // Along the side from a to b (unit t), across it (unit n): the strip leaves s/2 of the side to each cornerstone.
    const len = Math.hypot(b.x - a.x, b.y - a.y);
    const t = { x: (b.x - a.x) / len, y: (b.y - a.y) / len };
    const n = { x: -t.y, y: t.x };
    const e = s / 2;
    out.push({
      points: [
        p(a.x + t.x * e + n.x * e, a.y + t.y * e + n.y * e),
        p(b.x - t.x * e + n.x * e, b.y - t.y * e + n.y * e),
        p(b.x - t.x * e - n.x * e, b.y - t.y * e - n.y * e),
        p(a.x + t.x * e - n.x * e, a.y + t.y * e - n.y * e),
      ],
      fabricId: stripFabric,
    });
  }
  for (const c of corners.values()) {
    out.push({ points: [p(c.x, c.y - m), p(c.x + m, c.y), p(c.x, c.y + m), p(c.x - m, c.y)], fabricId: cornerstoneFabric });
  }
  return out;
}

/** The CLI's `quilt --json` answer, exactly the shape of issue 21 (lengths in inches, yards as decimals). */
export function quiltCliJson(plan: QuiltPlan): QuiltCliJson {
  const t = plan.settingTriangles;
  return {
    finishedSizeIn: { width: plan.finishedSizeIn.width, height: plan.finishedSizeIn.height },
    blockCount: plan.blockCount,
    settingTriangles: t ? { sideCutSquareIn: t.sideCutSquareIn, sideSquares: t.sideSquares, cornerCutSquareIn: t.cornerCutSquareIn, cornerSquares: t.cornerSquares } : null,
    binding: { strips: plan.binding.strips, stripWidthIn: plan.binding.stripWidthIn, lengthIn: plan.binding.lengthIn, yards: plan.binding.yards },
    backing: { widthIn: plan.backing.widthIn, heightIn: plan.backing.heightIn, widths: plan.backing.widths, seams: plan.backing.seams, yards: plan.backing.yards },
    batting: { width: plan.batting.width, height: plan.batting.height },
    fabrics: plan.fabrics.map((f) => ({ id: f.id, name: f.name, yards: f.yards })),
  };
}

/**
 * The size chart (design §11): for each named size of the layout, the finished size, block count and
 * yardage per fabric, in the given colourway. Empty when the layout names no size; throws
 * {@link QuiltPlanError} when the document has no quilt.
 */
export function quiltSizes(document: PatternDocument, options: { colourwayId?: string | null } = {}): QuiltSizeRow[] {
  if (!document.quilt) throw new QuiltPlanError('the pattern has no quilt layout', 'quilt');
  return document.quilt.sizes.map((size) => {
    const plan = quiltPlan(document, { sizeName: size.name, colourwayId: options.colourwayId });
    return {
      name: size.name,
      columns: size.columns,
      rows: size.rows,
      finishedSizeIn: plan.finishedSizeIn,
      blockCount: plan.blockCount,
      fabrics: plan.fabrics.map((f) => ({ id: f.id, name: f.name, yards: f.yards })),
      totalYards: plan.totalYards,
    };
  });
}

/**
 * Pieced blocks of the quilt in a named size (or as laid out): positions less the plain alternate blocks
 * that fall inside it. Cheap (no geometry); throws {@link QuiltPlanError} like {@link quiltPlan}.
 */
export function quiltBlockCount(document: Pick<PatternDocument, 'quilt'>, sizeName: string | null = null): number {
  const layout = document.quilt;
  if (!layout) throw new QuiltPlanError('the pattern has no quilt layout', 'quilt');
  let columns = layout.columns;
  let rows = layout.rows;
  if (sizeName !== null) {
    const size = layout.sizes.find((s) => s.name === sizeName);
    if (!size) throw new QuiltPlanError(`unknown size "${sizeName}" (the pattern has: ${layout.sizes.map((s) => `"${s.name}"`).join(', ') || 'none'})`, 'sizeName');
    columns = size.columns;
    rows = size.rows;
  }
  const onPoint = layout.setting === 'on-point';
  const inside = (row: number, col: number) =>
    onPoint ? row < 2 * rows - 1 && col < (row % 2 === 1 ? columns - 1 : columns) : row < rows && col < columns;
  const plain = layout.alternateFabricId === undefined ? 0 : (layout.cells ?? []).filter((c) => c.alternate && inside(c.row, c.col)).length;
  return quiltPositions(layout.setting, columns, rows) - plain;
}
