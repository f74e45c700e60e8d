// Starts the TypeScript analysis worker in a worker thread, under `npm start` (tsx) and Vitest alike:
// a worker does not inherit tsx's loader, so it registers tsx itself before importing the entry.
import { workerData } from 'node:worker_threads';
import { register } from 'tsx/esm/api';

register();
await import(workerData.entry);
