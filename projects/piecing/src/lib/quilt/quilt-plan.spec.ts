import { describe, expect, it } from 'vitest';
import { EXAMPLE_NAMES, exampleJson, sampleBlock } from '../../../../../tests/fixtures/documents';
import { parsePatternDocument, readPatternDocument } from '../document/parse-pattern';
import { scalePattern } from '../document/scale-pattern';
import type { PatternDocument, QuiltLayoutInput } from '../document/pattern-schema';
import { buildCuttingList } from '../fabrication/cutting-list/build-cutting-list';
import { applyColourway } from './colourway';
import { backingCuts, bindingCuts, borderCuts, settingTriangleCuts } from './quilt-formulas';
import { defaultBlockSizeIn } from './block-size';
import { quiltCliJson, quiltPlan, quiltSizes } from './quilt-plan';
import { QuiltPlanError, type AffineTransform } from './quilt-types';

/** A square test block of side `sizeIn` (two triangles, Plum and Oat) set into the given quilt, plus Sage, Ink and Cream for the setting. */
function quiltDoc(sizeIn: number, quilt: QuiltLayoutInput, extra: Record<string, unknown> = {}): PatternDocument {
  const base = sampleBlock('Quilt test', sizeIn);
  return readPatternDocument({
    ...base,
    fabrics: [
      ...base.fabrics,
      { id: 'sage', name: 'Sage', colour: '#9aae8c' },
      { id: 'ink', name: 'Ink', colour: '#262b3d' },
      { id: 'cream', name: 'Cream', colour: '#f4eedd', usableWofIn: 42 },
    ],
    quilt,
    ...extra,
  });
}

function apply(t: AffineTransform, p: { x: number; y: number }) {
  return { x: t[0] * p.x + t[2] * p.y + t[4], y: t[1] * p.x + t[3] * p.y + t[5] };
}

describe('on-point setting triangles (design §11)', () => {
  // Common practice, from memory (design §11): a 10 in. block takes 15½ in. side squares and 8 in. corner squares.
  it('a 10 in. block: side squares 15½ in., corner squares 8 in.', () => {
    const t = settingTriangleCuts(10, 3, 4);
    expect(t.sideCutSquareIn).toBe(15.5);
    expect(t.cornerCutSquareIn).toBe(8);
  });

  // Common practice, from memory (design §11): a 12 in. block takes 18¼ in. and 9⅜ in.
  it('a 12 in. block: side squares 18¼ in., corner squares 9⅜ in.', () => {
    const t = settingTriangleCuts(12, 3, 4);
    expect(t.sideCutSquareIn).toBe(18.25);
    expect(t.cornerCutSquareIn).toBe(9.375);
  });

  // Counting (design §11): 2(columns − 1) + 2(rows − 1) side triangles, 4 from each square; 4 corners from 2 squares.
  it('counts: 3 × 4 blocks need 10 side triangles (3 squares) and 2 corner squares', () => {
    const t = settingTriangleCuts(10, 3, 4);
    expect(t).toMatchObject({ sideTriangles: 10, sideSquares: 3, cornerTriangles: 4, cornerSquares: 2 });
  });
});

describe('backing and batting (design §11)', () => {
  // Design §11 check (common practice): a 45 × 56½ in. quilt with 4 in. margins → 53 × 64½ in., two widths seamed across, 106 in. = 3 yd.
  it('45 × 56½ in. with 4 in. margins: 53 × 64½ in., two widths seamed across, 106 in., 3 yd', () => {
    const b = backingCuts({ width: 45, height: 56.5 }, 4, 42);
    expect(b).toMatchObject({ widthIn: 53, heightIn: 64.5, widths: 2, seams: 'across', widthLengthIn: 53, lengthIn: 106, yards: 3 });
  });

  // Standard arithmetic: 30 × 40 in. + 2·4 in. = 38 × 48 in.; 38 in. is under one 42 in. width, so one width 48 in. long (1⅜ yd, ⅛ yd steps).
  it('a backing one width covers has no seam', () => {
    const b = backingCuts({ width: 30, height: 40 }, 4, 42);
    expect(b).toMatchObject({ widthIn: 38, heightIn: 48, widths: 1, seams: 'none', lengthIn: 48, yards: 1.375 });
  });

  // Standard arithmetic: 80 × 40 in. + 8 → 88 × 48: down takes 3 widths × 48 = 144 in., across 2 × 88 = 176 in.: lengthwise wins.
  it('takes the direction that uses less fabric (lengthwise here)', () => {
    const b = backingCuts({ width: 80, height: 40 }, 4, 42);
    expect(b).toMatchObject({ widths: 3, seams: 'lengthwise', lengthIn: 144, yards: 4 });
  });
});

describe('binding (design §11)', () => {
  // Standard arithmetic: perimeter 2(58 + 70) = 256 in. + 12 in. = 268 in.; 268 / 42 = 6.4 → 7 strips; 7 × 2½ = 17½ in. → 18 in. = ½ yd.
  it('a 58 × 70 in. quilt: 268 in. of binding, 7 strips of 2½ in., ½ yd', () => {
    expect(bindingCuts({ width: 58, height: 70 }, 2.5, 12, 42)).toEqual({ perimeterIn: 256, lengthIn: 268, strips: 7, yards: 0.5 });
  });

  // Standard arithmetic: perimeter 2(40 + 40) = 160 + 8 = 168 = 4 × 42 exactly: 4 strips, not 5.
  it('an exact multiple of the WOF takes no extra strip', () => {
    expect(bindingCuts({ width: 40, height: 40 }, 2.5, 8, 42).strips).toBe(4);
  });
});

describe('borders (design §11: sides first, then top and bottom, measured through the centre)', () => {
  // Standard arithmetic with ¼ in. seams: inner 46 × 58 in., 2 in. border: sides 58 + ½ = 58½ in., top and bottom 46 + 4 + ½ = 50½ in.;
  // 2·58½ + 2·50½ = 218 in. → ceil(218 / 42) = 6 strips, 5 joins; strips cut 2½ in. wide.
  it('a 2 in. border on a 46 × 58 in. centre', () => {
    expect(borderCuts({ width: 46, height: 58 }, 2, 0.25, 42)).toEqual({ cutWidthIn: 2.5, sideCutLengthIn: 58.5, topCutLengthIn: 50.5, totalLengthIn: 218, strips: 6, joins: 5 });
  });
});

describe('quiltPlan', () => {
  const straight: QuiltLayoutInput = {
    setting: 'straight',
    columns: 4,
    rows: 5,
    sashing: { widthIn: 2, fabricId: 'sage', cornerstoneFabricId: 'ink' },
    borders: [
      { widthIn: 2, fabricId: 'ink' },
      { widthIn: 4, fabricId: 'plum' },
    ],
    binding: { fabricId: 'ink' },
    backing: { fabricId: 'cream', marginIn: 4 },
  };

  // Standard arithmetic (design §11 formula): 4·10 + 3·2 + 2·(2 + 4) = 58 in. across; 5·10 + 4·2 + 12 = 70 in. down.
  it('finished size of a straight layout with sashing and two borders: 58 × 70 in.', () => {
    const plan = quiltPlan(quiltDoc(10, straight));
    expect(plan.centreSizeIn).toEqual({ width: 46, height: 58 });
    expect(plan.finishedSizeIn).toEqual({ width: 58, height: 70 });
    expect(plan.blockCount).toBe(20);
    expect(plan.settingTriangles).toBeNull();
    // Sashing between blocks only: 5 rows × 3 gaps + 4 gaps × 4 columns = 31 strips cut 2½ × 10½ in.; 3 × 4 = 12 cornerstones 2½ in.
    expect(plan.sashing?.verticalStrips).toEqual({ count: 15, cutWidthIn: 2.5, cutLengthIn: 10.5 });
    expect(plan.sashing?.horizontalStrips).toEqual({ count: 16, cutWidthIn: 2.5, cutLengthIn: 10.5 });
    expect(plan.sashing?.cornerstones).toEqual({ count: 12, cutSquareIn: 2.5, fabricId: 'ink' });
    // The second border goes round the first: inner 50 × 62 in.; sides 62½, top and bottom 50 + 8 + ½ = 58½ in., 4½ in. wide.
    expect(plan.borders[1]).toMatchObject({ innerSizeIn: { width: 50, height: 62 }, cutWidthIn: 4.5, sides: { cutLengthIn: 62.5 }, topAndBottom: { cutLengthIn: 58.5 }, totalLengthIn: 242, strips: 6, joins: 5 });
    expect(quiltCliJson(plan).binding).toEqual({ strips: 7, stripWidthIn: 2.5, lengthIn: 268, yards: 0.5 });
  });

  // Standard arithmetic: d = 10√2 = 14.1421 in.; 3·d + 2·3 = 48.4264 in. across, 4·d + 6 = 62.5685 in. down; 3·4 + 2·3 = 18 blocks.
  it('finished size of an on-point layout with a border', () => {
    const plan = quiltPlan(quiltDoc(10, { setting: 'on-point', columns: 3, rows: 4, settingTrianglesFabricId: 'sage', borders: [{ widthIn: 3, fabricId: 'ink' }] }));
    expect(plan.finishedSizeIn.width).toBeCloseTo(3 * 10 * Math.SQRT2 + 6, 5);
    expect(plan.finishedSizeIn.height).toBeCloseTo(4 * 10 * Math.SQRT2 + 6, 5);
    expect(plan.blockCount).toBe(18);
    expect(plan.cells).toHaveLength(18);
    expect(quiltCliJson(plan).settingTriangles).toEqual({ sideCutSquareIn: 15.5, sideSquares: 3, cornerCutSquareIn: 8, cornerSquares: 2 });
    expect(plan.settingTrianglePolygons).toHaveLength(10 + 4);
    // Border cut lengths round up to ⅛ in.: sides 4d + ½ = 57.069 in. → 57⅛ in.; top and bottom 3d + 6 + ½ = 48.926 in. → 49 in.
    expect(plan.borders[0]).toMatchObject({ sides: { cutLengthIn: 57.125 }, topAndBottom: { cutLengthIn: 49 } });
    // Backing 48.426 + 8 → 56½ in. (rounded up to ⅛ in.) by 62.569 + 8 → 70⅝ in.
    expect(plan.backing).toMatchObject({ widthIn: 56.5, heightIn: 70.625 });
    // The setting-triangle squares are cut from Sage on WOF strips: 3 squares of 15½ in. (2 per 42 in. strip) and 2 of 8 in.
    const sage = plan.fabrics.find((f) => f.id === 'sage');
    expect(sage?.settingPieces.map((g) => [g.widthIn, g.count, g.stripCount])).toEqual([
      [15.5, 3, 2],
      [8, 2, 1],
    ]);
    // 2 × 15½ + 8 = 39 in. of Sage → 40½ in. = 1⅛ yd.
    expect(sage?.yards).toBe(1.125);
    // A block on point is turned 45°: its top-left corner (0, 0) goes to the top of the diamond.
    const first = plan.cells[0]!;
    const top = apply(first.transform, { x: 0, y: 0 });
    expect(top.x).toBeCloseTo(3 + 5 * Math.SQRT2, 6);
    expect(top.y).toBeCloseTo(3, 6);
  });

  // On-point sashing (docs/quilt-layout.md), worked by hand. Plane geometry: a sashed unit of a 10 in. block with
  // 2 in. sashing has side u = 12 in. and diagonal D = 12√2 = 16.9706 in.; the sashing framing the outer blocks adds
  // 2√2 in. each way, so the centre is 3D + 2√2 = 38√2 = 53.7401 in. by 4D + 2√2 = 50√2 = 70.7107 in., + 2 × 3 in.
  // border. Setting triangles (common practice, from memory: long side + 1¼ in. for squares cut twice, short side + ⅞
  // in. for squares cut once): side squares D + 1¼ = 18.2206 → 18¼ in. (the 12 in. block's value of design §11);
  // corners' short side (10 + 2·2)/√2 = 7√2 = 9.8995 in., + ⅞ = 10.7745 → 10⅞ in. Counting the turned grid: 3·4 + 2·3
  // = 18 blocks, 4·3·4 = 48 strips, 2·3·4 + 3 + 4 = 31 cornerstones; cut sizes add ¼ in. seams each side (common
  // practice): strips 2½ × 10½ in., cornerstones 2½ in.
  it('on-point sashing: framed blocks, cornerstones, setting triangles sized for the sashed grid', () => {
    const plan = quiltPlan(
      quiltDoc(10, {
        setting: 'on-point',
        columns: 3,
        rows: 4,
        settingTrianglesFabricId: 'sage',
        sashing: { widthIn: 2, fabricId: 'sage', cornerstoneFabricId: 'ink' },
        borders: [{ widthIn: 3, fabricId: 'ink' }],
      }),
    );
    expect(plan.centreSizeIn.width).toBeCloseTo(38 * Math.SQRT2, 6);
    expect(plan.centreSizeIn.height).toBeCloseTo(50 * Math.SQRT2, 6);
    expect(plan.finishedSizeIn.width).toBeCloseTo(38 * Math.SQRT2 + 6, 6);
    expect(plan.finishedSizeIn.height).toBeCloseTo(50 * Math.SQRT2 + 6, 6);
    expect(plan.unitDiagonalIn).toBeCloseTo(12 * Math.SQRT2, 6);
    expect(plan.blockCount).toBe(18);
    expect(quiltCliJson(plan).settingTriangles).toEqual({ sideCutSquareIn: 18.25, sideSquares: 3, cornerCutSquareIn: 10.875, cornerSquares: 2 });
    expect(plan.sashing?.diagonalStrips).toEqual({ count: 48, cutWidthIn: 2.5, cutLengthIn: 10.5 });
    expect(plan.sashing?.verticalStrips.count).toBe(0);
    expect(plan.sashing?.horizontalStrips.count).toBe(0);
    expect(plan.sashing?.cornerstones).toEqual({ count: 31, cutSquareIn: 2.5, fabricId: 'ink' });
    expect(plan.sashingRects).toEqual([]);
    // Drawn: 48 strips of Sage and 31 cornerstones of Ink, 10 side and 4 corner triangles.
    expect(plan.sashingPolygons.filter((p) => p.fabricId === 'sage')).toHaveLength(48);
    expect(plan.sashingPolygons.filter((p) => p.fabricId === 'ink')).toHaveLength(31);
    expect(plan.settingTrianglePolygons).toHaveLength(14);
    // The pieces fill the centre exactly (plane geometry): blocks 18 × 100 + strips 48 × 2·10 + cornerstones 31 × 4 +
    // side triangles 10 × 12²/2 + corners 4 × (7√2)²/2 = 1800 + 960 + 124 + 720 + 196 = 3800 in.² = 38√2 × 50√2.
    const area = (pts: Array<{ x: number; y: number }>) => Math.abs(pts.reduce((a, p, i) => a + p.x * pts[(i + 1) % pts.length]!.y - pts[(i + 1) % pts.length]!.x * p.y, 0)) / 2;
    const strips = plan.sashingPolygons.filter((p) => p.fabricId === 'sage').reduce((a, p) => a + area(p.points), 0);
    const stones = plan.sashingPolygons.filter((p) => p.fabricId === 'ink').reduce((a, p) => a + area(p.points), 0);
    const triangles = plan.settingTrianglePolygons.reduce((a, p) => a + area(p.points), 0);
    expect(strips).toBeCloseTo(960, 3);
    expect(stones).toBeCloseTo(124, 3);
    expect(triangles).toBeCloseTo(720 + 196, 3);
    expect(18 * 100 + strips + stones + triangles).toBeCloseTo(plan.centreSizeIn.width * plan.centreSizeIn.height, 3);
    // The first block's centre is 3 + 2/√2 + D/2 = 3 + 7√2 in. in from the top left; its top corner sits a
    // cornerstone's diagonal (2√2 in.) below the top edge (y = 3) of the centre.
    const first = plan.cells[0]!;
    expect(first.centreIn.x).toBeCloseTo(3 + 7 * Math.SQRT2, 6);
    const top = apply(first.transform, { x: 0, y: 0 });
    expect(top.x).toBeCloseTo(3 + 7 * Math.SQRT2, 6);
    expect(top.y).toBeCloseTo(3 + 2 * Math.SQRT2, 6);
    // Sage: 48 strips 2½ × 10½ in., 4 to a 42 in. strip → 12 strips × 2½ = 30 in.; 3 side squares of 18¼, 2 to a
    // strip → 2 × 18¼ = 36½ in.; 2 corner squares of 10⅞ on one strip → 10⅞ in. 77⅜ in. → 81 in. = 2¼ yd (⅛ yd = 4½ in.).
    const sage = plan.fabrics.find((f) => f.id === 'sage');
    expect(sage?.settingPieces.map((g) => [g.widthIn, g.lengthIn, g.count, g.stripCount])).toEqual([
      [2.5, 10.5, 48, 12],
      [18.25, 18.25, 3, 2],
      [10.875, 10.875, 2, 1],
    ]);
    expect(sage?.yards).toBe(2.25);
  });

  it('a turned cell and a mirrored cell', () => {
    const plan = quiltPlan(
      quiltDoc(4, {
        columns: 2,
        rows: 1,
        cells: [
          { row: 0, col: 0, mirrored: true },
          { row: 0, col: 1, rotateDeg: 90 },
        ],
      }),
    );
    const [mirrored, turned] = plan.cells;
    expect(mirrored).toMatchObject({ mirrored: true, rotateDeg: 0, centreIn: { x: 2, y: 2 } });
    // Mirrored left to right: the block's top-right corner (4, 0) lands top-left (0, 0).
    expect(apply(mirrored!.transform, { x: 4, y: 0 })).toEqual({ x: 0, y: 0 });
    // Turned a quarter clockwise on screen (y down): the block's top-right corner (4, 0) lands bottom-right of the second cell (8, 4).
    expect(turned).toMatchObject({ rotateDeg: 90, centreIn: { x: 6, y: 2 } });
    expect(apply(turned!.transform, { x: 4, y: 0 })).toEqual({ x: 8, y: 4 });
  });

  it('plain alternate blocks take the alternate fabric, not the block cutting list', () => {
    const plan = quiltPlan(quiltDoc(10, { columns: 3, rows: 3, alternateFabricId: 'cream', cells: [1, 3, 5, 7].map((i) => ({ row: Math.floor(i / 3), col: i % 3, alternate: true })) }));
    expect(plan.blockCount).toBe(5);
    expect(plan.alternateBlocks).toEqual({ fabricId: 'cream', count: 4, cutWidthIn: 10.5, cutHeightIn: 10.5 });
    expect(plan.blockCuttingList.blockCount).toBe(5);
  });

  it('whole-quilt yardage: the block cutting list for every block plus the setting, rounded up to ⅛ yd per fabric', () => {
    const doc = quiltDoc(10, straight);
    const plan = quiltPlan(doc);
    const blocks = buildCuttingList({ ...doc, blockCount: 20 });
    for (const f of plan.fabrics) {
      expect(f.blocksIn).toBe(blocks.fabrics.find((x) => x.fabricId === f.id)?.fabricLengthIn);
      expect(f.fabricLengthIn).toBeCloseTo(f.blocksIn + f.settingIn + f.bordersIn + f.bindingIn + f.backingIn, 6);
      expect(f.yards * 8).toBe(Math.ceil(f.fabricLengthIn / 4.5 - 1e-9)); // ⅛ yd = 4½ in. (1 yd = 36 in., NIST HB 44)
    }
    // Backing 66 × 78 in.: down 2 × 78 = 156 in., across 2 × 66 = 132 in. → across; 132 in. rounds up to 135 in. = 3¾ yd.
    expect(plan.backing).toMatchObject({ widthIn: 66, heightIn: 78, widths: 2, seams: 'across', lengthIn: 132, yards: 3.75 });
    expect(plan.fabrics.find((f) => f.id === 'cream')?.yards).toBe(3.75);
    expect(plan.batting).toEqual({ width: 66, height: 78 });
    // Sage: 31 sashing strips 2½ × 10½, 4 per strip → 8 strips × 2½ in. = 20 in. → 22½ in. = ⅝ yd.
    const sage = plan.fabrics.find((f) => f.id === 'sage');
    expect(sage?.settingPieces).toEqual([expect.objectContaining({ count: 31, stripCount: 8, stripWidthIn: 2.5, piecesPerStrip: 4 })]);
    expect(sage?.yards).toBe(0.625);
  });

  it('named sizes and colourways', () => {
    const doc = quiltDoc(10, { ...straight, sizes: [{ name: 'Wall 2 × 2', columns: 2, rows: 2 }, { name: 'Throw 4 × 5', columns: 4, rows: 5 }] }, {
      colourways: [{ id: 'dusk', name: 'Dusk', fabrics: { plum: { name: 'Midnight', colour: '#1b1f3a' } } }],
    });
    const wall = quiltPlan(doc, { sizeName: 'Wall 2 × 2', colourwayId: 'dusk' });
    // 2·10 + 2 + 12 = 34 in. each way (standard arithmetic).
    expect(wall.finishedSizeIn).toEqual({ width: 34, height: 34 });
    expect(wall.blockCount).toBe(4);
    expect(wall.fabrics[0]).toMatchObject({ id: 'plum', name: 'Midnight', colour: '#1b1f3a' });
    const chart = quiltSizes(doc);
    expect(chart.map((r) => [r.name, r.finishedSizeIn.width, r.finishedSizeIn.height, r.blockCount])).toEqual([
      ['Wall 2 × 2', 34, 34],
      ['Throw 4 × 5', 58, 70],
    ].map(([n, w, h]) => [n, w, h, n === 'Wall 2 × 2' ? 4 : 20]));
    expect(() => quiltPlan(doc, { sizeName: 'King' })).toThrow(QuiltPlanError);
    expect(() => applyColourway(doc, 'noon')).toThrow(/unknown colourway "noon"/);
    expect(applyColourway(doc, 'dusk').sections).toBe(doc.sections);
  });

  it('defaultBlockSizeIn is the bounding box of the sewing lines', () => {
    expect(defaultBlockSizeIn(quiltDoc(7, { columns: 1, rows: 1 }))).toEqual({ width: 7, height: 7 });
  });

  it('resizing the design scales a block size the layout sets, not its sashing or borders', () => {
    const doc = quiltDoc(10, { ...straight, blockSizeIn: { width: 10, height: 10 } });
    const resized = scalePattern(doc, 1.2);
    expect(resized.quilt?.blockSizeIn).toEqual({ width: 12, height: 12 });
    expect(resized.quilt?.sashing?.widthIn).toBe(2);
    // 4·12 + 3·2 + 12 = 66 in. across (standard arithmetic).
    expect(quiltPlan(resized).finishedSizeIn.width).toBe(66);
  });
});

describe('quilt and colourway fields of the document', () => {
  const issues = (quilt: unknown, extra: Record<string, unknown> = {}) => {
    const r = parsePatternDocument({ ...sampleBlock('Bad', 4), quilt, ...extra });
    return r.ok ? [] : r.issues;
  };

  it('names the field at fault', () => {
    expect(issues({ columns: 0, rows: 2 })).toContainEqual({ path: 'quilt.columns', message: 'must be at least 1' });
    expect(issues({ columns: 2, rows: 2, borders: [{ widthIn: -1, fabricId: 'plum' }] })).toContainEqual({ path: 'quilt.borders.0.widthIn', message: 'must be greater than zero' });
    expect(issues({ columns: 2, rows: 2, binding: { fabricId: 'gold' } })).toContainEqual({ path: 'quilt.binding.fabricId', message: 'unknown fabric "gold"' });
    expect(issues({ columns: 2, rows: 2, setting: 'on-point', sashing: { widthIn: 1, fabricId: 'plum' } })).toEqual([]);
    expect(issues({ columns: 2, rows: 2, setting: 'on-point', sashing: { widthIn: 1, fabricId: 'gold' } })).toContainEqual({ path: 'quilt.sashing.fabricId', message: 'unknown fabric "gold"' });
    const colourway = { id: 'a', name: 'A', fabrics: { plum: { name: 'P', colour: '#000000' } } };
    expect(issues(undefined, { colourways: [colourway, colourway] })).toContainEqual({ path: 'colourways.1.id', message: 'duplicate colourway id "a"' });
    expect(issues(undefined, { colourways: [{ ...colourway, fabrics: { gold: { name: 'G', colour: '#000000' } } }] })).toContainEqual({ path: 'colourways.0.fabrics.gold', message: 'unknown fabric "gold"' });
  });

  it('existing documents read unchanged, without a quilt', () => {
    for (const name of EXAMPLE_NAMES) {
      const r = parsePatternDocument(exampleJson(name));
      expect(r.ok).toBe(true);
      if (r.ok) expect(r.document.quilt).toBeUndefined();
    }
    expect(() => quiltPlan(readPatternDocument(sampleBlock('One block', 4)))).toThrow(/no quilt layout/);
  });
});
