import { Worker } from 'node:worker_threads';
import { AnalysisError, type AnalyzeRequest } from '../../shared/analysis';
import type { BoardFile } from '../../shared/board';
import type { AnalyzeConfig } from '../config';
import { HttpError } from '../lib/errors';
import type { PendingAnalysis } from './analysis-table';
import type { WorkerReply } from './analysis-worker';

const BOOT = new URL('./analysis-worker-boot.mjs', import.meta.url);
const ENTRY = new URL('./analysis-worker.ts', import.meta.url).href;

/** Large analyses in worker threads: at most `workers` at once, each stopped after `timeLimitMs`. */
export interface AnalysisRunner {
  /**
   * Analyses in a fresh worker. Rejects with AnalysisError (bad request), 413 `analysis_too_large` past
   * the time limit, 503 `analysis_busy` when every worker is taken; `signal` (the client went away) stops it.
   */
  run(board: BoardFile, req: AnalyzeRequest, signal?: AbortSignal): Promise<PendingAnalysis>;
  /** Stops running workers (shutdown). */
  close(): Promise<void>;
}

export function createAnalysisRunner(config: Pick<AnalyzeConfig, 'timeLimitMs' | 'workers'>): AnalysisRunner {
  const running = new Set<Worker>();
  return {
    run(board, req, signal) {
      if (running.size >= config.workers) {
        return Promise.reject(new HttpError(503, 'analysis_busy', 'The server is busy with other large analyses; try again in a moment'));
      }
      // a worker that runs out of its heap dies alone, not the server
      const worker = new Worker(BOOT, { workerData: { board, req, entry: ENTRY }, resourceLimits: { maxOldGenerationSizeMb: 512 } });
      running.add(worker);
      return new Promise<PendingAnalysis>((resolve, reject) => {
        let settled = false;
        const settle = (fn: () => void) => {
          if (settled) return;
          settled = true;
          clearTimeout(timer);
          signal?.removeEventListener('abort', onAbort);
          running.delete(worker);
          void worker.terminate();
          fn();
        };
        const seconds = Math.round(config.timeLimitMs / 100) / 10;
        const timer = setTimeout(() => settle(() => reject(new HttpError(413, 'analysis_too_large', `The analysis took longer than ${seconds} s; choose fewer inputs`, { inputs: `over ${seconds} s` }))), config.timeLimitMs);
        const onAbort = () => settle(() => reject(new HttpError(499, 'client_closed', 'The client went away')));
        signal?.addEventListener('abort', onAbort);
        worker.once('message', (m: WorkerReply) => settle(() => {
          if (m.ok) resolve(m.result);
          else if (m.analysisError) reject(new AnalysisError(m.analysisError.message, m.analysisError.fields));
          else reject(new Error(`analysis worker failed: ${m.message}`));
        }));
        worker.once('error', (err: Error & { code?: string }) => settle(() => reject(err.code === 'ERR_WORKER_OUT_OF_MEMORY'
          ? new HttpError(413, 'analysis_too_large', 'The analysis needs more memory than the server gives one analysis; choose fewer inputs', { inputs: 'out of memory' })
          : err)));
        worker.once('exit', (code) => settle(() => reject(new Error(`analysis worker exited with code ${code}`))));
      });
    },
    async close() {
      await Promise.all([...running].map((w) => w.terminate()));
      running.clear();
    },
  };
}
