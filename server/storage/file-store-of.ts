import type { Config } from '../config';
import { DiskFileStore } from './disk-store';
import type { FileStore } from './file-store';

/**
 * The file store a server uses: the one it was given (`files`, e.g. PostgreSQL when DATABASE_URL is
 * set), otherwise the data folder on the local disk.
 */
export function fileStoreOf(ctx: { config: Pick<Config, 'dataDir'>; files?: FileStore }): FileStore {
  return ctx.files ?? new DiskFileStore(ctx.config.dataDir);
}
