/// <reference lib="webworker" />
/**
 * The bring-up worker: the board's test vectors (a fault simulation of the whole board) and the
 * diagnosis of the shared record, off the page's thread (bringup-jobs.ts does the work).
 */
import { BringupJobs } from './bringup-jobs';
import type { FromWorker, ToWorker } from './protocol';

const scope = self as unknown as DedicatedWorkerGlobalScope;
const jobs = new BringupJobs((msg: FromWorker) => scope.postMessage(msg));

scope.onmessage = (e: MessageEvent<ToWorker>) => jobs.handle(e.data);
