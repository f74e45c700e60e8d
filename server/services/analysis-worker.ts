import { parentPort } from 'node:worker_threads';
import { AnalysisError, type AnalyzeRequest } from '../../shared/analysis';
import type { BoardFile } from '../../shared/board';
import { analyzePending, type PendingAnalysis } from './analysis-table';

/** A job for the analysis worker. */
export interface WorkerJob { id: number; board: BoardFile; req: AnalyzeRequest }

/** The worker's answer to a job (the table's bytes are transferred, not copied). */
export type WorkerReply = { id: number } & (
  | { ok: true; result: PendingAnalysis }
  | { ok: false; analysisError?: { message: string; fields: Record<string, string> }; message: string }
);

// Large analyses off the request thread: one job at a time, as long as the worker lives.
parentPort!.on('message', ({ id, board, req }: WorkerJob) => {
  try {
    const result = analyzePending(board, req);
    const reply: WorkerReply = { id, ok: true, result };
    parentPort!.postMessage(reply, [...new Set(result.values.map((v) => v.buffer as ArrayBuffer))]);
  } catch (err) {
    const reply: WorkerReply = err instanceof AnalysisError
      ? { id, ok: false, analysisError: { message: err.message, fields: err.fields }, message: err.message }
      : { id, ok: false, message: err instanceof Error ? err.message : String(err) };
    parentPort!.postMessage(reply);
  }
});
