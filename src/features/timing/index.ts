/** The timing strip: recorded signals drawn as waveforms, with the trace helpers the bench records into. */
import { lazyNamed } from '../../lib/lazy-named';

// The panels and pages below are chunks of their own, loaded on first render (inside a Suspense boundary):
// the main script, which runs before a board's canvas draws, does not hold them.
export type { TimingStripProps } from './timing-strip';
export const TimingStrip = lazyNamed(() => import('./timing-strip'), 'TimingStrip');
export type { SignalChoice } from './signal-picker';
export { emptyTrace, pushChange, type Trace, type TraceSignal, type Change } from './trace';
export { defaultSignals, signalChoices, type SignalSource } from './signals';
