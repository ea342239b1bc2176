import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

const alias = {
  '@seamwright/api': fileURLToPath(new URL('./projects/api/src/public-api.ts', import.meta.url)),
  // Vite ignores tsconfig "paths" in plain vitest: mirror them here. An alias also matches the paths
  // below it and the first match wins, so each '/testing' entry comes before its library's.
  '@seamwright/piecing/testing': fileURLToPath(new URL('./projects/piecing/src/testing.ts', import.meta.url)),
  '@seamwright/piecing': fileURLToPath(new URL('./projects/piecing/src/public-api.ts', import.meta.url)),
  '@seamwright/template-editor/testing': fileURLToPath(
    new URL('./projects/template-editor/src/testing.ts', import.meta.url),
  ),
  '@seamwright/template-editor': fileURLToPath(new URL('./projects/template-editor/src/public-api.ts', import.meta.url)),
  '@seamwright/template-editor-core': fileURLToPath(
    new URL('./projects/template-editor/src/lib/core/public-api.ts', import.meta.url),
  ),
};

/**
 * The server specs that run on PostgreSQL as well (the `server-pg` project). A spec joins when the
 * code it tests is written for both databases (server/db/data.ts); specs about SQLite itself (its
 * file, the hot routes, its migrations) stay SQLite-only.
 */
const PG_API_SPECS = ['server/auth.spec.ts', 'server/password-reset.spec.ts', 'server/patterns.spec.ts', 'server/save-race.spec.ts', 'server/seed.spec.ts', 'server/services/housekeeping.spec.ts', 'server/services/pattern-list.spec.ts', 'server/colourway-copies.spec.ts', 'server/routes/sewing-log.spec.ts', 'server/uploads.spec.ts', 'server/sharing.spec.ts', 'server/control-characters.spec.ts', 'server/pattern-import.spec.ts', 'server/shop/shop.spec.ts', 'server/shop/listing-quilt-fill.spec.ts', 'server/main.spec.ts', 'server/save-thread-time.spec.ts', 'server/print-sets.spec.ts', 'server/print-set-quilt.spec.ts', 'server/access-matrix.spec.ts', 'server/members-privacy.spec.ts', 'server/revision-history.spec.ts', 'server/api-contract.spec.ts', 'server/hostile.spec.ts'];

const propertySeed = fileURLToPath(new URL('./tests/support/property-seed.ts', import.meta.url));
const stopTestCluster = fileURLToPath(new URL('./tests/support/stop-test-cluster.ts', import.meta.url));

export default defineConfig({
  resolve: { alias },
  test: {
    // Native modules (better-sqlite3) can crash at exit under worker threads: use child processes.
    pool: 'forks',
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'piecing',
          environment: 'node',
          setupFiles: [propertySeed],
          include: ['projects/piecing/**/*.spec.ts'],
          testTimeout: 60_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'server',
          environment: 'node',
          setupFiles: [propertySeed],
          include: ['server/**/*.spec.ts', 'projects/api/**/*.spec.ts'],
          testTimeout: 60_000,
          hookTimeout: 60_000,
          fileParallelism: false,
        },
      },
      {
        resolve: { alias },
        test: {
          // The API tests again on PostgreSQL (issue 18, docs/postgresql.md): the harness gives each
          // test server a fresh database in a throwaway cluster, one cluster per file.
          name: 'server-pg',
          environment: 'node',
          setupFiles: [propertySeed, stopTestCluster],
          include: PG_API_SPECS,
          env: { SEAMWRIGHT_TEST_DATABASE: 'postgres' },
          testTimeout: 60_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
      {
        resolve: { alias },
        test: {
          // Fault and hostile-input tests against a real server process (issue: benchmarks and faults).
          name: 'faults',
          environment: 'node',
          setupFiles: [propertySeed],
          include: ['tests/faults/**/*.spec.ts', 'tests/hostile/**/*.spec.ts'],
          testTimeout: 300_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
      {
        resolve: { alias },
        test: {
          // Two real server processes on one throwaway PostgreSQL (issue 18, docs/postgresql.md).
          name: 'multi-instance',
          environment: 'node',
          setupFiles: [propertySeed],
          include: ['tests/multi-instance/**/*.spec.ts'],
          testTimeout: 420_000,
          hookTimeout: 300_000,
          fileParallelism: false,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'editor-core',
          environment: 'node',
          setupFiles: [propertySeed],
          include: ['projects/template-editor/src/lib/core/**/*.spec.ts'],
        },
      },
    ],
  },
});
