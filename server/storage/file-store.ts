import type { Readable } from 'node:stream';

/**
 * Where stored files live (print-set PDFs, uploaded reference images): one small interface with two
 * homes, the local data folder (the default) and PostgreSQL (docs/file-store.md: every instance reads the
 * same files). A key is the file's path relative to the data folder, forward slashes, e.g.
 * `print-sets/<userId>/<setId>.pdf`; database rows keep it as their `storage_path`.
 *
 * Every write is all or nothing: after `put` resolves the whole file is readable under its key; when
 * it rejects (its source failed, the disk is full) the key holds what it held before and nothing
 * half-written is left behind.
 */
export interface FileStore {
  /** Stores a file under `key`, replacing one already there. Streams are read chunk by chunk. */
  put(key: string, source: Readable | Uint8Array): Promise<StoredFile>;
  /** Size and time of a stored file; undefined when there is none under `key`. */
  stat(key: string): Promise<FileStat | undefined>;
  /**
   * The stored bytes, or the inclusive byte range `range` of them, as a stream; undefined when there
   * is no file under `key`. The range must lie inside the file (the caller checks it against `stat`).
   */
  openRead(key: string, range?: ByteRange): Promise<Readable | undefined>;
  /** Copies a stored file to another key (a duplicated pattern's reference image). */
  copy(fromKey: string, toKey: string): Promise<void>;
  /** Removes stored files, ignoring keys with no file. */
  remove(keys: readonly string[]): Promise<void>;
  /**
   * Removes what a killed process left: files under the `prefixes` (folders: `uploads` means keys
   * starting `uploads/`) whose key `keep` refuses, and unfinished writes. Returns the removed keys.
   */
  sweep(prefixes: readonly string[], keep: (key: string) => boolean, options?: SweepOptions): Promise<string[]>;
}

export interface SweepOptions {
  /**
   * Only files written before this time go. With several instances on one store, a file another
   * instance has just written may not have its row yet: a sweep at start-up passes a time some minutes ago.
   */
  writtenBefore?: Date;
}

/** What a completed write stored. */
export interface StoredFile {
  size: number;
  /** SHA-256 of the stored bytes, lower-case hex. */
  sha256: string;
}

export interface FileStat {
  size: number;
  /** When the file was last written. */
  modifiedAt: Date;
}

/** Inclusive byte offsets, as in an HTTP `Range: bytes=start-end` (RFC 9110 §14.1.2). */
export interface ByteRange {
  start: number;
  end: number;
}

/** Refuses keys that are not plain relative paths (no `..`, no leading slash, no backslash, no empty part). */
export function checkKey(key: string): string {
  const parts = key.split('/');
  if (key.length === 0 || key.length > 500 || key.includes('\\') || key.includes('\0') || parts.some((p) => p === '' || p === '.' || p === '..')) {
    throw new Error(`not a stored-file key: ${JSON.stringify(key)}`);
  }
  return key;
}
