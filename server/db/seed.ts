/**
 * Demo data (invented, docs/design-notes.md#demo-data): the studio "Fernbrook Patterns" with an admin, a designer and a
 * quilter, and the demo patterns built by the piecing library, shared with the demo quilter.
 *
 * `seedDemo` adds whatever of it is missing (idempotent). The server calls it at start on an empty
 * database when SEAMWRIGHT_SEED_DEMO=1 or `--seed-demo` is given; `tsx server/db/seed.ts` runs it alone.
 */
import { and, eq } from 'drizzle-orm';
import { buildGardenGate, buildOrchardWheel, readPatternDocument, type PatternDocument } from '@seamwright/piecing';
import { hashPassword } from '../auth/passwords';
import { newId } from '../auth/tokens';
import { loadConfig } from '../config';
import { createPattern } from '../services/revisions';
import { seedDemoShop } from '../shop/demo-shop';
import { openDatabase, type Db } from './database';
import { DEMO_ACCOUNTS } from './demo-accounts';
import { members, patterns, users } from './schema';

export { DEMO_ACCOUNTS } from './demo-accounts';

/** The piecing library's demo builders, in seeding order. */
const DEMO_BUILDERS: (() => unknown)[] = [buildOrchardWheel, buildGardenGate];

export interface SeedReport {
  accountsCreated: string[];
  patternsCreated: string[];
}

/** Whether the database holds no user at all. */
export function isEmpty(db: Db): boolean {
  return db.select({ id: users.id }).from(users).limit(1).all().length === 0;
}

/** Adds the missing demo accounts and patterns. */
export async function seedDemo(db: Db, bcryptRounds: number): Promise<SeedReport> {
  const report: SeedReport = { accountsCreated: [], patternsCreated: [] };
  const ids: Record<string, string> = {};
  for (const a of DEMO_ACCOUNTS) {
    const existing = db.select().from(users).where(eq(users.email, a.email)).get();
    if (existing) {
      ids[a.role] = existing.id;
      continue;
    }
    const id = newId();
    const passwordHash = await hashPassword(a.password, bcryptRounds);
    db.insert(users).values({ id, email: a.email, displayName: a.displayName, passwordHash, role: a.role, createdAt: new Date() }).run();
    ids[a.role] = id;
    report.accountsCreated.push(a.email);
  }

  const patternIds: Record<string, string> = {};
  for (const build of DEMO_BUILDERS) {
    const document: PatternDocument = readPatternDocument(build());
    const owned = db
      .select({ id: patterns.id })
      .from(patterns)
      .where(and(eq(patterns.ownerId, ids['designer']), eq(patterns.title, document.title)))
      .get();
    if (owned) {
      patternIds[document.title] = owned.id;
      continue;
    }
    db.transaction(
      (tx) => {
        const { pattern } = createPattern(tx, ids['designer'], document);
        tx.insert(members).values({ patternId: pattern.id, userId: ids['quilter'], access: 'quilter', createdAt: new Date() }).run();
        patternIds[document.title] = pattern.id;
      },
      { behavior: 'immediate' },
    );
    report.patternsCreated.push(document.title);
  }

  // The studio's shop sells the small block (invented price and wording).
  const gate = patternIds['Garden Gate'];
  if (gate) {
    seedDemoShop(db, ids['designer'], 'usd', [
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
  const database = openDatabase(config.dataDir);
  seedDemo(database.db, config.bcryptRounds)
    .then((r) => {
      console.log(`Demo data in ${database.file}:`);
      console.log(`  accounts created: ${r.accountsCreated.join(', ') || 'none (already there)'}`);
      console.log(`  patterns created: ${r.patternsCreated.join(', ') || 'none'}`);
      for (const a of DEMO_ACCOUNTS) console.log(`  sign in: ${a.email} / ${a.password} (${a.role})`);
      database.close();
    })
    .catch((err) => {
      console.error('Seeding failed:', err);
      database.close();
      process.exit(1);
    });
}
