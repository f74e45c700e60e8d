/** The analysis panel: truth table, minimal SOP/POS, function names and the function map, computed in a worker. */
import { lazyNamed } from '../../lib/lazy-named';

// The panels and pages below are chunks of their own, loaded on first render (inside a Suspense boundary):
// the main script, which runs before a board's canvas draws, does not hold them.
export const AnalysisPanel = lazyNamed(() => import('./analysis-panel'), 'AnalysisPanel');
export { useAnalysis, logicKey, type Analysis, type AnalysisChoices, type AnalysisStatus } from './use-analysis';
