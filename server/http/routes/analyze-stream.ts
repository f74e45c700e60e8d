import type { Response } from 'express';
import { rowOf, type PendingAnalysis } from '../../services/analysis-table';

/** Rows per write: about 40 kB of JSON for a 20-input, 2-output table. */
const ROWS_PER_CHUNK = 1024;

/** Resolves when the socket wants more, false when the client is gone. */
function drained(res: Response): Promise<boolean> {
  return new Promise((resolve) => {
    const done = (ok: boolean) => {
      res.off('drain', onDrain);
      res.off('close', onClose);
      resolve(ok);
    };
    const onDrain = () => done(true);
    const onClose = () => done(false);
    res.on('drain', onDrain);
    res.on('close', onClose);
  });
}

/**
 * Writes the `analyze` JSON (CONTRACTS §2, the same document `res.json` would send) with its rows
 * spelled a chunk at a time, waiting for the socket to drain between chunks (backpressure), so a
 * million-row table never becomes one 40 MB string and a slow reader does not fill the memory.
 */
export async function streamAnalysis(res: Response, p: PendingAnalysis): Promise<void> {
  res.status(200).type('application/json');
  const head = JSON.stringify({ inputs: p.inputs, outputs: p.outputs, sequential: p.sequential });
  const tail = JSON.stringify({ outputsInfo: p.outputsInfo, functionMap: p.functionMap });
  let ok = res.write(`${head.slice(0, -1)},"rows":[`);
  for (let start = 0; start < p.rowCount; start += ROWS_PER_CHUNK) {
    if (!ok && !(await drained(res))) return;
    if (res.destroyed) return;
    const parts: string[] = [];
    const end = Math.min(p.rowCount, start + ROWS_PER_CHUNK);
    for (let r = start; r < end; r++) parts.push(JSON.stringify(rowOf(p, r)));
    ok = res.write(`${start ? ',' : ''}${parts.join(',')}`);
  }
  if (!ok && !(await drained(res))) return;
  res.end(`],${tail.slice(1)}`);
}
