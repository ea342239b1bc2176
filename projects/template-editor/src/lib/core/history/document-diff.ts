/**
 * Structural diffs between two immutable JSON values. Commands build new documents by copying only
 * the branches they change, so comparing by reference first keeps a diff as small as the change.
 */

/** One changed place: the path from the root and the values before and after (undefined = absent). */
export interface DiffEntry {
  path: ReadonlyArray<string | number>;
  before: unknown;
  after: unknown;
}

/** The changes that turn one document into another. */
export type DocumentDiff = readonly DiffEntry[];

function isPlainObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** The entries that turn `before` into `after`. Arrays of a different length are replaced whole. */
export function diffValues(before: unknown, after: unknown, path: Array<string | number> = []): DiffEntry[] {
  if (Object.is(before, after)) return [];
  if (Array.isArray(before) && Array.isArray(after) && before.length === after.length) {
    const out: DiffEntry[] = [];
    for (let i = 0; i < before.length; i++) out.push(...diffValues(before[i], after[i], [...path, i]));
    return out;
  }
  if (isPlainObject(before) && isPlainObject(after)) {
    const out: DiffEntry[] = [];
    const keys = new Set([...Object.keys(before), ...Object.keys(after)]);
    for (const k of keys) out.push(...diffValues(before[k], after[k], [...path, k]));
    return out;
  }
  if (typeof before !== 'object' && typeof after !== 'object' && before === after) return [];
  return [{ path: [...path], before, after }];
}

function setAt(root: unknown, path: ReadonlyArray<string | number>, value: unknown, depth = 0): unknown {
  if (depth === path.length) return value;
  const key = path[depth];
  if (Array.isArray(root)) {
    const copy = root.slice();
    copy[key as number] = setAt(root[key as number], path, value, depth + 1);
    return copy;
  }
  const obj = (isPlainObject(root) ? root : {}) as Record<string, unknown>;
  const next = setAt(obj[key as string], path, value, depth + 1);
  const copy: Record<string, unknown> = { ...obj };
  if (next === undefined) delete copy[key as string];
  else copy[key as string] = next;
  return copy;
}

/** Applies a diff forwards (`'redo'`) or backwards (`'undo'`), returning a new value. */
export function applyDiff<T>(value: T, diff: DocumentDiff, direction: 'undo' | 'redo'): T {
  let out: unknown = value;
  const entries = direction === 'redo' ? diff : [...diff].reverse();
  for (const e of entries) out = setAt(out, e.path, direction === 'redo' ? e.after : e.before);
  return out as T;
}
