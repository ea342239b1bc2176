/**
 * The PostgreSQL schema (schema-pg.ts) stays equal to the SQLite one (schema.ts): same tables, same
 * columns with the same kind of type, nullability, defaults (present or not), primary keys, unique
 * constraints, indexes and foreign keys (docs/postgresql.md). Both are read through Drizzle's own
 * table config getters, so a change to one module that is not made to the other fails here.
 */
import { is, type Table } from 'drizzle-orm';
import { type AnyPgColumn, getTableConfig as pgTableConfig, PgTable } from 'drizzle-orm/pg-core';
import { type AnySQLiteColumn, getTableConfig as sqliteTableConfig, SQLiteTable } from 'drizzle-orm/sqlite-core';
import { describe, expect, expectTypeOf, it } from 'vitest';
import * as sqliteSchema from './schema';
import * as pgSchema from './schema-pg';

/**
 * Tables only the PostgreSQL schema has, each with its reason. Stored files: with SQLite they are
 * kept in the data folder; with PostgreSQL in the database, so every instance can read them.
 */
const PG_ONLY_TABLES = ['stored_file_chunks', 'stored_files'];
const PG_ONLY_EXPORTS = ['storedFileChunks', 'storedFiles'] as const;

/** Column types by kind: every Drizzle column class either module uses must be listed here. */
const SQLITE_KINDS: Record<string, string> = {
  SQLiteText: 'text',
  SQLiteInteger: 'integer',
  SQLiteTimestamp: 'instant',
  SQLiteBoolean: 'boolean',
  SQLiteReal: 'float',
  SQLiteTextJson: 'json',
  SQLiteBlobJson: 'json',
  SQLiteBlobBuffer: 'bytes',
};
const PG_KINDS: Record<string, string> = {
  PgText: 'text',
  PgInteger: 'integer',
  PgBigInt53: 'integer',
  PgTimestamp: 'instant',
  PgBoolean: 'boolean',
  PgDoublePrecision: 'float',
  PgJson: 'json',
  PgJsonb: 'json',
  PgBytea: 'bytes',
  'PgCustomColumn:bytea': 'bytes',
};

interface ColumnShape {
  kind: string;
  notNull: boolean;
  hasDefault: boolean;
  enumValues: string[] | null;
  unique: string | null;
}

interface TableShape {
  columns: Record<string, ColumnShape>;
  primaryKey: string[];
  uniqueConstraints: { name: string; columns: string[] }[];
  indexes: { name: string; columns: string[]; unique: boolean }[];
  foreignKeys: { columns: string[]; table: string; foreignColumns: string[]; onDelete: string; onUpdate: string }[];
}

type AnyColumn = AnySQLiteColumn | AnyPgColumn;

function kindOf(kinds: Record<string, string>, table: string, column: AnyColumn): string {
  // A custom column (e.g. bytea) is known by the SQL type it declares.
  const key = column.columnType.endsWith('CustomColumn') ? `${column.columnType}:${column.getSQLType()}` : column.columnType;
  const kind = kinds[key];
  if (!kind) throw new Error(`${table}.${column.name}: column type ${key} has no kind in the parity table`);
  if (column.columnType === 'SQLiteTimestamp' && (column as { mode?: string }).mode !== 'timestamp_ms') {
    throw new Error(`${table}.${column.name}: SQLite timestamps are kept in milliseconds (timestamp_ms)`);
  }
  return kind;
}

function columnShape(kinds: Record<string, string>, table: string, column: AnyColumn): ColumnShape {
  return {
    kind: kindOf(kinds, table, column),
    notNull: column.notNull,
    hasDefault: column.hasDefault,
    enumValues: column.enumValues ?? null,
    unique: column.isUnique ? (column.uniqueName ?? '') : null,
  };
}

type Config = ReturnType<typeof sqliteTableConfig> | ReturnType<typeof pgTableConfig>;

function tableShape(kinds: Record<string, string>, config: Config): TableShape {
  const columns: Record<string, ColumnShape> = {};
  for (const column of config.columns as AnyColumn[]) columns[column.name] = columnShape(kinds, config.name, column);
  const primaryKey =
    config.primaryKeys.length > 0
      ? config.primaryKeys.flatMap((pk) => pk.columns.map((c) => c.name))
      : (config.columns as AnyColumn[]).filter((c) => c.primary).map((c) => c.name);
  const byName = <T extends { name: string }>(list: T[]) => [...list].sort((a, b) => a.name.localeCompare(b.name));
  return {
    columns,
    primaryKey,
    uniqueConstraints: byName(
      config.uniqueConstraints.map((u) => ({ name: u.getName() ?? '', columns: u.columns.map((c) => c.name) })),
    ),
    indexes: byName(
      config.indexes.map((i) => ({
        name: i.config.name ?? '',
        columns: i.config.columns.map((c) => (c as { name: string }).name),
        unique: i.config.unique ?? false,
      })),
    ),
    foreignKeys: config.foreignKeys
      .map((fk) => {
        const ref = fk.reference();
        const target = is(ref.foreignTable, PgTable)
          ? pgTableConfig(ref.foreignTable).name
          : sqliteTableConfig(ref.foreignTable as SQLiteTable).name;
        return {
          columns: ref.columns.map((c) => c.name),
          table: target,
          foreignColumns: ref.foreignColumns.map((c) => c.name),
          onDelete: fk.onDelete ?? 'no action',
          onUpdate: fk.onUpdate ?? 'no action',
        };
      })
      .sort((a, b) => a.columns.join().localeCompare(b.columns.join())),
  };
}

/** Every table a schema module exports, by table name. */
function shapes(module: Record<string, unknown>, dialect: 'sqlite' | 'pg'): Record<string, TableShape> {
  const out: Record<string, TableShape> = {};
  for (const value of Object.values(module)) {
    if (dialect === 'sqlite' && is(value, SQLiteTable)) {
      const config = sqliteTableConfig(value);
      out[config.name] = tableShape(SQLITE_KINDS, config);
    } else if (dialect === 'pg' && is(value, PgTable)) {
      const config = pgTableConfig(value);
      out[config.name] = tableShape(PG_KINDS, config);
    }
  }
  return out;
}

describe('PostgreSQL schema parity with the SQLite schema', () => {
  const sqlite = shapes(sqliteSchema, 'sqlite');
  const pg = shapes(pgSchema, 'pg');

  it('has the same tables', () => {
    expect(Object.keys(sqlite).length).toBeGreaterThanOrEqual(17);
    expect(Object.keys(pg).sort()).toEqual([...Object.keys(sqlite), ...PG_ONLY_TABLES].sort());
  });

  it.each(Object.keys(sqlite).sort())('table %s: same columns, keys, indexes and foreign keys', (name) => {
    expect(pg[name]).toEqual(sqlite[name]);
  });

  it('exports each table under the same name', () => {
    const exported = (module: Record<string, unknown>, table: typeof SQLiteTable | typeof PgTable) =>
      Object.entries(module)
        .filter(([k, v]) => is(v, table) && !(PG_ONLY_EXPORTS as readonly string[]).includes(k))
        .map(([k]) => k)
        .sort();
    expect(exported(pgSchema, PgTable)).toEqual(exported(sqliteSchema, SQLiteTable));
  });

  it('gives repository code the same row types from both (checked by tsc)', () => {
    type TableKeys<M> = { [K in keyof M]: M[K] extends Table ? K : never }[keyof M];
    type Rows<M> = { [K in TableKeys<M>]: M[K] extends Table ? M[K]['$inferSelect'] : never };
    type Inserts<M> = { [K in TableKeys<M>]: M[K] extends Table ? M[K]['$inferInsert'] : never };
    type Shared = Omit<typeof pgSchema, (typeof PG_ONLY_EXPORTS)[number]>;
    expectTypeOf<Rows<Shared>>().toEqualTypeOf<Rows<typeof sqliteSchema>>();
    expectTypeOf<Inserts<Shared>>().toEqualTypeOf<Inserts<typeof sqliteSchema>>();
  });
});
