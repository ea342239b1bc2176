// The validation pool's worker entry (piscina imports it in each worker thread): registers tsx's loader
// in this thread, then hands on to the TypeScript task (as server/print/worker-bootstrap.mjs does).
import { register } from 'tsx/esm/api';

register();
const task = await import(new URL('./document-worker.ts', import.meta.url).href);

export default task.default;
