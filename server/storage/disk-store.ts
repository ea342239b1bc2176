import fs from 'node:fs';
import path from 'node:path';
import crypto from 'node:crypto';
import type { Readable } from 'node:stream';
import { resolveInData, syncFolder, writeFileAtomic } from '../services/files';
import { checkKey, type ByteRange, type FileStat, type FileStore, type StoredFile, type SweepOptions } from './file-store';

/** `writeFileAtomic`'s temporary names: `.<name>.<12 hex>.tmp`. */
const TEMPORARY = /^\..+\.[0-9a-f]{12}\.tmp$/;

/**
 * Stored files in the data folder, each at its key's path (`<dataDir>/print-sets/<user>/<set>.pdf`),
 * so data folders written before this store keep working. Writes go to a temporary file that is
 * fsynced and renamed over the final name.
 */
export class DiskFileStore implements FileStore {
  constructor(readonly dataDir: string) {}

  private file(key: string): string {
    return resolveInData(this.dataDir, checkKey(key));
  }

  async put(key: string, source: Readable | Uint8Array): Promise<StoredFile> {
    return writeFileAtomic(this.file(key), source);
  }

  async stat(key: string): Promise<FileStat | undefined> {
    const s = await fs.promises.stat(this.file(key)).catch(ignoreMissing);
    return s?.isFile() ? { size: s.size, modifiedAt: s.mtime } : undefined;
  }

  async openRead(key: string, range?: ByteRange): Promise<Readable | undefined> {
    // Opened first, so a file removed between stat and read is "no file", not a stream error.
    const handle = await fs.promises.open(this.file(key), 'r').catch(ignoreMissing);
    if (!handle) return undefined;
    return handle.createReadStream(range ? { start: range.start, end: range.end } : {});
  }

  async copy(fromKey: string, toKey: string): Promise<void> {
    const target = this.file(toKey);
    const dir = path.dirname(target);
    await fs.promises.mkdir(dir, { recursive: true });
    const tmp = path.join(dir, `.${path.basename(target)}.${crypto.randomBytes(6).toString('hex')}.tmp`);
    try {
      await fs.promises.copyFile(this.file(fromKey), tmp, fs.constants.COPYFILE_EXCL);
      const handle = await fs.promises.open(tmp, 'r+');
      try {
        await handle.sync();
      } finally {
        await handle.close();
      }
      await fs.promises.rename(tmp, target);
    } catch (err) {
      await fs.promises.rm(tmp, { force: true }).catch(() => undefined);
      throw err;
    }
    await syncFolder(dir);
  }

  async remove(keys: readonly string[]): Promise<void> {
    await Promise.all(keys.map((k) => fs.promises.rm(this.file(k), { force: true }).catch(() => undefined)));
  }

  async sweep(prefixes: readonly string[], keep: (key: string) => boolean, options: SweepOptions = {}): Promise<string[]> {
    return this.sweepNow(prefixes, keep, options);
  }

  /**
   * {@link sweep} done at once, for start-up before anything writes files: temporary files of writes
   * that never finished and files `keep` refuses.
   */
  sweepNow(prefixes: readonly string[], keep: (key: string) => boolean, options: SweepOptions = {}): string[] {
    const removed: string[] = [];
    for (const prefix of prefixes) {
      for (const key of filesBelow(this.dataDir, path.join(this.dataDir, checkKey(prefix)))) {
        if (!TEMPORARY.test(path.posix.basename(key)) && keep(key)) continue;
        try {
          if (options.writtenBefore && fs.statSync(path.join(this.dataDir, key)).mtimeMs >= options.writtenBefore.getTime()) continue;
          fs.rmSync(path.join(this.dataDir, key), { force: true });
          removed.push(key);
        } catch {
          // left for the next start
        }
      }
    }
    return removed.sort();
  }
}

function ignoreMissing(err: NodeJS.ErrnoException): undefined {
  if (err.code === 'ENOENT' || err.code === 'ENOTDIR') return undefined;
  throw err;
}

/** Every file below `dir`, as paths relative to `root` with forward slashes. */
function filesBelow(root: string, dir: string): string[] {
  let entries: fs.Dirent[];
  try {
    entries = fs.readdirSync(dir, { withFileTypes: true });
  } catch {
    return [];
  }
  return entries.flatMap((e) => {
    const full = path.join(dir, e.name);
    if (e.isDirectory()) return filesBelow(root, full);
    return e.isFile() ? [path.relative(root, full).split(path.sep).join('/')] : [];
  });
}
