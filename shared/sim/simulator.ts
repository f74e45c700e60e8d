/**
 * The event-driven four-valued simulator (see docs/decisions/002-simulation-model.md).
 * Nets and driver slots live in typed arrays; events go through a time wheel; gates have inertial
 * delays (a change that reverts before its delay is over is swallowed, as a real gate does).
 */
import { isInputKind, isOutputKind } from '../board';
import { codeLevel, levelCode, type Level } from './levels';
import { L0, L1, LX, LZ, NONE } from './codes';
import { clockHalfPeriod } from './clock-period';
import { EventWheel } from './event-wheel';
import { buildLayout } from './layout';
import { familyDelays, familyOf } from './families';
import { evaluatePart, stateSize } from './parts';
import { isRisingEdge } from './parts/flip-flop';
import { initialSourceLevel, sourceOutputs } from './parts/sources';
import { Bouncer } from './bounce';
import { findFeedbackLoops, sustainedXNet, type FeedbackLoops } from './loops';
import type { SimLayout } from './layout';
import type { ChangeListener, CompiledPart, Netlist, SettleReport, SimStats, SimulatorOptions } from './types';

/** Number of nets of compiled parts: one more than the highest net a pin is on. */
function netCount(parts: readonly CompiledPart[]): number {
  let max = -1;
  for (const p of parts) {
    for (const net of p.inputs) if (net > max) max = net;
    for (const net of p.outputs) if (net > max) max = net;
  }
  return max + 1;
}

/** Simulates a compiled board. */
export class Simulator {
  readonly netlist: Netlist;
  readonly floating: Level;
  readonly stats: SimStats = { events: 0, evaluations: 0, settles: 0 };
  private now = 0;
  private readonly budget: number;
  private readonly parts: CompiledPart[];
  private readonly floatCode: number;
  private readonly rise: Int32Array;
  private readonly fall: Int32Array;
  private readonly inStart: Int32Array;
  private readonly inNet: Int32Array;
  private readonly slotStart: Int32Array;
  private readonly slotNet: Int32Array;
  private readonly slotVal: Uint8Array;
  private readonly slotPend: Uint8Array;
  private readonly slotPendTime: Float64Array;
  private readonly netVal: Uint8Array;
  private readonly netDrivers: Int32Array;
  private readonly netChange: Float64Array;
  private readonly fanStart: Int32Array;
  private readonly fanPart: Int32Array;
  private readonly state: Uint8Array;
  private readonly stateOff: Int32Array;
  private readonly sourceLevel: Uint8Array;
  /** 1 for parts that evaluate (gates, multiplexers, storage), 0 for inputs, indicators and notes */
  private readonly evaluates: Uint8Array;
  private readonly dirty: Int32Array;
  private readonly dirtyMark: Uint8Array;
  private dirtyCount = 0;
  private readonly wheel: EventWheel;
  private readonly bouncer: Bouncer;
  private readonly clocks: { part: number; half: number; next: number }[] = [];
  private readonly inp = new Uint8Array(8);
  private readonly out = new Uint8Array(2);
  private readonly listeners = new Set<ChangeListener>();
  private readonly applyBound = (s: number) => this.applySlot(s);
  private observing = false;
  private readonly seen: Uint8Array;
  private readonly seenList: Int32Array;
  private seenCount = 0;
  private races = new Set<string>();
  private readonly undrivenInputList: string[];
  /** nets with two or more drivers, in net order */
  private readonly conflictNets: number[] = [];
  private readonly layout: SimLayout;
  private readonly resolveAtPowerOn: boolean;
  /** gate-level feedback loops, found the first time a power-on settle ends with an X net */
  private loops: FeedbackLoops | null = null;
  /** true from power-on until the end of the next settle: that settle may resolve X loops */
  private powerOnPending = false;
  private readonly forced: number[] = [];
  /** per net: 1 while it is listed in `forced` */
  private readonly forcedMark: Uint8Array;
  /**
   * Worklist of the power-on rounds: after a settle's first round has checked every loop, a later round
   * re-checks only the loops of which a net or an entering net has changed level, or a net's driver has
   * gained or lost a pending change, since that check; no other loop's answer can have changed. Without
   * it a chain of loops that resolve one after the other (a shift register) costs rounds × nets.
   */
  private watchLoops = false;
  private loopMark: Uint8Array = new Uint8Array(0);
  private loopQueue: Int32Array = new Int32Array(0);
  private loopQueued = 0;
  private readonly picked: number[] = [];
  /** per driver slot: 1 when its level was chosen at power-on, so an X evaluation keeps that level */
  private readonly hold: Uint8Array;
  private holding = false;
  /** heater warm-up (option warmUp): time units, 1 per part once warm, and the queue of parts warming */
  private readonly warmUp: number;
  private readonly warm: Uint8Array;
  private readonly warmGap: number;
  private warmQueue: { t: number; part: number }[] = [];
  private warmHead = 0;

  constructor(netlist: Netlist, opts: SimulatorOptions = {}) {
    this.netlist = netlist;
    this.parts = netlist.parts;
    const fam = familyOf(opts.family ?? netlist.family);
    this.floating = fam.floating;
    this.floatCode = levelCode(fam.floating);
    const n = this.parts.length;
    // every net has a pin, so the parts tell the count without the netlist's (lazily built) net list
    const nNets = netCount(this.parts);
    this.budget = opts.eventBudget ?? Math.max(20_000, 200 * n);
    const delays = opts.family && opts.family !== netlist.family ? familyDelays(opts.family) : null;
    this.rise = new Int32Array(n);
    this.fall = new Int32Array(n);
    this.evaluates = new Uint8Array(n);
    this.sourceLevel = new Uint8Array(n);
    let maxDelay = 1;
    for (let i = 0; i < n; i++) {
      const p = this.parts[i];
      const rise = delays && p.rise ? delays.rise : p.rise;
      const fall = delays && p.fall ? delays.fall : p.fall;
      this.rise[i] = rise;
      this.fall[i] = fall;
      if (rise > maxDelay) maxDelay = rise;
      if (fall > maxDelay) maxDelay = fall;
      const source = isInputKind(p.kind);
      this.evaluates[i] = !source && p.outputs.length > 0 ? 1 : 0;
      this.sourceLevel[i] = source ? initialSourceLevel(p.part) : L0;
    }

    const lay = buildLayout(this.parts, nNets);
    this.layout = lay;
    this.resolveAtPowerOn = (opts.powerOn ?? 'resolve') === 'resolve';
    this.inStart = lay.inStart;
    this.inNet = lay.inNet;
    this.slotStart = lay.slotStart;
    this.slotNet = lay.slotNet;
    this.stateOff = lay.stateOff;
    this.netDrivers = lay.netDrivers;
    this.fanStart = lay.fanStart;
    this.fanPart = lay.fanPart;
    const nSlots = this.slotNet.length;
    this.slotVal = new Uint8Array(nSlots);
    this.slotPend = new Uint8Array(nSlots);
    this.slotPendTime = new Float64Array(nSlots);
    this.hold = new Uint8Array(nSlots);
    this.forcedMark = new Uint8Array(nNets);
    this.state = new Uint8Array(lay.nState);
    this.netVal = new Uint8Array(nNets);
    this.netChange = new Float64Array(nNets).fill(-1);
    this.dirty = new Int32Array(n);
    this.dirtyMark = new Uint8Array(n);
    this.seen = new Uint8Array(nNets);
    this.seenList = new Int32Array(nNets);

    this.bouncer = new Bouncer(opts.seed ?? 1, Math.max(1, maxDelay));
    this.wheel = new EventWheel(maxDelay);
    this.parts.forEach((p, i) => {
      if (p.kind !== 'clock' || p.part.kind !== 'clock') return;
      const half = clockHalfPeriod(p.part.period, maxDelay);
      this.clocks.push({ part: i, half, next: half });
    });
    this.warmUp = Math.max(0, Math.floor(opts.warmUp ?? 0));
    this.warm = new Uint8Array(n).fill(1);
    this.warmGap = maxDelay + 1;
    this.undrivenInputList = this.undrivenInputs();
    for (let net = 0; net < nNets; net++) if (this.netDrivers[net] === -2) this.conflictNets.push(net);
    this.powerOn();
  }

  /**
   * `part.pin` of every input pin on an undriven net, net by net (in net order), each net's readers in
   * file order; lamps and probes show the net rather than read it, so they are left out.
   */
  private undrivenInputs(): string[] {
    const found: { net: number; ref: string }[] = [];
    for (let p = 0; p < this.parts.length; p++) {
      for (let k = this.inStart[p]; k < this.inStart[p + 1]; k++) {
        const net = this.inNet[k];
        if (this.netDrivers[net] !== -1) continue;
        const part = this.parts[p];
        // by id, as a reader's part is found by its id
        const byId = this.netlist.partById(part.id);
        if (byId !== undefined && !isOutputKind(byId.kind)) found.push({ net, ref: `${part.id}.${part.inputPins[k - this.inStart[p]]}` });
      }
    }
    // a stable sort: per net, readers stay in file order
    return found.sort((a, b) => a.net - b.net).map((f) => f.ref);
  }

  /** Current simulation time (integer time units). */
  get time(): number {
    return this.now;
  }

  /**
   * Gate outputs to X, storage to its `init` (or 0), inputs kept at their levels, queue emptied; the
   * next settle may resolve self-sustained X loops (option `powerOn`).
   */
  private powerOn(warmUp = this.warmUp): void {
    this.powerOnPending = this.resolveAtPowerOn;
    this.coolDown(warmUp);
    this.wheel.clear();
    this.bouncer.clear();
    this.slotVal.fill(LX);
    this.slotPend.fill(NONE);
    for (let net = 0; net < this.netVal.length; net++) {
      const v = this.netDrivers[net] === -1 ? LZ : LX;
      if (this.netVal[net] !== v || this.netChange[net] < 0) this.setNetRaw(net, v);
    }
    this.parts.forEach((p, i) => {
      if (isInputKind(p.kind)) { this.driveSource(i, this.sourceLevel[i]); return; }
      const sz = stateSize(p.kind);
      if (sz === 0) return;
      const o = this.stateOff[i];
      const init = 'init' in p.part && p.part.init === 1 ? L1 : L0;
      this.state[o] = init;
      this.state[o + 1] = init === L1 ? L0 : L1;
      this.driveSlot(this.slotStart[i], this.state[o]);
      this.driveSlot(this.slotStart[i] + 1, this.state[o + 1]);
    });
    // Gates evaluate at once. Storage keeps its power-on state until an input changes, unless all its
    // inputs are already known (so a power-on X from a not yet settled gate does not wipe `init`).
    this.dirtyMark.fill(0);
    this.dirtyCount = 0;
    this.parts.forEach((p, i) => {
      if (isInputKind(p.kind) || p.outputs.length === 0) return;
      const sz = stateSize(p.kind);
      if (sz === 0) { this.markDirty(i); return; }
      const a = this.inStart[i];
      // a flip-flop's last clock is the clock at power-on: power-on is not an edge
      if (sz > 2) this.state[this.stateOff[i] + 2] = this.read(this.inNet[a + 1]);
      let known = true;
      for (let k = a; k < this.inStart[i + 1]; k++) if (this.read(this.inNet[k]) === LX) known = false;
      if (known) this.markDirty(i);
    });
  }

  /**
   * Storage back to its initial value, gate outputs to X; input levels stay. The next settle resolves
   * self-sustained X loops again (option `powerOn`). `warmUp` replaces the option's heater warm-up for
   * this power-on only (time units; 0 for none).
   */
  resetState(opts: { warmUp?: number } = {}): void {
    this.powerOn(opts.warmUp === undefined ? this.warmUp : Math.max(0, Math.floor(opts.warmUp)));
  }

  /** Time at which the last part's heater is warm (option warmUp); at or before `time` when all are. */
  get warmUntil(): number {
    return this.warmQueue.length ? this.warmQueue[this.warmQueue.length - 1].t : 0;
  }

  /** Every evaluating part cold again, warming in file order from now (no-op without warm-up). */
  private coolDown(warmUp: number): void {
    this.warmQueue = [];
    this.warmHead = 0;
    this.warm.fill(1);
    if (warmUp <= 0) return;
    let k = 0;
    this.parts.forEach((_, i) => {
      if (!this.evaluates[i]) return;
      this.warm[i] = 0;
      this.warmQueue.push({ t: this.now + warmUp + k++ * this.warmGap, part: i });
    });
  }

  /** Parts whose heaters are warm by time t evaluate from now on. */
  private wake(t: number): void {
    while (this.warmHead < this.warmQueue.length && this.warmQueue[this.warmHead].t <= t) {
      const p = this.warmQueue[this.warmHead++].part;
      this.warm[p] = 1;
      this.markDirty(p);
    }
  }

  /**
   * Sets an input part: switch `on`, button `pressed` (with the contact-bounce model when the part has
   * `bounce`), clock level, constant value. Takes effect at the current time; call settle() after.
   */
  setInput(partId: string, value: boolean | 0 | 1 | Level): void {
    const p = this.netlist.partById(partId);
    if (!p || !isInputKind(p.kind)) throw new Error(`${partId} is not an input part`);
    const v = levelCode(value);
    this.bouncer.cancel(p.index);
    const changed = this.sourceLevel[p.index] !== v;
    this.driveSource(p.index, v);
    const clock = this.clocks.find((c) => c.part === p.index);
    if (clock) clock.next = this.now + clock.half;
    if (changed && p.part.kind === 'button' && p.part.bounce && (v === L0 || v === L1)) this.bouncer.bounce(p.index, v, this.now);
  }

  private driveSource(i: number, v: number): void {
    this.sourceLevel[i] = v;
    sourceOutputs(v, this.out);
    const s0 = this.slotStart[i];
    for (let s = s0; s < this.slotStart[i + 1]; s++) this.driveSlot(s, this.out[s - s0]);
  }

  private driveSlot(s: number, v: number): void {
    this.slotVal[s] = v;
    this.slotPend[s] = NONE;
    const net = this.slotNet[s];
    if (this.netDrivers[net] === s) this.setNet(net, v);
  }

  private setNetRaw(net: number, v: number): void {
    this.netVal[net] = v;
    this.netChange[net] = this.now;
    if (this.listeners.size) for (const cb of this.listeners) cb(this.now, net, codeLevel(v));
  }

  private setNet(net: number, v: number): void {
    if (this.netVal[net] === v) return;
    this.setNetRaw(net, v);
    this.stats.events++;
    if (this.observing && !this.seen[net]) { this.seen[net] = 1; this.seenList[this.seenCount++] = net; }
    if (this.watchLoops) this.touchLoops(net);
    for (let k = this.fanStart[net]; k < this.fanStart[net + 1]; k++) this.markDirty(this.fanPart[k]);
  }

  /** Queues the loops whose power-on answer a change at `net` may alter (see watchLoops). */
  private touchLoops(net: number): void {
    const loops = this.loops!;
    for (let i = loops.netLoopStart[net]; i < loops.netLoopStart[net + 1]; i++) {
      const k = loops.netLoop[i];
      if (this.loopMark[k]) continue;
      this.loopMark[k] = 1;
      this.loopQueue[this.loopQueued++] = k;
    }
  }

  private markDirty(p: number): void {
    if (this.dirtyMark[p]) return;
    this.dirtyMark[p] = 1;
    this.dirty[this.dirtyCount++] = p;
  }

  private applySlot(s: number): void {
    if (this.slotPend[s] === NONE || this.slotPendTime[s] !== this.now) return;
    const v = this.slotPend[s];
    this.slotPend[s] = NONE;
    this.slotVal[s] = v;
    const net = this.slotNet[s];
    if (this.watchLoops) this.touchLoops(net);
    if (this.netDrivers[net] === s) this.setNet(net, v);
  }

  private read(net: number): number {
    const v = this.netVal[net];
    return v === LZ ? this.floatCode : v;
  }

  private evalDirty(): void {
    for (let i = 0; i < this.dirtyCount; i++) {
      const p = this.dirty[i];
      this.dirtyMark[p] = 0;
      this.evaluate(p);
    }
    this.dirtyCount = 0;
  }

  private evaluate(p: number): void {
    if (!this.evaluates[p]) return;
    if (!this.warm[p]) {
      // a cold tube passes no plate current: its plate, the output, sits at the supply (high)
      for (let s = this.slotStart[p]; s < this.slotStart[p + 1]; s++) this.schedule(s, L1, p);
      return;
    }
    const part = this.parts[p];
    const kind = part.kind;
    const a = this.inStart[p];
    const n = this.inStart[p + 1] - a;
    const slot0 = this.slotStart[p];
    const nOut = this.slotStart[p + 1] - slot0;
    for (let k = 0; k < n; k++) this.inp[k] = this.read(this.inNet[a + k]);
    const o = this.stateOff[p];
    // D changing in the same instant as the clock edge: the order decides, so report it
    if (kind === 'dff' && isRisingEdge(this.state[o + 2], this.inp[1]) && this.netChange[this.inNet[a]] === this.now) this.races.add(part.id);
    this.stats.evaluations++;
    if (evaluatePart(kind, this.inp, n, this.state, o, this.out)) this.races.add(part.id);
    for (let k = 0; k < nOut; k++) this.schedule(slot0 + k, this.out[k], p);
  }

  private schedule(s: number, v: number, p: number): void {
    // a level chosen at power-on stands until the gate's inputs know better (cf. a storage part's init)
    if (v === LX && this.holding && this.hold[s]) return;
    const pend = this.slotPend[s];
    if (pend !== NONE) {
      if (pend === v) return;
      this.slotPend[s] = NONE; // inertial: the earlier change is swallowed
      if (this.watchLoops) this.touchLoops(this.slotNet[s]);
    }
    if (v === this.slotVal[s]) return;
    const d = v === L1 ? this.rise[p] : v === L0 ? this.fall[p] : Math.min(this.rise[p], this.fall[p]);
    const t = this.now + Math.max(1, d);
    this.slotPend[s] = v;
    this.slotPendTime[s] = t;
    this.wheel.push(t, s);
    if (this.watchLoops) this.touchLoops(this.slotNet[s]);
  }

  private nextTime(): number {
    return Math.min(this.wheel.next(this.now), this.bouncer.next());
  }

  /** Moves to time t (≥ now) and processes everything due then. */
  private advance(t: number): void {
    this.now = t;
    if (this.warmHead < this.warmQueue.length) this.wake(t);
    this.bouncer.due(t, (part, pin, v) => this.driveSlot(this.slotStart[part] + pin, v));
    if (this.wheel.queued) this.wheel.drain(t, this.applyBound);
    this.evalDirty();
  }

  /**
   * Runs until nothing changes, or until the event budget is spent: then watches a little longer and
   * names the nets that keep changing (oscillating). Clocks do not run here (see runFor).
   * `eventBudget` overrides the simulator's budget for this call.
   */
  settle(opts: { eventBudget?: number } = {}): SettleReport {
    this.stats.settles++;
    this.races = new Set();
    const budget = opts.eventBudget ?? this.budget;
    const start = this.stats.events;
    const window = Math.max(256, 4 * this.netVal.length);
    let settled = true;
    const resolving = this.powerOnPending;
    this.powerOnPending = false;
    for (const net of this.forced) this.forcedMark[net] = 0;
    this.forced.length = 0;
    this.holding = resolving;
    // each round forces at least one net (and a chosen level holds); the bound only guards odd boards
    let rounds = resolving ? this.netVal.length + 1 : 0;
    let watchFrom = budget;
    this.evalDirty();
    for (;;) {
      const t = this.nextTime();
      if (t === Infinity) {
        if (rounds > 0 && this.resolveLoops()) { rounds--; continue; }
        break;
      }
      const spent = this.stats.events - start;
      if (!this.observing && spent >= watchFrom) {
        // a loop fed by an oscillating part of the board still powers on somewhere; its first changes
        // are not oscillation, so the watch starts a window later
        if (rounds > 0 && this.resolveLoops()) { rounds--; watchFrom = spent + window; } else { this.observing = true; this.seenCount = 0; }
      }
      if (this.observing && spent >= watchFrom + window) { settled = false; break; }
      this.advance(t);
    }
    if (this.holding) { this.holding = false; this.hold.fill(0); }
    if (this.watchLoops) {
      this.watchLoops = false;
      for (let i = 0; i < this.loopQueued; i++) this.loopMark[this.loopQueue[i]] = 0;
      this.loopQueued = 0;
    }
    const oscillating: string[] = [];
    if (this.observing) {
      for (let i = 0; i < this.seenCount; i++) { const net = this.seenList[i]; this.seen[net] = 0; if (!settled) oscillating.push(this.netlist.nets[net].name); }
      this.observing = false;
      this.seenCount = 0;
    }
    return {
      settled, time: this.now, events: this.stats.events - start, oscillating,
      conflicts: this.conflictNets.map((id) => this.netlist.nets[id].name),
      undrivenInputs: [...this.undrivenInputList],
      races: [...this.races],
      powerOn: this.forced.map((net) => this.netlist.nets[net].name),
    };
  }

  /**
   * One power-on round: in every gate loop whose X sustains itself (all nets entering it read 0 or 1),
   * X net whose driver is listed first powers on low — scheduled as an ordinary change, so delays
   * apply — and holds that level against X for the rest of the settle. Returns the number of nets forced.
   * The first round of a settle checks every loop; later ones only the loops queued by touchLoops.
   */
  private resolveLoops(): number {
    if (!this.loops) {
      let anyX = false;
      for (let net = 0; net < this.netVal.length && !anyX; net++) anyX = this.netVal[net] === LX && this.netDrivers[net] >= 0;
      if (!anyX) return 0;
      const gate = Uint8Array.from(this.parts, (p, i) => (this.evaluates[i] && stateSize(p.kind) === 0 ? 1 : 0));
      this.loops = findFeedbackLoops(this.layout, gate, this.netVal.length);
      this.loopMark = new Uint8Array(this.loops.count);
      this.loopQueue = new Int32Array(this.loops.count);
    }
    const loops = this.loops;
    const isX = (net: number) => this.netVal[net] === LX && this.slotPend[this.netDrivers[net]] === NONE;
    const known = (net: number) => { const v = this.read(net); return v === L0 || v === L1; };
    const picked = this.picked;
    picked.length = 0;
    if (!this.watchLoops) {
      for (let k = 0; k < loops.count; k++) { const net = sustainedXNet(loops, k, isX, known); if (net >= 0) picked.push(net); }
      this.watchLoops = true;
    } else {
      // in loop order, as a full round would pick them (the order of the scheduled changes matters)
      const queue = this.loopQueue.subarray(0, this.loopQueued).sort();
      for (let i = 0; i < queue.length; i++) {
        const k = queue[i];
        this.loopMark[k] = 0;
        const net = sustainedXNet(loops, k, isX, known);
        if (net >= 0) picked.push(net);
      }
      this.loopQueued = 0;
    }
    for (const net of picked) {
      const s = this.netDrivers[net];
      this.schedule(s, L0, this.layout.slotPart[s]);
      this.hold[s] = 1;
      if (!this.forcedMark[net]) { this.forcedMark[net] = 1; this.forced.push(net); }
    }
    return picked.length;
  }

  /**
   * Runs for dt time units, clocks toggling every half period (unless `clocks: false`, which only lets
   * pending events play out); returns the events processed.
   */
  runFor(dt: number, opts: { clocks?: boolean } = {}): number {
    const clocks = opts.clocks === false ? [] : this.clocks;
    const start = this.stats.events;
    const end = this.now + Math.max(0, Math.floor(dt));
    this.evalDirty();
    for (;;) {
      let t = this.nextTime();
      for (const c of clocks) t = Math.min(t, c.next);
      if (this.warmHead < this.warmQueue.length) t = Math.min(t, this.warmQueue[this.warmHead].t);
      if (t > end) break;
      this.now = t;
      for (const c of clocks) {
        if (c.next !== t) continue;
        this.driveSource(c.part, this.sourceLevel[c.part] === L1 ? L0 : L1);
        c.next = t + c.half;
      }
      this.advance(t);
    }
    this.now = end;
    return this.stats.events - start;
  }

  /** Level of a net (Z when undriven, X when its drivers conflict). */
  level(netId: number): Level {
    return codeLevel(this.netVal[netId]);
  }

  /** Level at a pin: what an input pin reads (floating value on an undriven net), or an output pin's net. */
  pinLevel(partId: string, pin: string): Level {
    const part = this.netlist.partById(partId);
    const net = this.netlist.netOf(partId, pin);
    return part && part.inputPins.includes(pin) && !isOutputKind(part.kind) ? codeLevel(this.read(net)) : this.level(net);
  }

  /** Every pin's level, keyed `partId.pin`. */
  levels(): Map<string, Level> {
    const map = new Map<string, Level>();
    for (const p of this.parts) for (const pin of [...p.inputPins, ...p.outputPins]) map.set(`${p.id}.${pin}`, this.pinLevel(p.id, pin));
    return map;
  }

  /** Lamp and probe levels by label (or id). */
  outputValues(): Record<string, Level> {
    const r: Record<string, Level> = {};
    for (const p of this.netlist.outputs) r[p.name] = this.level(p.inputs[0]);
    return r;
  }

  /** Input part levels by label (or id). */
  inputValues(): Record<string, Level> {
    const r: Record<string, Level> = {};
    for (const p of this.netlist.inputs) r[p.name] = codeLevel(this.sourceLevel[p.index]);
    return r;
  }

  /** Subscribes to net changes; returns the unsubscribe function. */
  onChange(cb: ChangeListener): () => void {
    this.listeners.add(cb);
    return () => { this.listeners.delete(cb); };
  }
}
