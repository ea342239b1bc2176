import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { integer, sqliteTable } from 'drizzle-orm/sqlite-core';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openDatabase, type DatabaseHandle } from './database';

// A scratch table whose foreign key is checked only at COMMIT (DEFERRABLE INITIALLY DEFERRED): a
// write that breaks it succeeds statement by statement and fails exactly when SQLite commits, the
// same place a full disk fails a write-ahead-log commit (SQLite documentation, "Foreign Key
// Support" §4.2 deferred constraints).
const parent = sqliteTable('scratch_parent', { id: integer('id').primaryKey() });
const child = sqliteTable('scratch_child', { id: integer('id').primaryKey(), parentId: integer('parent_id') });

let dir: string;
let handle: DatabaseHandle;
beforeAll(() => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'seamwright-db-'));
  handle = openDatabase(dir);
  handle.sqlite.exec(`CREATE TABLE scratch_parent (id INTEGER PRIMARY KEY);
    CREATE TABLE scratch_child (id INTEGER PRIMARY KEY,
      parent_id INTEGER REFERENCES scratch_parent(id) DEFERRABLE INITIALLY DEFERRED);
    INSERT INTO scratch_parent (id) VALUES (1); INSERT INTO scratch_child (id, parent_id) VALUES (1, 1);`);
});
afterAll(() => {
  handle.close();
  fs.rmSync(dir, { recursive: true, force: true });
});

const storedChildren = () => handle.sqlite.prepare('SELECT id, parent_id AS parentId FROM scratch_child ORDER BY id').all();

describe('writes whose commit fails', () => {
  it('an INSERT … RETURNING read with .get() throws and stores nothing', () => {
    const { db } = handle;
    expect(() => db.insert(child).values({ id: 2, parentId: 99 }).returning().get()).toThrow(/FOREIGN KEY/);
    expect(storedChildren()).toEqual([{ id: 1, parentId: 1 }]);
  });

  it('an UPDATE … RETURNING read with .get() throws and stores nothing', () => {
    const { db } = handle;
    expect(() => db.update(child).set({ parentId: 42 }).where(eq(child.id, 1)).returning().get()).toThrow(/FOREIGN KEY/);
    expect(storedChildren()).toEqual([{ id: 1, parentId: 1 }]);
  });

  it('a DELETE … RETURNING read with .get() throws and keeps the row', () => {
    const { db } = handle;
    expect(() => db.delete(parent).where(eq(parent.id, 1)).returning().get()).toThrow(/FOREIGN KEY/);
    expect(handle.sqlite.prepare('SELECT id FROM scratch_parent').all()).toEqual([{ id: 1 }]);
  });

  it('a write that commits still answers its row, and reads are unchanged', () => {
    const { db } = handle;
    expect(db.insert(child).values({ id: 3, parentId: 1 }).returning().get()).toEqual({ id: 3, parentId: 1 });
    expect(db.select().from(child).where(eq(child.id, 3)).get()).toEqual({ id: 3, parentId: 1 });
    expect(storedChildren()).toHaveLength(2);
  });
});
