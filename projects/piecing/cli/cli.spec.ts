import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCliCollecting } from './testing/run-cli-collecting';

const repoRoot = fileURLToPath(new URL('../../..', import.meta.url));

function run(...argv: string[]) {
  return runCliCollecting(repoRoot, argv);
}

describe('seamwright check', () => {
  let dir: string;
  beforeAll(async () => {
    dir = await mkdtemp(join(tmpdir(), 'seamwright-cli-'));
  });
  afterAll(async () => {
    await rm(dir, { recursive: true, force: true });
  });

  it('gives the verdict per section of a sewable block', async () => {
    const { code, out, err } = await run('check', 'docs/examples/straight-block-three-sections.json');
    expect(code).toBe(0);
    expect(err).toBe('');
    expect(out).toContain('Lantern Block: 3 sections, 3 sewable as numbered');
    expect(out).toContain('Section A (straight, 3 patches): sewable in its numbered order');
  });

  it('shows ring repeats', async () => {
    const { code, out } = await run('check', 'docs/examples/arc-ring-with-strip-set.json');
    expect(code).toBe(0);
    expect(out).toContain('Section B (arc, 3 patches, ring repeat ×8): sewable in its numbered order');
  });

  it('checks a corner whose edge follows a ring, counting its curved edge', async () => {
    const { code, out, err } = await run('check', 'docs/examples/corner-following-a-ring.json');
    expect(err).toBe('');
    expect(code).toBe(0);
    expect(out).toContain('Garden Corner: 2 sections, 2 sewable as numbered');
    expect(out).toContain('Section B (straight, 1 curved edge, 3 patches): sewable in its numbered order');
  });

  it('exits 0 for a valid file whose order cannot be sewn, naming the patch, an order that works, and a cut', async () => {
    const { code, out } = await run('check', 'docs/examples/unsewable-order.json');
    expect(code).toBe(0);
    expect(out).toContain('not sewable as numbered: A3 meets the patches sewn before it (A1–A2) along more than one straight stretch');
    expect(out).toContain('a sewable order: A2, A3, A1');
    expect(out).toContain('section B cannot be sewn in any order; cut it along the seam from (7.5, 0) to (7.5, 4) into two sections, sewn B1, B2 and B3, B4');
  });

  it('writes JSON with --json', async () => {
    const { code, out } = await run('check', 'docs/examples/unsewable-order.json', '--json');
    expect(code).toBe(0);
    const report = JSON.parse(out);
    expect(report.valid).toBe(true);
    expect(report.sections.map((s: { label: string; sewableAsNumbered: boolean }) => [s.label, s.sewableAsNumbered])).toEqual([['A', false], ['B', false]]);
    expect(report.sections[0].failure).toMatchObject({ label: 'A3', reason: 'not-one-straight-seam' });
    expect(report.sections[1].cannotBeSewn.cut).toEqual({ from: { x: 7.5, y: 0 }, to: { x: 7.5, y: 4 } });
  });

  it('exits 1 with the messages for an invalid file', async () => {
    const file = join(dir, 'crossing.json');
    await writeFile(file, JSON.stringify({ formatVersion: 1, title: 'x', canvas: { widthIn: 8, heightIn: 8 }, sections: [{ id: 'a', label: 'A', geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 4, y: 4 }, { x: 4, y: 0 }, { x: 0, y: 4 }] } }] }));
    const { code, out, err } = await run('check', file);
    expect(code).toBe(1);
    expect(out).toBe('');
    expect(err).toContain('is not a valid pattern document:');
    expect(err).toContain('sections.0.geometry.vertices: outline crosses itself at (2, 2)');
    const json = await run('check', file, '--json');
    expect(json.code).toBe(1);
    expect(JSON.parse(json.out)).toMatchObject({ valid: false, issues: [{ path: 'sections.0.geometry.vertices' }] });
  });

  it('exits 1 for a missing file or broken JSON', async () => {
    expect(await run('check', 'no-such-file.json')).toMatchObject({ code: 1, err: 'no-such-file.json: no such file\n' });
    const file = join(dir, 'broken.json');
    await writeFile(file, '{ "formatVersion": 1,');
    const broken = await run('check', file);
    expect(broken.code).toBe(1);
    expect(broken.err).toContain('not valid JSON');
  });

  it('exits 2 for a wrong command line', async () => {
    expect((await run('check')).code).toBe(2);
    expect((await run('check', 'a.json', '--xml')).err).toContain('unknown option --xml');
    const unknown = await run('frobnicate');
    expect(unknown.code).toBe(2);
    expect(unknown.err).toContain('unknown command "frobnicate"');
    const help = await run('help');
    expect(help.code).toBe(0);
    expect(help.out).toContain('check <pattern.json> [--json]');
  });
});
