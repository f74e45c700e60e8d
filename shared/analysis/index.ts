/**
 * Gatefold analysis — truth tables, minimal expressions, function names, the function map.
 *
 * ```ts
 * const result = analyzeBoardFile(json, { select: ['S1', 'S0'] }); // the `analyze` JSON of CONTRACTS §2
 * const run = await runAnalysis(compileBoard(board), { dontCares: { Y: [3] } }, { onProgress, shouldCancel });
 * const table = enumerateTable(compileBoard(board), resolveSpec(netlist));  // or enumerateChunks / …Async
 * const { forms } = minimalForms(['A', 'B'], Uint8Array.of(0, 1, 1, 0));  // forms.sop === 'A & ~B | ~A & B'
 * ```
 */
export { analyzeBoard, analyzeBoardFile, analyzeJson, analyzeTable, type AnalyzeResult, type OutputInfo } from './analyze';
export {
  analysisSteps, finish, runAnalysis, runAnalysisSync, tableAnalysisSteps,
  type AnalysisHooks, type AnalysisRun, type AnalysisStep, type AnalyzeRequest,
} from './pipeline';
export { dontCareSets, parseRowList, type DontCares } from './dont-cares';
export { AnalysisError, MAX_TABLE_INPUTS, resolveSpec, type TableSpec } from './table-spec';
export { CODE_CHARS, enumerateChunks, enumerateTable, enumerateTableAsync, type EnumerateOptions, type TableProgress, type TruthTable } from './truth-table';
export { functionMap, functionRows, type FunctionMapEntry, type MappedFunction } from './function-map';
export { minimalForms, readableForms, MAX_FORMATTED_TERMS, type OutputForms, type OutputTerms } from './forms';
export { EXACT_INPUT_LIMIT, minimiseOnes, minimiseZeros, coverCost, type FunctionRows, type MinimalCovers, type MinimiseOptions } from './minimise';
export { formatPos, formatSop, readablePos, readableSop, type Literal, type ReadableStyle, type Term } from './expression';
export { evaluate, expressionColumn, parseExpression, type Expr } from './expression-parse';
export { FUNCTION_IDS, FUNCTION_TITLES, columnOfFunction, functionIdOfColumn, type FunctionId } from './function-names';
export { fanInCone, levelise, isCombinational, type Levelised } from './levelise';
export { BitParallelEvaluator } from './bit-parallel';
export { coversRow, type Cube } from './cube';
