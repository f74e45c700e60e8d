import { parentPort, workerData } from 'node:worker_threads';
import { AnalysisError, type AnalyzeRequest } from '../../shared/analysis';
import type { BoardFile } from '../../shared/board';
import { analyzePending } from './analysis-table';

/** A large analysis off the request thread: `workerData` in, one message out (the table's bytes transferred). */
export type WorkerReply =
  | { ok: true; result: import('./analysis-table').PendingAnalysis }
  | { ok: false; analysisError?: { message: string; fields: Record<string, string> }; message: string };

const { board, req } = workerData as { board: BoardFile; req: AnalyzeRequest; entry: string };
let reply: WorkerReply;
try {
  const result = analyzePending(board, req);
  reply = { ok: true, result };
  parentPort!.postMessage(reply, [...new Set(result.values.map((v) => v.buffer as ArrayBuffer))]);
} catch (err) {
  reply = err instanceof AnalysisError
    ? { ok: false, analysisError: { message: err.message, fields: err.fields }, message: err.message }
    : { ok: false, message: err instanceof Error ? err.message : String(err) };
  parentPort!.postMessage(reply);
}
