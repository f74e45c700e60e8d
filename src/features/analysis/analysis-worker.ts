/// <reference lib="webworker" />
/**
 * The analysis worker: one analysis at a time; a newer request or a cancel aborts the running one
 * between table chunks.
 */
import { runAnalysis } from './run-analysis';
import type { FromWorker, ToWorker } from './protocol';

const scope = self as unknown as DedicatedWorkerGlobalScope;
let running: { id: number; ctl: AbortController } | null = null;

const post = (msg: FromWorker, transfer: Transferable[] = []) => scope.postMessage(msg, transfer);

scope.onmessage = (e: MessageEvent<ToWorker>) => {
  const msg = e.data;
  switch (msg.type) {
    case 'cancel':
      if (running?.id === msg.id) running.ctl.abort();
      return;
    case 'analyze': {
      running?.ctl.abort();
      const ctl = new AbortController();
      const job = { id: msg.id, ctl };
      running = job;
      runAnalysis(msg.request, { signal: ctl.signal, onProgress: (p) => post({ type: 'progress', id: msg.id, ...p }) })
        .then((result) => {
          if (ctl.signal.aborted) return;
          post({ type: 'result', id: msg.id, result }, result.values.map((v) => v.buffer as ArrayBuffer));
        })
        .catch((err: unknown) => {
          const cancelled = err instanceof Error && err.name === 'AbortError';
          post({ type: 'error', id: msg.id, message: err instanceof Error ? err.message : String(err), cancelled });
        })
        .finally(() => { if (running === job) running = null; });
      return;
    }
    default: {
      const never: never = msg;
      throw new Error(`unknown message ${JSON.stringify(never)}`);
    }
  }
};
