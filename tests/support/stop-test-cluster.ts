/**
 * Setup file of the `server-pg` test project (vitest.config.ts): after each spec file, stop the
 * throwaway PostgreSQL cluster the test harness started for it (docs/postgresql.md). Registered before
 * the file's own hooks, so it runs after them, once its servers are closed.
 */
import { afterAll } from 'vitest';
import { stopTestCluster } from '../../server/test/harness';

afterAll(async () => {
  await stopTestCluster();
});
