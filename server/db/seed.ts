/**
 * Demo data (invented, docs/design-notes.md#demo-data): the studio "Fernbrook Patterns" with an admin, a designer and a
 * quilter, and the demo patterns built by the piecing library, shared with the demo quilter.
 *
 * `seedDemo` adds whatever of it is missing (idempotent). The server calls `seedDemoIfEmpty` at start
 * when SEAMWRIGHT_SEED_DEMO=1 or `--seed-demo` is given; `tsx server/db/seed.ts` runs `seedDemo` alone.
 * Either works on SQLite and PostgreSQL (DATABASE_URL). Everything is written in one transaction, which
 * on PostgreSQL first takes an advisory lock: instances starting together on one empty database seed
 * it once, the others find it seeded (docs/postgresql.md).
 */
import { and, eq, sql } from 'drizzle-orm';
import { buildGardenGate, buildOrchardWheel, readPatternDocument, type PatternDocument } from '@seamwright/piecing';
import { hashPassword } from '../auth/passwords';
import { newId } from '../auth/tokens';
import { loadConfig } from '../config';
import { createPattern } from '../services/revisions';
import { seedDemoShop } from '../shop/demo-shop';
import type { Data } from './data';
import { DEMO_ACCOUNTS } from './demo-accounts';
import { openData } from './open-data';

export { DEMO_ACCOUNTS } from './demo-accounts';

/** The piecing library's demo builders, in seeding order. */
const DEMO_BUILDERS: (() => unknown)[] = [buildOrchardWheel, buildGardenGate];

export interface SeedReport {
  accountsCreated: string[];
  patternsCreated: string[];
}

/** Whether the database holds no user at all. */
export async function isEmpty(d: Data): Promise<boolean> {
  const { users } = d.t;
  return (await d.db.select({ id: users.id }).from(users).limit(1)).length === 0;
}

/** Adds the missing demo accounts and patterns. */
export async function seedDemo(d: Data, bcryptRounds: number): Promise<SeedReport> {
  const prepared = await prepare(bcryptRounds);
  return d.transaction(async (tx) => {
    await takeSeedLock(tx);
    return seedIn(tx, prepared);
  });
}

/**
 * Seeds the demo when the database holds no user; undefined when it held one (another instance may
 * have seeded it a moment ago: the check and the seeding are one transaction under the seed lock).
 */
export async function seedDemoIfEmpty(d: Data, bcryptRounds: number): Promise<SeedReport | undefined> {
  if (!(await isEmpty(d))) return undefined;
  // Password hashes and documents are made before the transaction, which may await only the database.
  const prepared = await prepare(bcryptRounds);
  return d.transaction(async (tx) => {
    await takeSeedLock(tx);
    if (!(await isEmpty(tx))) return undefined;
    return seedIn(tx, prepared);
  });
}

interface Prepared {
  passwordHashes: Map<string, string>;
  documents: PatternDocument[];
}

async function prepare(bcryptRounds: number): Promise<Prepared> {
  const hashes = await Promise.all(DEMO_ACCOUNTS.map((a) => hashPassword(a.password, bcryptRounds)));
  return {
    passwordHashes: new Map(DEMO_ACCOUNTS.map((a, i) => [a.email, hashes[i]!])),
    documents: DEMO_BUILDERS.map((build) => readPatternDocument(build())),
  };
}

/**
 * PostgreSQL: one seeding transaction at a time across instances, held until it commits. (SQLite's
 * transactions already take the write lock at their start.)
 */
async function takeSeedLock(tx: Data): Promise<void> {
  if (tx.dialect === 'postgres') await tx.rows(sql`SELECT pg_advisory_xact_lock(hashtextextended('seamwright:seed-demo', 0))`);
}

async function seedIn(tx: Data, prepared: Prepared): Promise<SeedReport> {
  const { members, patterns, users } = tx.t;
  const report: SeedReport = { accountsCreated: [], patternsCreated: [] };
  const ids: Record<string, string> = {};
  for (const a of DEMO_ACCOUNTS) {
    const [existing] = await tx.db.select({ id: users.id }).from(users).where(eq(users.email, a.email));
    if (existing) {
      ids[a.role] = existing.id;
      continue;
    }
    const id = newId();
    const passwordHash = prepared.passwordHashes.get(a.email)!;
    await tx.db.insert(users).values({ id, email: a.email, displayName: a.displayName, passwordHash, role: a.role, createdAt: new Date() });
    ids[a.role] = id;
    report.accountsCreated.push(a.email);
  }

  const patternIds: Record<string, string> = {};
  for (const document of prepared.documents) {
    const [owned] = await tx.db
      .select({ id: patterns.id })
      .from(patterns)
      .where(and(eq(patterns.ownerId, ids['designer']!), eq(patterns.title, document.title)));
    if (owned) {
      patternIds[document.title] = owned.id;
      continue;
    }
    const { pattern } = await createPattern(tx, ids['designer']!, document);
    await tx.db.insert(members).values({ patternId: pattern!.id, userId: ids['quilter']!, access: 'quilter', createdAt: new Date() });
    patternIds[document.title] = pattern!.id;
    report.patternsCreated.push(document.title);
  }

  // The studio's shop sells the small block (invented price and wording).
  const gate = patternIds['Garden Gate'];
  if (gate) {
    await seedDemoShop(tx, ids['designer']!, 'usd', [
      {
        patternId: gate,
        priceMinor: 900,
        description: 'An 8 in. straight-seam block in three sections: a good first foundation-pieced pattern.',
      },
    ]);
  }
  return report;
}

const isMain = process.argv[1]?.endsWith('seed.ts');
if (isMain) {
  const config = loadConfig();
  const opened = await openData(config);
  try {
    const r = await seedDemo(opened.data, config.bcryptRounds);
    console.log(`Demo data in ${opened.where}:`);
    console.log(`  accounts created: ${r.accountsCreated.join(', ') || 'none (already there)'}`);
    console.log(`  patterns created: ${r.patternsCreated.join(', ') || 'none'}`);
    for (const a of DEMO_ACCOUNTS) console.log(`  sign in: ${a.email} / ${a.password} (${a.role})`);
  } catch (err) {
    console.error('Seeding failed:', err);
    process.exitCode = 1;
  } finally {
    await opened.close();
  }
}
