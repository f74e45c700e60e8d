import { lazyNamed } from '../../lib/lazy-named';

// The panels and pages below are chunks of their own, loaded on first render (inside a Suspense boundary):
// the main script, which runs before a board's canvas draws, does not hold them.
export { useLiveSim, type LiveSim, type LiveSimSession } from './use-live-sim';
export const BenchPanel = lazyNamed(() => import('./bench-panel'), 'BenchPanel');
export { PulseStyle } from './pulse-style';
export { TryOutChip } from './try-out-chip';
