import { fanInCone, runAnalysis as runPipeline, type TableProgress } from '../../../shared/analysis';
import { compileBoard } from '../../../shared/sim';
import type { AnalysisRequest, AnalysisResult } from './protocol';

/**
 * One analysis for the panel, run in the worker: the shared pipeline (truth table in chunks, the
 * user's don't-cares under the one rule, minimal forms, function map), cancellable between steps, plus
 * what only the panel shows — the choosable inputs and outputs and the fan-in cones. Choices of parts
 * that are gone from the board are left out; a bad don't-care rejects with the pipeline's AnalysisError.
 */
export async function runAnalysis(req: AnalysisRequest, opts: { onProgress?: (p: TableProgress) => void; signal?: AbortSignal } = {}): Promise<AnalysisResult> {
  const started = performance.now();
  const netlist = compileBoard(req.board);
  const availableInputs = netlist.inputs.map((p) => ({ name: p.name, partId: p.id, kind: p.kind }));
  const availableOutputs = netlist.outputs.map((p) => ({ name: p.name, partId: p.id, kind: p.kind }));
  const { table, forms, terms, functionMap } = await runPipeline(
    netlist,
    { inputs: req.inputs, outputs: req.outputs, select: req.select, dontCares: req.dontCares, lenientChoices: true },
    { onProgress: opts.onProgress, shouldCancel: () => opts.signal?.aborted === true },
  );
  const cones: Record<string, string[]> = {};
  for (const p of netlist.outputs) cones[p.name] = [...fanInCone(netlist, [p.id])];
  return {
    inputs: table.inputs, outputs: table.outputs, rowCount: table.rowCount, values: table.values,
    sequential: table.sequential, method: table.method, ...(table.kernel ? { kernel: table.kernel } : {}), forms, terms, functionMap,
    availableInputs, availableOutputs, cones, ms: performance.now() - started,
  };
}
