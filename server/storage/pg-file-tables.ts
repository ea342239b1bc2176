/**
 * The PostgreSQL tables of stored files (docs/file-store.md), used by {@link PgFileStore} when DATABASE_URL is
 * set. PostgreSQL only: with SQLite files stay in the data folder, so the SQLite schema has no such
 * tables (the schema-parity spec lists them as PostgreSQL-only).
 */
import { bigint, customType, integer, pgTable, primaryKey, text, timestamp } from 'drizzle-orm/pg-core';

const bytea = customType<{ data: Buffer; driverData: Buffer }>({ dataType: () => 'bytea' });

/**
 * One row per stored file: its key (the `storage_path` of its upload or print-set row) and the
 * generation of chunks that holds its bytes. A new write makes a new generation and moves the head to
 * it in the same transaction, so a reader never sees half of one file and half of another.
 */
export const storedFiles = pgTable('stored_files', {
  key: text('key').primaryKey(),
  fileId: text('file_id').notNull().unique(),
  size: bigint('size', { mode: 'number' }).notNull(),
  sha256: text('sha256').notNull(),
  /** Bytes in every chunk but the last, so a range read starts at chunk floor(start / chunkBytes). */
  chunkBytes: integer('chunk_bytes').notNull(),
  modifiedAt: timestamp('modified_at', { mode: 'date', withTimezone: true, precision: 3 }).notNull().defaultNow(),
});

/** A file's bytes, `chunk_bytes` at a time, numbered from 0. */
export const storedFileChunks = pgTable(
  'stored_file_chunks',
  {
    fileId: text('file_id').notNull(),
    seq: integer('seq').notNull(),
    data: bytea('data').notNull(),
  },
  (t) => [primaryKey({ columns: [t.fileId, t.seq] })],
);
