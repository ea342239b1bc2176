import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { resolveInData, writeFileAtomic } from './files';

const dirs: string[] = [];
const tmpDir = () => {
  const d = fs.mkdtempSync(path.join(os.tmpdir(), 'seamwright-files-'));
  dirs.push(d);
  return d;
};
afterEach(() => {
  for (const d of dirs.splice(0)) fs.rmSync(d, { recursive: true, force: true });
});

describe('writeFileAtomic', () => {
  it('writes the whole file and leaves no temporary file', async () => {
    const dir = tmpDir();
    const file = path.join(dir, 'a', 'b.pdf');
    const data = new Uint8Array(100_000).map((_, i) => i % 251);
    await writeFileAtomic(file, data);
    expect(Buffer.compare(fs.readFileSync(file), Buffer.from(data))).toBe(0);
    expect(fs.readdirSync(path.dirname(file))).toEqual(['b.pdf']);
  });

  it('replaces an existing file in one step', async () => {
    const dir = tmpDir();
    const file = path.join(dir, 'x.bin');
    fs.writeFileSync(file, 'old');
    await writeFileAtomic(file, new TextEncoder().encode('new content'));
    expect(fs.readFileSync(file, 'utf8')).toBe('new content');
  });

  it('keeps nothing when the final step fails', async () => {
    const dir = tmpDir();
    // The target is a folder with something in it: rename(2) refuses (EISDIR / ENOTEMPTY).
    const target = path.join(dir, 'taken');
    fs.mkdirSync(target);
    fs.writeFileSync(path.join(target, 'keep'), 'x');
    await expect(writeFileAtomic(target, new Uint8Array([1, 2, 3]))).rejects.toThrow();
    expect(fs.readdirSync(dir)).toEqual(['taken']);
  });
});

describe('resolveInData', () => {
  it('resolves inside the data folder and refuses paths that leave it', () => {
    const root = path.resolve('/srv/data');
    expect(resolveInData(root, 'uploads/u1/a.png')).toBe(path.join(root, 'uploads', 'u1', 'a.png'));
    expect(() => resolveInData(root, '../etc/passwd')).toThrow(/escapes/);
    expect(() => resolveInData(root, '/etc/passwd')).toThrow(/escapes/);
    expect(() => resolveInData(root, 'uploads/../../data2/x')).toThrow(/escapes/);
  });
});
