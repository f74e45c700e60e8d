import {
  AnalysisError, MAX_TABLE_INPUTS, enumerateTableAsync, fanInCone, functionMap, functionRows, minimalForms, resolveSpec,
  type OutputForms, type OutputTerms, type TableProgress,
} from '../../../shared/analysis';
import { compileBoard } from '../../../shared/sim';
import type { AnalysisRequest, AnalysisResult } from './protocol';

/**
 * One analysis for the panel: the truth table (bit-parallel, chunked, cancellable), minimal forms per
 * output with the user's don't-cares, the function map and the fan-in cones. Runs in the worker.
 */
export async function runAnalysis(req: AnalysisRequest, opts: { onProgress?: (p: TableProgress) => void; signal?: AbortSignal } = {}): Promise<AnalysisResult> {
  const started = performance.now();
  const netlist = compileBoard(req.board);
  const availableInputs = netlist.inputs.map((p) => ({ name: p.name, partId: p.id, kind: p.kind }));
  const availableOutputs = netlist.outputs.map((p) => ({ name: p.name, partId: p.id, kind: p.kind }));
  // choices that no longer exist on the board (deleted parts) are dropped, not errors
  const keep = (names: string[] | undefined, list: { name: string }[]) => names?.filter((n) => list.some((p) => p.name === n));
  const inputs = keep(req.inputs, availableInputs);
  const outputs = keep(req.outputs, availableOutputs);
  if ((inputs?.length ?? 0) > MAX_TABLE_INPUTS) throw new AnalysisError(`choose at most ${MAX_TABLE_INPUTS} inputs`);
  const spec = resolveSpec(netlist, inputs, outputs);
  const table = await enumerateTableAsync(netlist, spec, { onProgress: opts.onProgress, signal: opts.signal });
  const forms: Record<string, OutputForms> = {};
  const terms: Record<string, OutputTerms> = {};
  const dcs: Record<string, Set<number>> = {};
  for (let o = 0; o < table.outputs.length; o++) {
    // a big table's forms take a while per output: let a cancel in between
    await new Promise((resolve) => setTimeout(resolve, 0));
    if (opts.signal?.aborted) { const e = new Error('analysis cancelled'); e.name = 'AbortError'; throw e; }
    const name = table.outputs[o];
    dcs[name] = new Set((req.dontCares[name] ?? []).filter((r) => r < table.rowCount));
    const f = minimalForms(table.inputs, functionRows(table, o, dcs[name]));
    forms[name] = f.forms;
    terms[name] = f.terms;
  }
  const select = req.select.filter((s) => table.inputs.includes(s));
  const cones: Record<string, string[]> = {};
  for (const p of netlist.outputs) cones[p.name] = [...fanInCone(netlist, [p.id])];
  return {
    inputs: table.inputs, outputs: table.outputs, rowCount: table.rowCount, values: table.values,
    sequential: table.sequential, method: table.method, forms, terms,
    functionMap: select.length ? functionMap(table, select, dcs) : [],
    availableInputs, availableOutputs, cones, ms: performance.now() - started,
  };
}
