export { useLiveSim, type LiveSim, type LiveSimSession } from './use-live-sim';
export { BenchPanel } from './bench-panel';
export { PulseStyle } from './pulse-style';
export { TryOutChip } from './try-out-chip';
