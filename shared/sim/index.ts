/**
 * Gatefold simulator — public API (pure TypeScript, no DOM or Node APIs).
 *
 * ```ts
 * const netlist = compileBoard(board);            // nets, drivers, readers, problems
 * const sim = new Simulator(netlist, { seed: 1 });
 * sim.setInput('a', true);
 * const report = sim.settle();                    // {settled, oscillating, conflicts, undrivenInputs, …}
 * report.powerOn;                                 // loop nets whose power-on level was chosen (option powerOn)
 * sim.outputValues();                             // { S: '1', C: '0' }
 * ```
 * See docs/decisions/002-simulation-model.md for the model (four values, delays, initial state and the
 * power-on resolution of gate loops).
 */
export { LEVELS, levelCode, codeLevel, encodeLevels, decodeLevels, type Level } from './levels';
export { clockHalfPeriod, DEFAULT_CLOCK_PERIOD_GATE_DELAYS } from './clock-period';
export type {
  PinRef, NetInfo, CompiledPart, NetProblem, Netlist, SettleReport, SimulatorOptions, SimStats, ChangeListener,
} from './types';
export { compileBoard, partPins, type CompileOptions } from './compile';
export { Simulator } from './simulator';
export { FAMILIES, familyOf, familyDelays, type FamilyData } from './families';
export { mulberry32 } from './bounce';
export { toVcd, vcdId, timescaleFor, type VcdSignal, type VcdSample, type VcdOptions } from './vcd';
export { toVerilog, type VerilogOptions } from './verilog';
export {
  LiveSimulation, LiveEngine, halfPeriod, packLevels, ClockDriver, MAX_RATE, MIN_RATE, TraceRecorder, structureKey,
  documentValue, inputSignature, partBadges,
  type LiveOptions, type Timers, type TraceBatch, type Badge, type BadgeTone, type LiveCommand, type LiveUpdate,
  type LivePort, type LiveReport, RoomRun, stateChanges, type RoomClock, type StateChange,
} from './live';
export { toHierarchicalVerilog } from './verilog-modules';
export { explainRow, explainInputs, explainRowCount, rowInputs, gateReason, partTitle, type ExplainStep, type Explanation, type ExplainOptions } from './explain';
