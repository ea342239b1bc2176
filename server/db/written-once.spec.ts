/**
 * Repository code is written once for SQLite and PostgreSQL (issue 18, docs/postgresql.md
 * "Repository code"): no synchronous better-sqlite3 calls (`.get()`, `.all()`, `.run()`),
 * no SQLite handles (`ctx.db`, `ctx.database`, `DbLike`) and no tables imported from the SQLite
 * schema module (they come from `d.t`). The files below are the ones not ported yet; the list only
 * shrinks: a listed file that no longer breaks a rule must leave it.
 */
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const SERVER = path.resolve(import.meta.dirname, '..');

/** Files allowed SQLite-only code, with the reason. */
const SQLITE_BY_DESIGN: Record<string, string> = {
  'db/database.ts': 'opens the SQLite file',
  'db/data.ts': 'the SQLite side of Data',
  'db/open-data.ts': 'chooses the database',
  'db/prepared.ts': 'statement caches, including the SQLite-only raw ones of the hot routes',
  'http/hot-routes.ts': 'the SQLite-only hot routes',
  'auth/rate-limit-store.ts': 'its own executors for both databases',
  'storage/pg-file-tables.ts': 'PostgreSQL tables',
  'storage/pg-store.ts': 'PostgreSQL store',
};

/** Not ported yet: remove a file when it is written for both databases. */
const NOT_YET_PORTED = new Set<string>([
]);

const RULES: [string, RegExp][] = [
  ['a synchronous better-sqlite3 call', /\.(get|all|run)\(\)/],
  ['a SQLite handle', /\bctx\.(db|database)\b|\bDbLike\b/],
  ['a table imported from the SQLite schema (use d.t)', /^import \{[^}]*\} from '(\.\.\/)+db\/schema';/m],
];

function sources(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const full = path.join(dir, e.name);
    if (e.isDirectory()) return sources(full);
    return e.name.endsWith('.ts') && !e.name.endsWith('.spec.ts') ? [full] : [];
  });
}

/** The source without comments (a rule quoted in a comment is no use of it). */
const code = (file: string) =>
  fs
    .readFileSync(file, 'utf8')
    .replace(/\/\*[\s\S]*?\*\//g, '')
    .replace(/^\s*\/\/.*$/gm, '');

const broken = (file: string) => RULES.filter(([, re]) => re.test(code(file))).map(([name]) => name);

describe('repository code written once for both databases', () => {
  const files = sources(SERVER).map((f) => path.relative(SERVER, f).split(path.sep).join('/'));

  it('no file outside the lists uses SQLite-only code', () => {
    const offenders = files
      .filter((f) => !(f in SQLITE_BY_DESIGN) && !NOT_YET_PORTED.has(f))
      .map((f) => ({ file: f, rules: broken(path.join(SERVER, f)) }))
      .filter((o) => o.rules.length > 0);
    expect(offenders).toEqual([]);
  });

  it('every file still listed as not ported does use SQLite-only code', () => {
    const done = [...NOT_YET_PORTED].filter((f) => !files.includes(f) || broken(path.join(SERVER, f)).length === 0);
    expect(done).toEqual([]);
  });
});
