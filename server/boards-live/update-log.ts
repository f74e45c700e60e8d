import * as Y from 'yjs';
import type { BoardStore, NewBoardUpdate } from './store';

/**
 * A room's write queue to the store: updates are queued in the tick they are applied (and broadcast
 * in that same tick, see room.ts), written in order one batch (one transaction) at a time, and
 * compacted past the threshold. `flush()` resolves when everything queued so far is stored; rooms
 * flush before they unload and at shutdown.
 */
export class UpdateLog {
  private pending: NewBoardUpdate[] = [];
  private writing: Promise<void> = Promise.resolve();
  private discarded = false;

  constructor(
    private readonly store: BoardStore,
    private readonly boardId: number,
    private readonly doc: Y.Doc,
    private seq: number,
    private rows: number,
    private readonly compactThreshold: () => number,
  ) {}

  /** Queues one applied update and starts writing it. */
  append(data: Uint8Array, userId: number | null): void {
    this.pending.push({ seq: ++this.seq, data, userId, createdAt: new Date().toISOString() });
    void this.flush();
  }

  /** Runs `work` after the writes queued so far, in the same order (e.g. projecting the meta into the board row). */
  after(work: () => Promise<void>, what: string): void {
    this.writing = this.writing.then(work).catch((err) => console.error(`boards-live: board ${this.boardId}: ${what} failed:`, err));
  }

  /** Resolves when every queued update is written. */
  flush(): Promise<void> {
    this.writing = this.writing.catch(() => undefined).then(() => this.writeBatch());
    return this.writing;
  }

  /** The board is gone: drop queued updates (their rows would have no board) and stop writing. */
  discard(): void {
    this.discarded = true;
    this.pending = [];
  }

  get isDiscarded(): boolean {
    return this.discarded;
  }

  private async writeBatch(): Promise<void> {
    const batch = this.pending.splice(0);
    if (!batch.length || this.discarded) return;
    try {
      await this.store.append(this.boardId, batch);
      this.rows += batch.length;
    } catch (err) {
      if (this.discarded || !(await this.store.exists(this.boardId).catch(() => true))) return this.discard();
      // Nothing of the batch was written (one transaction): keep it for the next flush.
      this.pending.unshift(...batch);
      console.error(`boards-live: board ${this.boardId}: storing ${batch.length} update(s) failed; will retry:`, err);
      return;
    }
    if (this.rows <= this.compactThreshold()) return;
    try {
      // Re-encoding from a Y.Doc (not Y.mergeUpdates) drops garbage-collected deleted content.
      await this.store.compact(this.boardId, batch[batch.length - 1].seq, Y.encodeStateAsUpdate(this.doc));
      this.rows = 1;
    } catch (err) {
      console.error(`boards-live: board ${this.boardId}: compaction failed (the rows are kept):`, err);
    }
  }
}
