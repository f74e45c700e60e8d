/** The analysis panel: truth table, minimal SOP/POS, function names and the function map, computed in a worker. */
export { AnalysisPanel } from './analysis-panel';
export { useAnalysis, logicKey, type Analysis, type AnalysisChoices, type AnalysisStatus } from './use-analysis';
