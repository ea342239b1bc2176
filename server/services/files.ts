import fs from 'node:fs';
import path from 'node:path';
import crypto from 'node:crypto';

/** Resolves a stored relative path inside the data folder; refuses anything that walks out of it. */
export function resolveInData(dataDir: string, relative: string): string {
  const root = path.resolve(dataDir);
  const full = path.resolve(root, relative);
  if (full !== root && !full.startsWith(root + path.sep)) throw new Error(`path escapes the data folder: ${relative}`);
  return full;
}

/** Size and SHA-256 (hex) of what a write stored. */
export interface WrittenFile {
  size: number;
  sha256: string;
}

/**
 * Writes a file so that it is either absent or complete: a temporary name in the same folder,
 * fsync, rename over the final name, fsync of the folder. `data` may be a stream (any async iterable
 * of bytes): it is written chunk by chunk as it arrives, and when it fails midway nothing is kept.
 */
export async function writeFileAtomic(file: string, data: Uint8Array | AsyncIterable<Uint8Array | string>): Promise<WrittenFile> {
  const dir = path.dirname(file);
  await fs.promises.mkdir(dir, { recursive: true });
  const tmp = path.join(dir, `.${path.basename(file)}.${crypto.randomBytes(6).toString('hex')}.tmp`);
  const hash = crypto.createHash('sha256');
  let size = 0;
  const handle = await fs.promises.open(tmp, 'wx', 0o600);
  try {
    try {
      if (data instanceof Uint8Array) {
        await handle.writeFile(data);
        hash.update(data);
        size = data.byteLength;
      } else {
        for await (const part of data) {
          const chunk = typeof part === 'string' ? Buffer.from(part) : part;
          // write() may write less than asked (a full disk fails, never short-writes silently).
          for (let at = 0; at < chunk.byteLength; ) at += (await handle.write(chunk, at, chunk.byteLength - at)).bytesWritten;
          hash.update(chunk);
          size += chunk.byteLength;
        }
      }
      await handle.sync();
    } finally {
      await handle.close();
    }
    await fs.promises.rename(tmp, file);
  } catch (err) {
    // A full disk, a size limit or a failed source leaves a partial temporary file: remove it, keep nothing.
    await fs.promises.rm(tmp, { force: true }).catch(() => undefined);
    throw err;
  }
  await syncFolder(dir);
  return { size, sha256: hash.digest('hex') };
}

/** Makes a rename in `dir` durable. */
export async function syncFolder(dir: string): Promise<void> {
  const dirHandle = await fs.promises.open(dir, 'r');
  try {
    await dirHandle.sync();
  } catch {
    // Some file systems refuse fsync on a folder; the rename is still atomic.
  } finally {
    await dirHandle.close();
  }
}

/** Removes stored files, ignoring ones already gone. */
export async function removeStoredFiles(dataDir: string, relatives: (string | null | undefined)[]): Promise<void> {
  await Promise.all(
    relatives
      .filter((r): r is string => typeof r === 'string' && r.length > 0)
      .map((r) => fs.promises.rm(resolveInData(dataDir, r), { force: true }).catch(() => undefined)),
  );
}

export const sha256Hex = (data: Uint8Array) => crypto.createHash('sha256').update(data).digest('hex');
