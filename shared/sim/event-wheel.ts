/**
 * Time wheel (bucket queue) of driver-slot indices. All pending times lie in (now, now + maxDelay], so a
 * wheel of more than maxDelay buckets never holds two different times in one bucket. Buckets are
 * Int32Arrays that only grow (amortised), so queuing an event allocates nothing.
 */
export class EventWheel {
  private readonly mask: number;
  private readonly buckets: Int32Array[];
  private readonly counts: Int32Array;
  /** entries queued (cancelled ones included until their time comes) */
  queued = 0;

  /** A wheel able to hold delays up to maxDelay. */
  constructor(maxDelay: number) {
    let size = 4;
    while (size <= maxDelay) size *= 2;
    this.mask = size - 1;
    this.buckets = Array.from({ length: size }, () => new Int32Array(8));
    this.counts = new Int32Array(size);
  }

  /** Queues slot s at time t. */
  push(t: number, s: number): void {
    const b = t & this.mask;
    const n = this.counts[b];
    let bucket = this.buckets[b];
    if (n === bucket.length) {
      const grown = new Int32Array(n * 2);
      grown.set(bucket);
      this.buckets[b] = bucket = grown;
    }
    bucket[n] = s;
    this.counts[b] = n + 1;
    this.queued++;
  }

  /** The earliest time after `now` with an entry, or Infinity. */
  next(now: number): number {
    if (this.queued === 0) return Infinity;
    for (let k = 1; k <= this.mask + 1; k++) if (this.counts[(now + k) & this.mask] > 0) return now + k;
    return Infinity;
  }

  /** Calls visit for every entry at time t and empties that bucket. */
  drain(t: number, visit: (s: number) => void): void {
    const b = t & this.mask;
    const bucket = this.buckets[b];
    const n = this.counts[b];
    this.counts[b] = 0;
    this.queued -= n;
    for (let i = 0; i < n; i++) visit(bucket[i]);
  }

  /** Drops every entry. */
  clear(): void {
    this.counts.fill(0);
    this.queued = 0;
  }
}
