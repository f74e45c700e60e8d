/**
 * The one analysis pipeline, behind the panel's worker, `POST /api/analyze` and `analyze` on the command
 * line: resolve the inputs and outputs, enumerate the truth table, apply the don't-cares (one rule,
 * `dont-cares.ts`), minimal forms per output, the function map. It is written as steps (a generator) so
 * that the same code runs straight through (`runAnalysisSync`) or yielding between chunks with progress
 * and cancellation (`runAnalysis`).
 */
import type { Netlist } from '../sim';
import { dontCareSets, type DontCares } from './dont-cares';
import { minimalForms, unknownForms, type OutputForms, type OutputTerms } from './forms';
import { functionMap, functionRows, type FunctionMapEntry } from './function-map';
import type { MinimiseOptions } from './minimise';
import { resolveSpec } from './table-spec';
import { enumerateChunks, type EnumerateOptions, type TableProgress, type TruthTable } from './truth-table';

/** What to analyse; every field optional (defaults as CONTRACTS §2). */
export interface AnalyzeRequest {
  /** input labels (or ids), first most significant; default the switches and buttons in file order */
  inputs?: string[];
  /** output labels (or ids); default the lamps and probes in file order */
  outputs?: string[];
  /** select inputs of the function map */
  select?: string[];
  /** rows (indices into the table) marked don't-care: for every output, or per output label */
  dontCares?: DontCares;
  minimise?: MinimiseOptions;
  /**
   * Choices of inputs, outputs and select inputs that are not on the board (or, for select, not among the
   * analysed inputs) are left out instead of refused — for the live panel, whose choices outlive edits.
   * Don't-cares are checked all the same.
   */
  lenientChoices?: boolean;
}

/** Everything the pipeline computes. */
export interface AnalysisRun {
  netlist: Netlist;
  table: TruthTable;
  dontCares: Record<string, Set<number>>;
  forms: Record<string, OutputForms>;
  terms: Record<string, OutputTerms>;
  functionMap: FunctionMapEntry[];
}

/** A step of the pipeline: a chunk of the table done, or one output's minimal forms done. */
export type AnalysisStep = ({ phase: 'table' } & TableProgress) | { phase: 'forms'; output: string };

/** Progress and cancellation of a yielding run. */
export interface AnalysisHooks {
  /** after each chunk of the truth table */
  onProgress?: (p: TableProgress) => void;
  /** asked between steps; true stops the run with an Error named `AbortError` */
  shouldCancel?: () => boolean;
  /** enumeration options (chunk size, event simulator only) */
  enumerate?: EnumerateOptions;
}

function lenient(names: string[] | undefined, list: { name: string; id: string }[]): string[] | undefined {
  return names?.filter((n) => list.some((p) => p.name === n || p.id === n));
}

/** The pipeline as steps; returns the run. Throws AnalysisError for a bad request. */
export function* analysisSteps(netlist: Netlist, req: AnalyzeRequest = {}, opts: EnumerateOptions = {}): Generator<AnalysisStep, AnalysisRun> {
  const choose = req.lenientChoices ? lenient : (names: string[] | undefined) => names;
  const spec = resolveSpec(netlist, choose(req.inputs, netlist.inputs), choose(req.outputs, netlist.outputs));
  const chunks = enumerateChunks(netlist, spec, opts);
  let step = chunks.next();
  for (; !step.done; step = chunks.next()) yield { phase: 'table', ...step.value };
  const table = step.value;
  return { netlist, ...(yield* tableAnalysisSteps(table, req)) };
}

/** The steps after the table: don't-cares, minimal forms per output, the function map. */
export function* tableAnalysisSteps(table: TruthTable, req: AnalyzeRequest = {}): Generator<AnalysisStep, Omit<AnalysisRun, 'netlist'>> {
  const dontCares = dontCareSets(table, req.dontCares);
  const forms: Record<string, OutputForms> = {};
  const terms: Record<string, OutputTerms> = {};
  for (let o = 0; o < table.outputs.length; o++) {
    const name = table.outputs[o];
    // X or Z in every row: every row would be a don't-care and any form "minimal" — say unknown instead
    const f = table.values[o].every((v) => v >= 2) ? unknownForms() : minimalForms(table.inputs, functionRows(table, o, dontCares[name]), req.minimise);
    forms[name] = f.forms;
    terms[name] = f.terms;
    // a big table's forms take a while per output: a yielding run may cancel in between
    yield { phase: 'forms', output: name };
  }
  const select = req.lenientChoices ? req.select?.filter((s) => table.inputs.includes(s)) : req.select;
  return { table, dontCares, forms, terms, functionMap: select?.length ? functionMap(table, select, dontCares) : [] };
}

/** Drains a generator of steps and returns its result. */
export function finish<T>(steps: Generator<AnalysisStep, T>): T {
  for (;;) {
    const step = steps.next();
    if (step.done) return step.value;
  }
}

/** Runs the pipeline straight through. */
export function runAnalysisSync(netlist: Netlist, req: AnalyzeRequest = {}, opts: EnumerateOptions = {}): AnalysisRun {
  return finish(analysisSteps(netlist, req, opts));
}

/**
 * Runs the pipeline yielding to the event loop between steps (so a worker hears its cancel message),
 * reporting the table's progress. Rejects with an AbortError-named Error once `shouldCancel` says so.
 */
export async function runAnalysis(netlist: Netlist, req: AnalyzeRequest = {}, hooks: AnalysisHooks = {}): Promise<AnalysisRun> {
  const steps = analysisSteps(netlist, req, hooks.enumerate);
  for (;;) {
    if (hooks.shouldCancel?.()) {
      const e = new Error('analysis cancelled');
      e.name = 'AbortError';
      throw e;
    }
    const step = steps.next();
    if (step.done) return step.value;
    if (step.value.phase === 'table') hooks.onProgress?.({ done: step.value.done, total: step.value.total });
    await new Promise((resolve) => setTimeout(resolve, 0));
  }
}
