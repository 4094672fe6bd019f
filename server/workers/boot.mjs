// Entry of a worker thread: registers the TypeScript loader (tsx, as the server runs) and loads the
// TypeScript entry named in workerData.entry (a file URL).
import { workerData } from 'node:worker_threads';
import { register } from 'tsx/esm/api';

register();
await import(workerData.entry);
