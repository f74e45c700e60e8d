export { TimingStrip, type TimingStripProps } from './timing-strip';
export type { SignalChoice } from './signal-picker';
export type { Trace, TraceSignal, Change } from './trace';
