import type { SimLogEntry } from '../../board';
import type { LiveSimulation } from './live-simulation';

/** The room's clock as the record says: what every screen shows. */
export interface RoomClock {
  running: boolean;
  rate: number;
  /** clock cycles since the last reset of the room's run */
  cycles: number;
  /** document client id of the screen that drives a running clock (it appends the cycles) */
  driver: number | null;
}

/** What a screen's engine does around a replay. */
export interface RoomRunHooks {
  /**
   * Runs `replay`, the part of a replay that recomputes what this screen has already shown (the engine
   * keeps it off the timing strip: recorded once is enough). Without it, the replay simply runs.
   */
  quietly?: (replay: () => void) => void;
}

/**
 * Replays the room's simulation record (shared/board sim-log.ts) on one screen's LiveSimulation, in
 * order, so that every screen — and a screen that joins later — reaches the same cycle count and
 * stored state: the engine is deterministic, and only entries of the record move the room's run
 * (decision 005). Only the last epoch (from the last `reset`) is replayed. When entries arrive that
 * change what was already replayed (two editors appended at once and the room ordered them
 * differently), the screen replays the epoch again from its power-on.
 */
export class RoomRun {
  readonly clock: RoomClock = { running: false, rate: 1, cycles: 0, driver: null };
  /** ids of the entries replayed so far, in order */
  private ids: string[] = [];
  /** full replays so far (diagnostics and tests) */
  replays = 0;

  constructor(private readonly live: LiveSimulation, private readonly hooks: RoomRunHooks = {}) {}

  /** Brings the simulation up to `entries` (the whole record, in the room's order). */
  sync(entries: readonly SimLogEntry[]): void {
    if (!this.ids.length && entries.length) return this.replay(entries, this.shown(entries));
    let k = 0;
    while (k < this.ids.length && k < entries.length && this.ids[k] === entries[k].id) k++;
    if (k < this.ids.length) return this.replay(entries, this.shown(entries));
    for (let i = k; i < entries.length; i++) this.apply(entries[i], entries, i);
  }

  /**
   * How many leading entries of `entries` this screen has already shown: up to the last one it replayed
   * before, or whose input change it already took from the document (the edit can reach a screen before
   * its entry does, live-simulation.ts `documentChanges`).
   */
  private shown(entries: readonly SimLogEntry[]): number {
    const replayed = new Set(this.ids);
    const ahead = this.live.documentChanges();
    const matched = new Map<string, number>();
    let shown = 0;
    entries.forEach((e, i) => {
      if (replayed.has(e.id)) shown = i + 1;
      else if (e.kind === 'input') {
        const k = matched.get(e.part) ?? 0;
        if (ahead.get(e.part)?.[k] !== e.value) return;
        matched.set(e.part, k + 1);
        shown = i + 1;
      }
    });
    return shown;
  }

  /**
   * Replays the last epoch of `entries` from its power-on (also: a screen back from its try-out, a new
   * circuit). A replay recomputes what was already shown, so the first `shown` entries (default: all), and
   * at least the power-on, run through the `quietly` hook; entries after them are new to this screen.
   */
  replay(entries: readonly SimLogEntry[], shown = entries.length): void {
    this.replays++;
    let start = -1;
    for (let i = entries.length - 1; i >= 0; i--) if (entries[i].kind === 'reset') { start = i; break; }
    const quiet = Math.max(shown, start + 1);
    const recompute = () => {
      this.ids = [];
      Object.assign(this.clock, { running: false, rate: 1, cycles: 0, driver: null });
      // the clock's settings live on across resets: take them from the whole record
      for (let i = 0; i < start; i++) {
        this.ids.push(entries[i].id);
        this.track(entries[i]);
      }
      if (start < 0) this.live.powerOnWith([]);
      for (let i = Math.max(0, start); i < quiet; i++) this.apply(entries[i], entries, i);
    };
    if (this.hooks.quietly) this.hooks.quietly(recompute);
    else recompute();
    for (let i = quiet; i < entries.length; i++) this.apply(entries[i], entries, i);
  }

  private track(e: SimLogEntry): void {
    if (e.kind === 'run') Object.assign(this.clock, { running: true, rate: e.rate, driver: e.by });
    else if (e.kind === 'pause') Object.assign(this.clock, { running: false, driver: null });
    else if (e.kind === 'rate') this.clock.rate = e.hz;
  }

  private apply(e: SimLogEntry, entries: readonly SimLogEntry[], index: number): void {
    this.ids.push(e.id);
    const live = this.live;
    switch (e.kind) {
      case 'reset': {
        // an input first set later in this epoch had, until then, the value that entry says it was
        const inputs = new Map(Object.entries(e.inputs));
        for (let i = index + 1; i < entries.length && entries[i].kind !== 'reset'; i++) {
          const later = entries[i];
          if (later.kind === 'input' && !inputs.has(later.part)) inputs.set(later.part, later.was);
        }
        live.powerOnWith(inputs);
        this.clock.cycles = 0;
        break;
      }
      case 'input':
        live.setShared([[e.part, e.value]]);
        break;
      case 'step':
        live.step();
        this.clock.cycles++;
        break;
      case 'cycles':
        for (let i = 0; i < e.n; i++) live.step();
        this.clock.cycles += e.n;
        break;
      case 'run':
      case 'pause':
      case 'rate':
        this.track(e);
        break;
      default: {
        const never: never = e;
        throw new Error(`unknown simulation record entry ${JSON.stringify(never)}`);
      }
    }
  }
}
