import type { BoardFile, Part } from '../../board';
import { clockHalfPeriod } from '../clock-period';
import { compileBoard } from '../compile';
import { Simulator } from '../simulator';
import type { Netlist, SettleReport, SimulatorOptions } from '../types';
import { documentValue, labelKey, structureKey } from './board-diff';
import { ClockDriver, type Timers } from './clock-driver';

/**
 * Half a clock period for a compiled board: that of the first clock part among `driven` (default: every
 * clock part), else the default period of the board's slowest gate. Also the pause before an input change.
 */
export function halfPeriod(netlist: Netlist, driven?: ReadonlySet<string>): number {
  const slowest = Math.max(1, ...netlist.parts.map((p) => Math.max(p.rise, p.fall)));
  const clock = netlist.inputs.find((p) => p.part.kind === 'clock' && (!driven || driven.has(p.id)));
  return clockHalfPeriod(clock?.part.kind === 'clock' ? clock.part.period : undefined, slowest);
}

const EMPTY_REPORT: SettleReport = { settled: true, time: 0, events: 0, oscillating: [], conflicts: [], undrivenInputs: [], races: [], powerOn: [] };

/** Options of a live simulation. */
export interface LiveOptions {
  /** how gate loops power on (decision 002); default resolve */
  powerOn?: SimulatorOptions['powerOn'];
  /** ids of the input parts the clock drives; default every clock part of the board */
  clockInputs?: readonly string[];
  /** once a settle has not settled, the settles after later clock edges spend at most this many events (long clocked runs stay quick) */
  oscillatingBudget?: number;
  /** a new Simulator for the board, before its first settle */
  onCompile?: (netlist: Netlist, sim: Simulator) => void;
  /** after every settle */
  onSettle?: (report: SettleReport) => void;
  /** a rising edge of the clock inputs at simulator time `time` */
  onRisingEdge?: (time: number) => void;
}

/**
 * The live simulation of a board, the one set of clocking rules of the bench and the command line's
 * `simulate --clock`. It keeps one Simulator per circuit, recompiling only when the circuit itself changes
 * (a moved part or a flipped switch keeps every stored bit), holds private try-out values over the board's
 * own input values, and drives the clock inputs:
 * - an input change (a clock edge, a try-out) comes half a clock period after the last clock edge, or
 *   once the board has settled, whichever is later; the first edge after power-on comes at once;
 * - a cycle is a rising edge, a settle, a falling edge, a settle, then half a period held low;
 * - a driven input keeps its own value until the clock's first edge.
 * Time is injected (`Timers`): it only paces the running clock, never the simulated time.
 */
export class LiveSimulation {
  private key = '';
  private labels = '';
  private current = new Map<string, Part>();
  private tryOut = new Map<string, boolean>();
  /** the room's input values (its simulation record, room-run.ts), under the try-out and over the document's */
  private shared = new Map<string, boolean>();
  private applied = new Map<string, boolean>();
  /** input changes taken from the document (no record or try-out value over it) since the last power-on of the room's run */
  private fromDocument = new Map<string, boolean[]>();
  private driven = new Set<string>();
  private unsettled = false;
  private lastEdgeAt = -Infinity;
  netlist: Netlist | null = null;
  sim: Simulator | null = null;
  /** the report of the last settle */
  report: SettleReport = EMPTY_REPORT;
  /** nets whose power-on level the simulator chose since the last compile or reset (a real loop settles either way) */
  powerOn: string[] = [];
  half = 10;
  /** simulated time of the Simulators before the current one, each followed by a half period */
  elapsed = 0;
  readonly clock: ClockDriver;

  constructor(timers: Timers, private readonly opts: LiveOptions = {}, onHalfCycles?: (n: number) => void) {
    this.clock = new ClockDriver((n) => onHalfCycles?.(n), timers);
  }

  /** Takes the board (and new try-out values); returns true when it compiled a new Simulator. */
  load(board: BoardFile, tryOut?: Iterable<[string, boolean]>): boolean {
    if (tryOut) this.tryOut = new Map(tryOut);
    this.current = new Map(board.parts.map((p) => [p.id, p]));
    const key = structureKey(board);
    const labels = labelKey(board);
    if (key === this.key && this.sim && this.netlist) {
      if (labels === this.labels) {
        this.apply(true);
        return false;
      }
      // only names changed: same circuit, same Simulator (every stored bit kept), new signal names
      this.labels = labels;
      this.rename(this.netlist, compileBoard(board, { family: board.family }));
      this.opts.onCompile?.(this.netlist, this.sim);
      this.apply(true);
      return true;
    }
    this.key = key;
    this.labels = labels;
    this.compile(board);
    return true;
  }

  /**
   * Whether `partId` is one of the board's own parts (its top level), not a part inside a module instance
   * (path ids such as `rom/c3`): the board's inputs and outputs are its top level only (decision 004).
   */
  isTopLevel(partId: string): boolean {
    return this.current.has(partId);
  }

  /** Gives the running netlist the part and net names of `fresh`, a compile of the same circuit. */
  private rename(netlist: Netlist, fresh: Netlist): void {
    fresh.parts.forEach((p, i) => { netlist.parts[i].name = p.name; netlist.parts[i].part = p.part; });
    fresh.nets.forEach((n, i) => { netlist.nets[i].name = n.name; });
    netlist.problems.splice(0, netlist.problems.length, ...fresh.problems);
  }

  private compile(board: BoardFile): void {
    if (this.sim) this.elapsed += this.sim.time + this.half;
    const netlist = compileBoard(board, { family: board.family });
    const sim = new Simulator(netlist, { family: board.family, powerOn: this.opts.powerOn });
    this.netlist = netlist;
    this.sim = sim;
    this.powerOn = [];
    this.applied.clear();
    this.unsettled = false;
    this.clock.restart();
    this.lastEdgeAt = -Infinity;
    const ids = this.opts.clockInputs;
    this.driven = new Set(ids ?? netlist.inputs.filter((p) => p.kind === 'clock').map((p) => p.id));
    this.half = halfPeriod(netlist, this.driven);
    this.opts.onCompile?.(netlist, sim);
    this.apply(false);
    if (!this.applied.size) this.settle();
  }

  /**
   * Sets try-out values (several at once change together) on top of the board's own values, half a period
   * after the last change unless `gap` is false; returns whether an input changed (and the board settled).
   */
  setTryOut(values: Iterable<[string, boolean]>, gap = true): boolean {
    for (const [id, v] of values) this.tryOut.set(id, v);
    return this.apply(gap);
  }

  /**
   * The room's input values: `replace` starts over with exactly `values` (a reset of the room's run),
   * otherwise they are added. Applied half a period after the last change unless `gap` is false.
   */
  setShared(values: Iterable<[string, boolean]>, { replace = false, gap = true } = {}): boolean {
    if (replace) this.shared.clear();
    for (const [id, v] of values) this.shared.set(id, v);
    return this.apply(gap);
  }

  /** Power-on again as the room's run does at a reset: clock low and uncounted, `inputs`, stored state to power-on. */
  powerOnWith(inputs: Iterable<[string, boolean]>): void {
    if (!this.sim) return;
    this.fromDocument.clear();
    this.clock.restart();
    this.setShared(inputs, { replace: true, gap: false });
    this.resetState();
  }

  /** Forgets every try-out value. */
  clearTryOut(): void {
    this.tryOut.clear();
    this.apply(true);
  }

  /** Stored state back to power-on; input levels stay. */
  resetState(): void {
    if (!this.sim) return;
    this.sim.resetState();
    this.unsettled = false;
    this.settle();
    this.powerOn = this.report.powerOn;
  }

  /**
   * Power-on again with the tube heaters cold (Simulator option warmUp, `units` time units): every gate's
   * output sits high, then the simulated time runs on, inputs held, until the last heater is warm and the
   * logic has taken over — so the timing strip shows the indicators lit at switch-on going out.
   */
  warmUp(units: number): void {
    const sim = this.sim;
    if (!sim) return;
    sim.resetState({ warmUp: units });
    this.unsettled = false;
    this.settle();
    if (sim.warmUntil > sim.time) this.idle(sim.warmUntil - sim.time);
    this.settle();
    this.powerOn = this.report.powerOn;
  }

  /** One clock cycle (see the class): two edges, each settled, then half a period held. */
  cycle(): void {
    this.halfCycles(2);
    this.hold();
  }

  /** One step of the bench's clock: back low first if it is high, then one cycle. */
  step(): void {
    if (this.clock.phase) this.halfCycles(1);
    this.cycle();
  }

  /**
   * Runs `n` clock half-cycles. With `budgetMs` it stops early once that much wall time is spent (a board
   * that oscillates costs a whole event budget per edge), so a running clock slows down instead of blocking.
   */
  halfCycles(n: number, budgetMs = Infinity): void {
    const sim = this.sim;
    if (!sim) return;
    const start = this.clock.now();
    for (let i = 0; i < n && this.clock.now() - start < budgetMs; i++) {
      this.hold();
      this.lastEdgeAt = sim.time;
      this.clock.toggle();
      if (this.clock.phase) this.opts.onRisingEdge?.(sim.time);
      this.apply(false, this.unsettled ? this.opts.oscillatingBudget : undefined);
    }
  }

  /** Lets simulated time pass, inputs held, until half a period after the last clock edge. */
  private hold(): void {
    const sim = this.sim!;
    const target = this.lastEdgeAt + this.half;
    if (target > sim.time) this.idle(target - sim.time);
  }

  /**
   * Lets simulated time pass with the inputs held. The live simulation drives clock parts itself, so the
   * Simulator's own clocks stay still.
   */
  private idle(dt: number): void {
    this.sim!.runFor(dt, { clocks: false });
  }

  /** The value an input part gets now: driven by the clock, a try-out, or its own. */
  private inputValue(part: Part): boolean {
    if (this.driven.has(part.id) && this.clock.cycles > 0) return this.clock.phase;
    if (part.kind === 'clock') return false;
    if (part.kind === 'const') return part.value === 1;
    return this.tryOut.get(part.id) ?? this.shared.get(part.id) ?? documentValue(part) ?? false;
  }

  /** Whether an input part's value now is the document's own (no clock, try-out or room value over it). */
  private fromDoc(part: Part): boolean {
    return documentValue(part) !== undefined && !this.driven.has(part.id) && !this.tryOut.has(part.id) && !this.shared.has(part.id);
  }

  /**
   * The input changes this simulation took straight from the document since the room's run last powered
   * on, per part in order (at most the last 64 each): an editor's change reaches a screen as a document
   * edit and as an entry of the room's record, in either order; when the record comes second and makes
   * the screen replay (RoomRun), these say which of its entries the screen has already shown.
   */
  documentChanges(): ReadonlyMap<string, readonly boolean[]> {
    return this.fromDocument;
  }

  /**
   * Sets every input whose value differs from what the simulator has, then settles (after a pause with
   * `gap`, spending at most `eventBudget` events when given).
   */
  private apply(gap: boolean, eventBudget?: number): boolean {
    const sim = this.sim;
    if (!sim || !this.netlist) return false;
    const changes: [Part, boolean][] = [];
    for (const input of this.netlist.inputs) {
      const part = this.current.get(input.id) ?? input.part;
      const value = this.inputValue(part);
      if (this.applied.get(part.id) !== value) changes.push([part, value]);
    }
    if (!changes.length) return false;
    if (gap) this.idle(this.half);
    for (const [part, value] of changes) {
      const id = part.id;
      if (this.applied.has(id) && this.fromDoc(part)) {
        const seen = this.fromDocument.get(id) ?? [];
        seen.push(value);
        if (seen.length > 64) seen.shift();
        this.fromDocument.set(id, seen);
      }
      sim.setInput(id, value);
      this.applied.set(id, value);
    }
    this.settle(eventBudget);
    return true;
  }

  /** Settles with the inputs as they are (a board that oscillates runs on); the report is also kept in `report`. */
  settle(eventBudget?: number): SettleReport {
    this.report = this.sim!.settle({ eventBudget });
    if (!this.report.settled) this.unsettled = true;
    if (this.report.powerOn.length) this.powerOn = this.report.powerOn;
    this.opts.onSettle?.(this.report);
    return this.report;
  }
}
