import { isOutputKind, type BoardFile, type Part } from '../../../shared/board';
import { compileBoard, DEFAULT_CLOCK_PERIOD_GATE_DELAYS, Simulator } from '../../../shared/sim';
import { familyOf } from '../../../shared/sim/families';
import type { Level } from '../../../shared/sim/levels';
import type { Netlist, SettleReport } from '../../../shared/sim/types';
import { partBadges } from './badges';
import { documentValue, structureKey } from './board-diff';
import { ClockDriver, type Timers } from './clock-driver';
import { levelCode, type FromWorker, type PortInfo, type ToWorker } from './protocol';
import { TraceRecorder } from './trace-recorder';

/**
 * Half a clock period in time units, as the Simulator computes it for a clock part: the first clock's
 * `period`, else DEFAULT_CLOCK_PERIOD_GATE_DELAYS slowest gate delays. Also the pause before an input change.
 */
export function halfPeriod(netlist: Netlist): number {
  const slowest = Math.max(1, ...netlist.parts.map((p) => Math.max(p.rise, p.fall)));
  const clock = netlist.inputs.find((p) => p.part.kind === 'clock');
  const period = clock?.part.kind === 'clock' && clock.part.period ? clock.part.period : DEFAULT_CLOCK_PERIOD_GATE_DELAYS * slowest;
  return Math.max(1, Math.round(period / 2));
}

/**
 * Level codes of every pin in the order of the `compiled.keys` (each part's input pins, then its output
 * pins) — what `encodeLevels(keys, sim.levels())` gives, read straight from the nets: that map of
 * strings cost ~50 ms a state for 5000 gates. As Simulator.pinLevel: an input pin on an undriven net
 * reads the family's floating value, except on lamps and probes, which show the net (Z).
 */
export function packLevels(netlist: Netlist, sim: Simulator): Uint8Array {
  const out = new Uint8Array(netlist.parts.reduce((n, p) => n + p.inputs.length + p.outputs.length, 0));
  const floating = levelCode(sim.floating);
  const z = levelCode('Z');
  let k = 0;
  for (const p of netlist.parts) {
    const reads = !isOutputKind(p.kind);
    for (const net of p.inputs) {
      const c = levelCode(sim.level(net));
      out[k++] = reads && c === z ? floating : c;
    }
    for (const net of p.outputs) out[k++] = levelCode(sim.level(net));
  }
  return out;
}

/** Wall time one clock tick may spend simulating. */
const RUN_BUDGET_MS = 40;

const EMPTY_REPORT: SettleReport = { settled: true, time: 0, events: 0, oscillating: [], conflicts: [], undrivenInputs: [], races: [], powerOn: [] };

/**
 * The simulation side of the bench, free of worker plumbing so tests can drive it directly: it keeps
 * one Simulator for the board, recompiles only when the circuit itself changes (a moved part or a
 * flipped switch keeps every stored bit), drives the clock, and records chosen nets for the timing strip.
 */
export class BenchEngine {
  private key = '';
  private board: BoardFile | null = null;
  private current = new Map<string, Part>();
  private netlist: Netlist | null = null;
  private sim: Simulator | null = null;
  private tryOut = new Map<string, boolean>();
  private applied = new Map<string, boolean>();
  private report: SettleReport = EMPTY_REPORT;
  /** nets whose power-on level the simulator chose since the last compile or reset (a real loop settles either way) */
  private powerOn: string[] = [];
  private half = 10;
  private lastEdgeAt = 0;
  private readonly recorder = new TraceRecorder();
  private unsubscribe: (() => void) | undefined;
  readonly clock: ClockDriver;

  constructor(private readonly post: (msg: FromWorker, transfer?: Transferable[]) => void, timers?: Timers) {
    this.clock = new ClockDriver((n) => {
      this.halfCycles(n, RUN_BUDGET_MS);
      this.flush();
    }, timers);
  }

  handle(msg: ToWorker): void {
    try {
      this.dispatch(msg);
    } catch (err) {
      this.post({ type: 'error', message: (err as Error).message });
    }
  }

  private dispatch(msg: ToWorker): void {
    switch (msg.type) {
      case 'load':
        this.tryOut = new Map(msg.tryOut);
        this.load(msg.board);
        break;
      case 'set-input':
        this.tryOut.set(msg.partId, msg.value);
        this.apply(true);
        break;
      case 'clear-try-out':
        this.tryOut.clear();
        this.apply(true);
        break;
      case 'clock':
        if (msg.action === 'run') this.clock.run();
        else if (msg.action === 'pause') this.clock.pause();
        else this.halfCycles(this.clock.phase ? 3 : 2);
        break;
      case 'rate':
        this.clock.setRate(msg.hz);
        break;
      case 'reset-state':
        if (this.sim) {
          this.sim.resetState();
          this.report = this.sim.settle();
          this.powerOn = this.report.powerOn;
        }
        break;
      case 'clear-trace':
        if (this.sim && this.netlist) this.recorder.clear(this.netlist, this.sim.time, (net) => this.sim!.level(net));
        break;
      case 'subscribe':
        this.recorder.subscribe(msg.signals);
        if (this.sim && this.netlist) this.recorder.attach(this.netlist, this.sim.time, (net) => this.sim!.level(net));
        break;
      default: {
        const never: never = msg;
        throw new Error(`unknown message ${JSON.stringify(never)}`);
      }
    }
    this.flush();
  }

  private load(board: BoardFile): void {
    this.board = board;
    this.current = new Map(board.parts.map((p) => [p.id, p]));
    const key = structureKey(board);
    if (key === this.key && this.sim) {
      this.apply(true);
      return;
    }
    this.key = key;
    this.compile(board);
  }

  private compile(board: BoardFile): void {
    this.unsubscribe?.();
    if (this.sim) this.recorder.base += this.sim.time + this.half;
    this.sim = null;
    const netlist = compileBoard(board, { family: board.family });
    const sim = new Simulator(netlist, { family: board.family });
    this.netlist = netlist;
    this.sim = sim;
    this.powerOn = [];
    this.applied.clear();
    this.clock.restart();
    this.lastEdgeAt = 0;
    this.half = halfPeriod(netlist);
    const port = (p: Netlist['parts'][number], pin: string): PortInfo => ({ partId: p.id, label: p.name, kind: p.kind, net: netlist.nets[netlist.netOf(p.id, pin)].name });
    const family = familyOf(board.family);
    this.post({
      type: 'compiled',
      // the order of packLevels
      keys: netlist.parts.flatMap((p) => [...p.inputPins, ...p.outputPins].map((pin) => `${p.id}.${pin}`)),
      inputs: netlist.inputs.map((p) => port(p, 'out')),
      outputs: netlist.outputs.map((p) => port(p, 'in')),
      nets: netlist.nets.map((n) => n.name),
      family: family.id,
      timeUnitNs: family.timeUnitNs,
      problems: netlist.problems.map((p) => p.message),
    });
    this.apply(false);
    if (!this.applied.size) this.report = sim.settle();
    if (this.report.powerOn.length) this.powerOn = this.report.powerOn;
    this.unsubscribe = sim.onChange((time, net, level) => this.recorder.record(time, net, level));
    this.recorder.attach(netlist, sim.time, (net) => sim.level(net));
  }

  /** Sets every input whose value differs from what the simulator has, then settles. */
  private apply(gap: boolean): void {
    const sim = this.sim;
    if (!sim || !this.netlist) return;
    const changes: [string, boolean][] = [];
    for (const input of this.netlist.inputs) {
      const part = this.current.get(input.id) ?? input.part;
      let value: boolean;
      if (part.kind === 'clock') value = this.clock.phase;
      else if (part.kind === 'const') value = part.value === 1;
      else value = this.tryOut.get(part.id) ?? documentValue(part) ?? false;
      if (this.applied.get(part.id) !== value) changes.push([part.id, value]);
    }
    if (!changes.length) return;
    if (gap) this.idle(this.half);
    for (const [id, value] of changes) {
      sim.setInput(id, value);
      this.applied.set(id, value);
    }
    this.report = sim.settle();
    if (this.report.powerOn.length) this.powerOn = this.report.powerOn;
  }

  /**
   * Runs `n` clock half-cycles; each edge comes half a period after the last one (or after settling).
   * With `budgetMs` it stops early once that much wall time is spent (a board that oscillates costs a
   * whole event budget per edge), so a running clock slows down instead of blocking the worker.
   */
  private halfCycles(n: number, budgetMs = Infinity): void {
    const sim = this.sim;
    if (!sim) return;
    const start = this.clock.now();
    for (let i = 0; i < n && this.clock.now() - start < budgetMs; i++) {
      const target = Math.max(sim.time, this.lastEdgeAt + this.half);
      if (target > sim.time) this.idle(target - sim.time);
      this.lastEdgeAt = sim.time;
      this.clock.toggle();
      if (this.clock.phase) this.recorder.edge(sim.time);
      this.apply(false);
    }
  }

  /**
   * Lets simulated time pass with the inputs held. The Simulator's runFor would also toggle clock parts
   * on their own period; the bench drives clocks itself (run, pause, step), so it re-sets each clock to
   * its level first, which restarts that clock's half period, and never runs a whole half period.
   */
  private idle(dt: number): void {
    const sim = this.sim!;
    const clocks = this.netlist!.inputs.filter((p) => p.kind === 'clock');
    for (const c of clocks) sim.setInput(c.id, this.applied.get(c.id) ?? false);
    const span = clocks.length ? Math.min(dt, this.half - 1) : dt;
    if (span > 0) sim.runFor(span);
  }

  /** Posts the current state (levels, report, badges, values, new trace) to the page. */
  flush(): void {
    const sim = this.sim;
    const netlist = this.netlist;
    if (!sim || !netlist || !this.board) return;
    const levels = packLevels(netlist, sim);
    const values: Record<string, Level> = {};
    for (const p of netlist.inputs) values[p.id] = sim.pinLevel(p.id, 'out');
    for (const p of netlist.outputs) values[p.id] = sim.pinLevel(p.id, 'in');
    const oscillating = new Set(this.report.oscillating);
    const pulsing = netlist.nets.filter((n) => oscillating.has(n.name)).flatMap((n) => [...n.drivers, ...n.readers].map((r) => `${r.part}.${r.pin}`));
    const badges = [...partBadges(netlist, this.report, familyOf(this.board.family))].map(([id, b]) => [id, b.tone, b.text] as [string, typeof b.tone, string]);
    const { settled, oscillating: osc, conflicts, undrivenInputs, races } = this.report;
    this.post(
      {
        type: 'state',
        levels,
        report: { settled, oscillating: osc, conflicts, undrivenInputs, races, powerOn: this.powerOn },
        values,
        time: this.recorder.base + sim.time,
        events: sim.stats.events,
        lastEvents: this.report.events,
        clock: { running: this.clock.running, rate: this.clock.rate, cycles: this.clock.cycles },
        badges,
        pulsing,
        ...this.recorder.take(),
      },
      [levels.buffer],
    );
  }

  dispose(): void {
    this.clock.pause();
    this.unsubscribe?.();
  }
}
