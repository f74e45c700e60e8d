/**
 * Contact-bounce model of a push button, a changeover contact: one action moves the common from one
 * throw to the other (break before make). The throw it leaves opens cleanly; the throw it meets closes,
 * then opens and closes again a few times (1–3 times, each stage lasting 2–4 gate delays) before it
 * rests closed. Pressing meets the normally-open throw (`out`), releasing the normally-closed one
 * (`outn`). Seeded, so a run is repeatable: the same seed gives the same bounces.
 */
import { L0, L1 } from './codes';

/** mulberry32: a small, well-known 32-bit PRNG (common practice, no source). */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

interface BounceEvent { time: number; part: number; pin: number; value: number }

/** Pending bounce toggles of all buttons, in time order. */
export class Bouncer {
  private readonly rnd: () => number;
  private events: BounceEvent[] = [];

  constructor(seed: number, private readonly gateDelay: number) {
    this.rnd = mulberry32(seed);
  }

  /**
   * Schedules the bounces of the throw met after part `part` changed to `value` (0 or 1) at time now:
   * pin 0 (`out`) after a press, pin 1 (`outn`) after a release; it was just closed, and closes last.
   */
  bounce(part: number, value: number, now: number): void {
    const pin = value === L1 ? 0 : 1;
    const pairs = 1 + Math.floor(this.rnd() * 3);
    let t = now;
    for (let k = 0; k < pairs * 2; k++) {
      t += this.gateDelay * (2 + Math.floor(this.rnd() * 3));
      this.events.push({ time: t, part, pin, value: k % 2 === 0 ? L0 : L1 });
    }
    this.events.sort((a, b) => a.time - b.time);
  }

  /** Time of the next toggle, or Infinity. */
  next(): number {
    return this.events.length ? this.events[0].time : Infinity;
  }

  /** Applies (via drive: part, its output pin, level) every toggle due at or before t. */
  due(t: number, drive: (part: number, pin: number, value: number) => void): void {
    while (this.events.length && this.events[0].time <= t) {
      const e = this.events.shift()!;
      drive(e.part, e.pin, e.value);
    }
  }

  /** Drops the pending toggles of one part (a new change overrides its bounce). */
  cancel(part: number): void {
    if (this.events.length) this.events = this.events.filter((e) => e.part !== part);
  }

  clear(): void {
    this.events = [];
  }
}
