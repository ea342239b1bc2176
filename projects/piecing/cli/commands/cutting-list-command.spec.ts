import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildCuttingList, buildOrchardWheel, planCopies } from '../../src/public-api';
import { runCliCollecting } from '../testing/run-cli-collecting';

describe('seamwright cutting-list', () => {
  let dir: string;
  beforeAll(async () => {
    dir = await mkdtemp(join(tmpdir(), 'seamwright-cutting-'));
    await writeFile(join(dir, 'orchard.json'), JSON.stringify(buildOrchardWheel()));
    await writeFile(join(dir, 'bad.json'), JSON.stringify({ ...buildOrchardWheel(), seamAllowanceIn: -1 }));
    await writeFile(join(dir, 'metric.json'), JSON.stringify({ ...buildOrchardWheel(), displayUnit: 'cm' }));
  });
  afterAll(async () => {
    await rm(dir, { recursive: true, force: true });
  });

  function run(...argv: string[]) {
    return runCliCollecting(dir, argv);
  }

  it('prints fabrics with yardage, the strip set, template copies and the rotary-cutter caution', async () => {
    const { code, out, err } = await run('cutting-list', 'orchard.json');
    expect(code).toBe(0);
    expect(err).toBe('');
    const plum = buildCuttingList(buildOrchardWheel()).fabrics.find((f) => f.name === 'Plum')!;
    // 13.5 in. of Plum is three ⅛ yd steps of 4.5 in. (1 yd = 36 in., NIST HB 44).
    expect(plum.yardageIn).toBe(13.5);
    expect(out).toContain('Orchard Wheel: cutting list for 1 block, ¼ in. seam allowance, ½ in. piecing margin');
    expect(out).toContain('Plum (#6d3b5e), usable WOF 42 in.: buy ⅜ yd (13 ½ in.)');
    expect(out).toContain('Centre stripe: Plum 2 + Oat 1 + Plum 2 finished (cut 2 ½, 1 ½, 2 ½), sewn set 5 ½ in. wide');
    // The strips of a strip set are listed under its name, never its id ("centre-stripe").
    expect(out).toContain('  Centre stripe, strip 2: 1 strip 1 ½ in. × WOF');
    expect(out).not.toContain('centre-stripe');
    // C has 4 patches: a freezer-paper template pressed 16 times lasts floor(16 / 4) = 4 sections, so
    // 16 sewings take 4 prints (docs/design-notes.md#copies; 16 pressings is common practice).
    expect(out).toContain('C: sewn 16 times; print 16 on paper or 4 on freezer paper');
    expect(out).toContain('rotary cutters are very sharp');
  });

  it('writes the cutting list and copies as JSON with --json', async () => {
    const { code, out } = await run('cutting-list', 'orchard.json', '--json');
    expect(code).toBe(0);
    const parsed = JSON.parse(out);
    expect(parsed.valid).toBe(true);
    expect(parsed.cuttingList).toEqual(buildCuttingList(buildOrchardWheel()));
    expect(parsed.copies).toEqual(planCopies(buildOrchardWheel()));
  });

  it('shows centimetres and metres for a metric pattern', async () => {
    const { code, out } = await run('cutting-list', 'metric.json');
    expect(code).toBe(0);
    // ¼ in. = 0.635 cm (1 in. = 2.54 cm exactly, NIST HB 44).
    expect(out).toContain('0.64 cm seam allowance');
    expect(out).toMatch(/Plum \(#6d3b5e\), usable WOF 106\.68 cm: buy 0\.34 m \(⅜ yd\)/);
  });

  it('exits 1 with the field path for an invalid file and 2 for a wrong command line', async () => {
    const bad = await run('cutting-list', 'bad.json');
    expect(bad.code).toBe(1);
    expect(bad.err).toContain('seamAllowanceIn');
    const badJson = await run('cutting-list', 'bad.json', '--json');
    expect(badJson.code).toBe(1);
    expect(JSON.parse(badJson.out).valid).toBe(false);
    expect((await run('cutting-list')).code).toBe(2);
    expect((await run('cutting-list', 'orchard.json', '--pdf')).code).toBe(2);
    expect((await run('cutting-list', 'missing.json')).code).toBe(1);
  });
});
