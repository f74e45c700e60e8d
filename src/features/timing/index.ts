/** The timing strip: recorded signals drawn as waveforms, with the trace helpers the bench records into. */
export { TimingStrip, type TimingStripProps } from './timing-strip';
export type { SignalChoice } from './signal-picker';
export { emptyTrace, pushChange, type Trace, type TraceSignal, type Change } from './trace';
export { defaultSignals, signalChoices, type SignalSource } from './signals';
