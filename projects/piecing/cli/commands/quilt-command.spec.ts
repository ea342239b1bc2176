import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildOrchardWheel, quiltCliJson, quiltPlan } from '../../src/public-api';
import { runCliCollecting } from '../testing/run-cli-collecting';

describe('seamwright quilt', () => {
  let dir: string;
  beforeAll(async () => {
    dir = await mkdtemp(join(tmpdir(), 'seamwright-quilt-'));
    const demo = buildOrchardWheel();
    await writeFile(join(dir, 'orchard.json'), JSON.stringify(demo));
    await writeFile(join(dir, 'no-columns.json'), JSON.stringify({ ...demo, quilt: { ...demo.quilt, columns: 0 } }));
    await writeFile(join(dir, 'negative-border.json'), JSON.stringify({ ...demo, quilt: { ...demo.quilt, borders: [{ widthIn: -2, fabricId: 'plum' }] } }));
    await writeFile(join(dir, 'unknown-fabric.json'), JSON.stringify({ ...demo, quilt: { ...demo.quilt, binding: { fabricId: 'saffron' } } }));
    await writeFile(join(dir, 'on-point.json'), JSON.stringify({ ...demo, quilt: { ...demo.quilt, setting: 'on-point', settingTrianglesFabricId: 'sage' } }));
    const { quilt: _quilt, ...block } = demo;
    await writeFile(join(dir, 'block.json'), JSON.stringify(block));
  });
  afterAll(async () => {
    await rm(dir, { recursive: true, force: true });
  });

  function run(...argv: string[]) {
    return runCliCollecting(dir, argv);
  }

  it('--json answers exactly the shape of issue 21 for the demo quilt (Throw 2 × 2)', async () => {
    const { code, out, err } = await run('quilt', 'orchard.json', '--json');
    expect(code).toBe(0);
    expect(err).toBe('');
    const json = JSON.parse(out);
    expect(Object.keys(json)).toEqual(['finishedSizeIn', 'blockCount', 'settingTriangles', 'binding', 'backing', 'batting', 'fabrics']);
    // Standard arithmetic: 2 · 26 + 2 (sashing) + 2 · (2 + 4) (borders) = 66 in. each way.
    expect(json.finishedSizeIn).toEqual({ width: 66, height: 66 });
    expect(json.blockCount).toBe(4);
    expect(json.settingTriangles).toBeNull();
    // Design §11 (common practice): perimeter 264 + 12 = 276 in.; ceil(276 / 42) = 7 strips; 7 × 2½ = 17½ in. → ½ yd.
    expect(json.binding).toEqual({ strips: 7, stripWidthIn: 2.5, lengthIn: 276, yards: 0.5 });
    // 66 + 2 · 4 = 74 in. each way: 2 widths of 74 in. either way (a tie: lengthwise); 148 in. → 148½ in. = 4⅛ yd.
    expect(json.backing).toEqual({ widthIn: 74, heightIn: 74, widths: 2, seams: 'lengthwise', yards: 4.125 });
    expect(json.batting).toEqual({ width: 74, height: 74 });
    expect(json.fabrics.map((f: { id: string }) => f.id)).toEqual(['plum', 'oat', 'sage', 'marigold', 'ink']);
    for (const f of json.fabrics) expect(Object.keys(f)).toEqual(['id', 'name', 'yards']);
    expect(json).toEqual(quiltCliJson(quiltPlan(buildOrchardWheel())));
  });

  it('--size and --colourway choose a named size and a colourway', async () => {
    const { code, out } = await run('quilt', 'orchard.json', '--size', 'Bed 3 × 3', '--colourway', 'frost', '--json');
    expect(code).toBe(0);
    const json = JSON.parse(out);
    // 3 · 26 + 2 · 2 + 12 = 94 in. (standard arithmetic).
    expect(json.finishedSizeIn).toEqual({ width: 94, height: 94 });
    expect(json.blockCount).toBe(9);
    expect(json.fabrics[0]).toMatchObject({ id: 'plum', name: 'Spruce' });
  });

  it('prints a readable summary: borders sides first, joins, backing seams and yardage', async () => {
    const { code, out } = await run('quilt', 'orchard.json', '--size', 'Wall 1 × 1');
    expect(code).toBe(0);
    // 26 + 12 = 38 in.; no sashing with one block.
    expect(out).toContain('Orchard Wheel: quilt "Wall 1 × 1"');
    expect(out).toContain('Finished quilt: 38 × 38 in.');
    // Border 1 on the 26 in. block: sides 26½ in., then top and bottom 26 + 4 + ½ = 30½ in.; 114 in. → 3 strips, 2 joins.
    expect(out).toContain('Border 1 (Plum, 2 in.): 3 strips 2 ½ in. × WOF joined end to end (2 joins); sides first 2 × 26 ½ in., then top and bottom 2 × 30 ½ in.');
    // Backing 46 × 46 in. is wider than 42 in.: 2 widths of 46 in. = 92 in. → 94½ in. = 2⅝ yd.
    expect(out).toContain('Backing (Sage): 46 × 46 in., 2 widths of 46 in., seamed lengthwise: 2 ⅝ yd');
    expect(out).toContain('Fabric for the whole quilt (rounded up to ⅛ yd):');
  });

  it('prints on-point sashing: strips round every block, cornerstones, setting triangles for the sashed grid', async () => {
    const { code, out } = await run('quilt', 'on-point.json', '--size', 'Throw 2 × 2');
    expect(code).toBe(0);
    // docs/quilt-layout.md, worked by hand: 2 × 2 on point is 5 blocks; 4·2·2 = 16 strips and 2·2·2 + 2 + 2 = 12
    // cornerstones, cut 2 + ½ = 2½ in. (¼ in. seams, common practice), strips 26 + ½ = 26½ in. long.
    expect(out).toContain('Blocks: 5 of 26 × 26 in., 2 across × 2 down, set on point');
    expect(out).toContain('Sashing (Oat): 16 strips, 12 cornerstones of 2 ½ in. (Marigold)');
    expect(out).toContain('  round every block, on point: 16 pieces 2 ½ × 26 ½ in.');
    // Plane geometry: sashed unit 28 in., D = 28√2 = 39.598 in. + 1¼ → 40⅞ in. side squares; corner short side
    // (26 + 4)/√2 = 21.213 in. + ⅞ → 22⅛ in. (common practice, from memory, for the allowances); 2·1 + 2·1 = 4 side
    // triangles come from one square.
    expect(out).toContain('Setting triangles (Sage): 1 square of 40 ⅞ in. cut twice on the diagonal (4 side triangles); 2 squares of 22 ⅛ in. cut once (4 corners)');
  });

  it('exits 1 naming the field for a bad layout', async () => {
    for (const [file, field] of [
      ['no-columns.json', 'quilt.columns: must be at least 1'],
      ['negative-border.json', 'quilt.borders.0.widthIn: must be greater than zero'],
      ['unknown-fabric.json', 'quilt.binding.fabricId: unknown fabric "saffron"'],
    ] as const) {
      const { code, err } = await run('quilt', file);
      expect(code).toBe(1);
      expect(err).toContain(field);
    }
    const json = await run('quilt', 'no-columns.json', '--json');
    expect(json.code).toBe(1);
    expect(JSON.parse(json.out).issues).toContainEqual({ path: 'quilt.columns', message: 'must be at least 1' });
  });

  it('exits 1 for a pattern without a quilt, an unknown size or colourway; 2 for a wrong command line', async () => {
    expect(await run('quilt', 'block.json')).toMatchObject({ code: 1, err: expect.stringContaining('quilt: the pattern has no quilt layout') });
    expect(await run('quilt', 'orchard.json', '--size', 'King')).toMatchObject({ code: 1, err: expect.stringContaining('sizeName: unknown size "King"') });
    expect(await run('quilt', 'orchard.json', '--colourway', 'noon')).toMatchObject({ code: 1, err: expect.stringContaining('colourwayId: unknown colourway "noon"') });
    expect((await run('quilt', 'orchard.json', '--size')).code).toBe(2);
    expect((await run('quilt')).code).toBe(2);
    expect((await run('quilt', 'orchard.json', '--wide')).code).toBe(2);
  });
});
