import type { Config } from 'drizzle-kit';

/** PostgreSQL migrations (docs/postgresql.md): `npx drizzle-kit generate --config drizzle.pg.config.ts --name <name>`. */
export default {
  dialect: 'postgresql',
  schema: './server/db/schema-pg.ts',
  out: './drizzle-pg',
  casing: 'snake_case',
} satisfies Config;
