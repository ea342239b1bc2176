// Starts a TypeScript worker thread: registers tsx's loader in this thread, then imports the entry.
// (Node 20 does not apply `--import tsx` from a worker's execArgv to the worker's own entry file.)
import { workerData } from 'node:worker_threads';
import { register } from 'tsx/esm/api';

register();
await import(workerData.entry);
