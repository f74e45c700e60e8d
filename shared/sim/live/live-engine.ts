import { isOutputKind } from '../../board';
import { familyOf } from '../families';
import { levelCode, type Level } from '../levels';
import type { Simulator } from '../simulator';
import type { Netlist } from '../types';
import { partBadges } from './badges';
import type { Timers } from './clock-driver';
import { LiveSimulation, type LiveOptions } from './live-simulation';
import type { LivePort, LiveCommand, LiveUpdate } from './messages';
import { TraceRecorder } from './trace-recorder';
import { RoomRun } from './room-run';
import { stateChanges, type StateChange } from './state-changes';
import type { SimLogEntry } from '../../board';

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
/** How often the screen driving the room's clock hands its due cycles to the record. */
const DUE_EVERY_MS = 250;

/**
 * A live simulation spoken to in messages (`LiveCommand` in, `LiveUpdate` out) — what the bench's worker
 * runs, free of worker plumbing so tests can drive it directly. On top of LiveSimulation it records chosen
 * nets for the timing strip and sends the state (levels, report, badges) after every command.
 */
export class LiveEngine {
  private readonly recorder = new TraceRecorder();
  private unsubscribe: (() => void) | undefined;
  readonly live: LiveSimulation;
  readonly room: RoomRun;
  /** this screen's document client id once it joined the room's run */
  private me: number | null = null;
  private following = true;
  private entries: readonly SimLogEntry[] = [];
  private dueHalves = 0;
  private dueAt = 0;
  /** what the last structural edit did to stored state */
  private changes: StateChange[] = [];
  /** the LiveSimulation's `elapsed` when the recorder last took it */
  private elapsedSeen = 0;

  constructor(private readonly post: (msg: LiveUpdate, transfer?: Transferable[]) => void, timers: Timers, opts: Omit<LiveOptions, 'onCompile' | 'onRisingEdge'> = {}) {
    this.live = new LiveSimulation(timers, {
      ...opts,
      onCompile: (netlist) => this.compiled(netlist),
      onRisingEdge: (time) => this.recorder.edge(time),
    }, (n) => {
      if (this.inRoom) return this.owe(n);
      this.live.halfCycles(n, RUN_BUDGET_MS);
      this.flush();
    });
    this.room = new RoomRun(this.live, { quietly: (replay) => this.quietly(replay) });
  }

  /**
   * Runs a replay of the room's record off the timing strip. A replay recomputes the state the strip
   * already shows (a new circuit after an edit, inside a module or not; the record's first entries; entries
   * reordered; back from a try-out), from power-on: recording it would show every input change and clock
   * edge of the record a second time. Afterwards the strip goes on at the time it had and records each
   * signal's level now, so only what the replay changed shows, as one step.
   */
  private quietly(replay: () => void): void {
    const at = this.recorder.base + (this.live.sim?.time ?? 0);
    this.recorder.muted = true;
    try {
      replay();
    } finally {
      this.recorder.muted = false;
    }
    const { sim, netlist } = this.live;
    if (!sim || !netlist) return;
    this.recorder.base = at - sim.time;
    this.recorder.attach(netlist, sim.time, (net) => sim.level(net));
  }

  /** Following the room's run (not in a private try-out of the clock). */
  private get inRoom(): boolean {
    return this.me !== null && this.following;
  }

  /** The room's clock runs on this screen: gather due half-cycles and hand whole cycles to the page now and then. */
  private owe(halves: number): void {
    this.dueHalves += halves;
    const now = this.live.clock.now();
    const cycles = Math.floor(this.dueHalves / 2);
    if (cycles < 1 || now - this.dueAt < DUE_EVERY_MS) return;
    this.dueAt = now;
    this.dueHalves -= 2 * cycles;
    this.post({ type: 'due', cycles });
  }

  /** Runs the local clock driver exactly when this screen drives the room's running clock. */
  private drive(): void {
    if (!this.inRoom) return;
    const { running, driver, rate } = this.room.clock;
    const clock = this.live.clock;
    if (running && driver === this.me) {
      if (clock.rate !== rate) clock.setRate(rate);
      if (!clock.running) {
        this.dueHalves = 0;
        this.dueAt = clock.now();
        clock.run();
      }
    } else if (clock.running) clock.pause();
  }

  handle(msg: LiveCommand): void {
    try {
      this.dispatch(msg);
    } catch (err) {
      this.post({ type: 'error', message: (err as Error).message });
    }
  }

  private dispatch(msg: LiveCommand): void {
    const live = this.live;
    switch (msg.type) {
      case 'load': {
        const before = live.sim && live.netlist ? { sim: live.sim, netlist: live.netlist } : null;
        const fresh = live.load(msg.board, msg.tryOut);
        // A new circuit replays the room's run, so its stored state is what every screen (and a late
        // joiner) gets for this circuit; what that changed is reported. The strip records the state after
        // the replay (quietly), not the new circuit's power-on before it.
        if (this.inRoom && live.sim && live.netlist && live.sim !== before?.sim && this.entries.length) {
          this.listen();
          this.room.replay(this.entries);
          if (before) this.changes = stateChanges(before, { sim: live.sim, netlist: live.netlist });
        } else if (fresh) this.attach();
        break;
      }
      case 'room': {
        const back = msg.following && !this.following;
        this.me = msg.me;
        this.following = msg.following;
        if (!msg.following) break;
        if (back) live.clock.pause();
        if (live.sim && (back || this.entries.length)) this.room.replay(this.entries);
        this.drive();
        break;
      }
      case 'room-log':
        this.entries = msg.entries;
        if (this.inRoom && live.sim) {
          this.room.sync(msg.entries);
          this.drive();
        }
        break;
      case 'set-input':
        live.setTryOut([[msg.partId, msg.value]]);
        break;
      case 'clear-try-out':
        live.clearTryOut();
        break;
      case 'clock':
        if (msg.action === 'run') live.clock.run();
        else if (msg.action === 'pause') live.clock.pause();
        else live.step();
        break;
      case 'rate':
        live.clock.setRate(msg.hz);
        break;
      case 'reset-state':
        live.resetState();
        break;
      case 'warm-up':
        live.warmUp(msg.units);
        break;
      case 'clear-trace':
        if (live.sim && live.netlist) this.recorder.clear(live.netlist, live.sim.time, (net) => live.sim!.level(net));
        break;
      case 'subscribe':
        this.recorder.subscribe(msg.signals);
        if (live.sim && live.netlist) this.recorder.attach(live.netlist, live.sim.time, (net) => live.sim!.level(net));
        break;
      default: {
        const never: never = msg;
        throw new Error(`unknown message ${JSON.stringify(never)}`);
      }
    }
    this.flush();
  }

  /** A new Simulator (before its first settle): tells the page the pin order, ports and nets. */
  private compiled(netlist: Netlist): void {
    this.unsubscribe?.();
    this.unsubscribe = undefined;
    // the strip's time goes on: the time the earlier Simulator ran after the recorder's last base, and a pause
    this.recorder.base += this.live.elapsed - this.elapsedSeen;
    this.elapsedSeen = this.live.elapsed;
    const port = (p: Netlist['parts'][number], pin: string): LivePort => ({ partId: p.id, label: p.name, kind: p.kind, net: netlist.nets[netlist.netOf(p.id, pin)].name });
    const family = familyOf(netlist.family);
    this.post({
      type: 'compiled',
      // the order of packLevels
      keys: netlist.parts.flatMap((p) => [...p.inputPins, ...p.outputPins].map((pin) => `${p.id}.${pin}`)),
      // the board's inputs and outputs are its top level (decision 004): a constant inside a module
      // instance (a ROM's bits) is part of that module's circuit, not an input of the board
      inputs: netlist.inputs.filter((p) => this.live.isTopLevel(p.id)).map((p) => port(p, 'out')),
      outputs: netlist.outputs.filter((p) => this.live.isTopLevel(p.id)).map((p) => port(p, 'in')),
      nets: netlist.nets.map((n) => n.name),
      family: family.id,
      timeUnitNs: family.timeUnitNs,
      problems: netlist.problems.map((p) => p.message),
    });
  }

  /** After the first settle of a new Simulator: records the chosen nets from now on. */
  private attach(): void {
    const { sim, netlist } = this.live;
    if (!sim || !netlist) return;
    this.listen();
    this.recorder.attach(netlist, sim.time, (net) => sim.level(net));
  }

  /** Hands the current Simulator's net changes to the recorder. */
  private listen(): void {
    const { sim } = this.live;
    if (!sim) return;
    this.unsubscribe?.();
    this.unsubscribe = sim.onChange((time, net, level) => this.recorder.record(time, net, level));
  }

  /** Posts the current state (levels, report, badges, values, new trace) to the page. */
  flush(): void {
    const { sim, netlist, report, clock } = this.live;
    if (!sim || !netlist) return;
    const levels = packLevels(netlist, sim);
    const values: Record<string, Level> = {};
    for (const p of netlist.inputs) values[p.id] = sim.pinLevel(p.id, 'out');
    for (const p of netlist.outputs) values[p.id] = sim.pinLevel(p.id, 'in');
    const oscillating = new Set(report.oscillating);
    const pulsing = netlist.nets.filter((n) => oscillating.has(n.name)).flatMap((n) => [...n.drivers, ...n.readers].map((r) => `${r.part}.${r.pin}`));
    const badges = [...partBadges(netlist, report, familyOf(netlist.family))].map(([id, b]) => [id, b.tone, b.text] as [string, typeof b.tone, string]);
    const { settled, oscillating: osc, conflicts, undrivenInputs, races } = report;
    this.post(
      {
        type: 'state',
        levels,
        report: { settled, oscillating: osc, conflicts, undrivenInputs, races, powerOn: this.live.powerOn },
        values,
        time: this.recorder.base + sim.time,
        events: sim.stats.events,
        lastEvents: report.events,
        clock: this.inRoom ? { running: this.room.clock.running, rate: this.room.clock.rate, cycles: this.room.clock.cycles } : { running: clock.running, rate: clock.rate, cycles: clock.cycles },
        ...(this.me !== null ? { room: { following: this.following, replays: this.room.replays, changes: this.changes } } : {}),
        badges,
        pulsing,
        ...this.recorder.take(),
      },
      [levels.buffer],
    );
  }

  dispose(): void {
    this.live.clock.pause();
    this.unsubscribe?.();
  }
}
