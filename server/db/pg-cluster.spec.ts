import { existsSync } from 'node:fs';
import pg from 'pg';
import { afterAll, describe, expect, it } from 'vitest';
import { type PgCluster, findPgBinaries, startPgCluster } from '../../tests/support/pg-cluster';

async function query<T extends pg.QueryResultRow>(url: string, sql: string): Promise<T[]> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    return (await client.query<T>(sql)).rows;
  } finally {
    await client.end();
  }
}

describe('throwaway PostgreSQL cluster (tests/support/pg-cluster.ts)', () => {
  const started: PgCluster[] = [];
  afterAll(async () => {
    for (const cluster of started) await cluster.stop();
  });

  it('finds initdb and pg_ctl', () => {
    const bins = findPgBinaries();
    expect(bins).not.toBeNull();
    expect(bins!.initdb).toMatch(/initdb$/);
    expect(bins!.pgCtl).toMatch(/pg_ctl$/);
  });

  it('starts two clusters at once on different loopback ports, answers queries, and stop removes everything', async () => {
    const [a, b] = await Promise.all([startPgCluster(), startPgCluster({ database: 'second' })]);
    started.push(a!, b!);
    expect(a!.port).not.toBe(b!.port);
    expect(a!.url).toBe(`postgres://seamwright@127.0.0.1:${a!.port}/seamwright`);
    expect(b!.url).toBe(`postgres://seamwright@127.0.0.1:${b!.port}/second`);

    expect(await query<{ one: number }>(a!.url, 'select 1 as one')).toEqual([{ one: 1 }]);
    const [facts] = await query<{ db: string; enc: string; collate: string; version: string }>(
      b!.url,
      "select current_database() as db, pg_encoding_to_char(encoding) as enc, datcollate as collate, current_setting('server_version_num') as version from pg_database where datname = current_database()",
    );
    expect(facts).toMatchObject({ db: 'second', enc: 'UTF8', collate: 'C' });
    expect(Number(facts!.version)).toBeGreaterThanOrEqual(130000);

    const extra = await a!.createDatabase('extra');
    expect(await query<{ db: string }>(extra, 'select current_database() as db')).toEqual([{ db: 'extra' }]);

    await a!.stop();
    expect(existsSync(a!.dir)).toBe(false);
    await expect(query(a!.url, 'select 1')).rejects.toThrow();
    await a!.stop(); // a second stop is harmless
    // The other cluster is untouched by the first one's stop.
    expect(await query<{ one: number }>(b!.url, 'select 1 as one')).toEqual([{ one: 1 }]);
  });
});
