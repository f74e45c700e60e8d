/**
 * Wall-clock access, passed in (the worker gives the real timers, tests a fake one, the command line
 * one it never needs to fire), so the engine holds no clock of its own.
 */
export interface Timers {
  /** milliseconds, monotonic */
  now(): number;
  setTimeout(fn: () => void, ms: number): unknown;
  clearTimeout(handle: unknown): void;
}

export const MIN_RATE = 0.1;
export const MAX_RATE = 500;
/** Most half-cycles run in one timer callback; a slower machine skips the backlog instead of freezing. */
const MAX_PER_CALLBACK = 400;

/**
 * The bench clock: while running it asks for as many half-cycles as wall time says are due at `rate`
 * full cycles per second, at most one callback a frame, so a fast rate never floods the page with messages.
 */
export class ClockDriver {
  running = false;
  rate = 1;
  /** level the clock inputs are driven to */
  phase = false;
  /** rising edges since the last restart (0: the clock inputs have not been driven yet) */
  cycles = 0;
  private handle: unknown;
  private startedAt = 0;
  private done = 0;

  constructor(private readonly onHalfCycles: (n: number) => void, private readonly timers: Timers) {}

  run(): void {
    if (this.running) return;
    this.running = true;
    this.rebase();
    this.schedule();
  }

  pause(): void {
    this.running = false;
    if (this.handle !== undefined) this.timers.clearTimeout(this.handle);
    this.handle = undefined;
  }

  setRate(hz: number): void {
    if (!Number.isFinite(hz)) throw new Error(`clock rate must be a number of Hz, got ${hz}`);
    this.rate = Math.min(MAX_RATE, Math.max(MIN_RATE, hz));
    this.rebase();
  }

  /** One clock edge: flips the phase and counts rising edges. */
  toggle(): void {
    this.phase = !this.phase;
    if (this.phase) this.cycles++;
  }

  /** Back to low with no cycles counted (a new circuit), keeping run state and rate. */
  restart(): void {
    this.phase = false;
    this.cycles = 0;
    this.rebase();
  }

  /** Wall-clock milliseconds (for time budgets of the work a tick triggers). */
  now(): number {
    return this.timers.now();
  }

  private rebase(): void {
    this.startedAt = this.timers.now();
    this.done = 0;
  }

  private schedule(): void {
    this.handle = this.timers.setTimeout(() => this.tick(), Math.max(16, 500 / this.rate));
  }

  private tick(): void {
    if (!this.running) return;
    const due = Math.floor(((this.timers.now() - this.startedAt) * 2 * this.rate) / 1000) - this.done;
    this.done += Math.max(0, due);
    if (due > 0) this.onHalfCycles(Math.min(due, MAX_PER_CALLBACK));
    if (this.running) this.schedule();
  }
}
