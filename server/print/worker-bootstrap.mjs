// The print pool's worker entry (piscina imports it in each worker thread): registers tsx's loader in
// this thread, then hands on to the TypeScript task. (Node 20 does not apply `--import tsx` from the
// parent's execArgv to a worker's own entry file.)
import { register } from 'tsx/esm/api';

register();
const task = await import(new URL('./print-worker.ts', import.meta.url).href);

export default task.default;
