import { Worker } from 'node:worker_threads';
import { AnalysisError, type AnalyzeRequest } from '../../shared/analysis';
import type { BoardFile } from '../../shared/board';
import type { AnalyzeConfig } from '../config';
import { HttpError } from '../lib/errors';
import type { PendingAnalysis } from './analysis-table';
import type { WorkerJob, WorkerReply } from './analysis-worker';

const BOOT = new URL('./analysis-worker-boot.mjs', import.meta.url);
const ENTRY = new URL('./analysis-worker.ts', import.meta.url).href;

/** Large analyses in worker threads: at most `workers` at once, each stopped after `timeLimitMs`. */
export interface AnalysisRunner {
  /**
   * Analyses in a worker. Rejects with AnalysisError (bad request), 413 `analysis_too_large` past the
   * time limit or the worker's memory, 503 `analysis_busy` when every worker is taken; `signal` (the
   * client went away) stops it.
   */
  run(board: BoardFile, req: AnalyzeRequest, signal?: AbortSignal): Promise<PendingAnalysis>;
  /** Stops the workers (shutdown). */
  close(): Promise<void>;
}

interface Slot { worker: Worker; busy: boolean }

/**
 * Workers are started on first need and kept (starting one loads the analysis code again, which takes
 * a while); a worker stopped for its time limit or a client that left is replaced by the next job.
 */
export function createAnalysisRunner(config: Pick<AnalyzeConfig, 'timeLimitMs' | 'workers'>): AnalysisRunner {
  const slots = new Set<Slot>();
  let nextId = 1;
  const tooLarge = (why: string, field: string) => new HttpError(413, 'analysis_too_large', why, { inputs: field });

  const take = (): Slot | undefined => {
    for (const s of slots) if (!s.busy) return s;
    if (slots.size >= config.workers) return undefined;
    // a worker that runs out of its heap dies alone, not the server
    const worker = new Worker(BOOT, { workerData: { entry: ENTRY }, resourceLimits: { maxOldGenerationSizeMb: 512 } });
    worker.unref(); // an idle worker does not keep the process alive
    const slot: Slot = { worker, busy: false };
    slots.add(slot);
    worker.once('exit', () => slots.delete(slot));
    return slot;
  };

  return {
    run(board, req, signal) {
      const slot = take();
      if (!slot) return Promise.reject(new HttpError(503, 'analysis_busy', 'The server is busy with other large analyses; try again in a moment'));
      slot.busy = true;
      const { worker } = slot;
      const id = nextId++;
      return new Promise<PendingAnalysis>((resolve, reject) => {
        let settled = false;
        const settle = (fn: () => void, stopWorker: boolean) => {
          if (settled) return;
          settled = true;
          clearTimeout(timer);
          signal?.removeEventListener('abort', onAbort);
          worker.off('message', onMessage);
          worker.off('error', onError);
          worker.off('exit', onExit);
          if (stopWorker) {
            slots.delete(slot);
            void worker.terminate();
          } else {
            slot.busy = false;
          }
          fn();
        };
        const seconds = Math.round(config.timeLimitMs / 100) / 10;
        const timer = setTimeout(() => settle(() => reject(tooLarge(`The analysis took longer than ${seconds} s; choose fewer inputs`, `over ${seconds} s`)), true), config.timeLimitMs);
        const onAbort = () => settle(() => reject(new HttpError(499, 'client_closed', 'The client went away')), true);
        const onMessage = (m: WorkerReply) => {
          if (m.id !== id) return;
          settle(() => {
            if (m.ok) resolve(m.result);
            else if (m.analysisError) reject(new AnalysisError(m.analysisError.message, m.analysisError.fields));
            else reject(new Error(`analysis worker failed: ${m.message}`));
          }, false);
        };
        const onError = (err: Error & { code?: string }) => settle(() => reject(err.code === 'ERR_WORKER_OUT_OF_MEMORY'
          ? tooLarge('The analysis needs more memory than the server gives one analysis; choose fewer inputs', 'out of memory')
          : err), true);
        const onExit = (code: number) => settle(() => reject(new Error(`analysis worker exited with code ${code}`)), true);
        signal?.addEventListener('abort', onAbort);
        worker.on('message', onMessage);
        worker.once('error', onError);
        worker.once('exit', onExit);
        const job: WorkerJob = { id, board, req };
        worker.postMessage(job);
      });
    },
    async close() {
      const all = [...slots];
      slots.clear();
      await Promise.all(all.map((s) => s.worker.terminate()));
    },
  };
}
