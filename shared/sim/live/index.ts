/**
 * The live simulation: a board simulated as it is edited, clocked, tried out and recorded — plain
 * TypeScript with time injected. The bench's web worker and the command line's `simulate` both drive it.
 *
 * ```ts
 * const live = new LiveSimulation(timers, { clockInputs: ['clk'] });
 * live.load(board);                      // compile, power on, settle
 * live.setTryOut([['a', true]]);         // a private input value, half a period later
 * live.cycle();                          // rising edge, settle, falling edge, settle, half a period low
 * live.sim!.outputValues();
 *
 * const engine = new LiveEngine(postMessage, timers);  // the same in messages (LiveCommand → LiveUpdate)
 * engine.handle({ type: 'clock', action: 'step' });
 * ```
 */
export { LiveSimulation, halfPeriod, type LiveOptions } from './live-simulation';
export { LiveEngine, packLevels } from './live-engine';
export { ClockDriver, MAX_RATE, MIN_RATE, type Timers } from './clock-driver';
export { TraceRecorder, type TraceBatch } from './trace-recorder';
export { structureKey, documentValue, inputSignature } from './board-diff';
export { partBadges, type Badge, type BadgeTone } from './badges';
export type { LiveCommand, LiveUpdate, LivePort, LiveReport } from './messages';
export { RoomRun, type RoomClock } from './room-run';
export { stateChanges, type StateChange } from './state-changes';
