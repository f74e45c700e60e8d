import type * as Y from 'yjs';
import { nowIso } from '../db/knex';
import type { NewBoardUpdate } from '../db/board-updates';
import { appendBoardChanges, boardStillExists, compactBoardRows, type BoardDocsContext } from '../services/board-docs';

/**
 * A room's write queue to `board_updates`: updates are queued in the tick they are applied, written
 * in order one batch (one transaction) at a time, and compacted past the threshold.
 */
export class UpdateLog {
  private pending: NewBoardUpdate[] = [];
  private writing: Promise<void> = Promise.resolve();
  private discarded = false;

  constructor(
    private readonly ctx: BoardDocsContext,
    private readonly boardId: number,
    private readonly doc: Y.Doc,
    private seq: number,
    private rows: number,
    private readonly compactThreshold: () => number,
  ) {}

  /** Queues one applied update and starts writing it. */
  append(data: Uint8Array, userId: number | null): void {
    this.pending.push({ seq: ++this.seq, data, userId, createdAt: nowIso() });
    void this.flush();
  }

  /** Runs `work` after the writes queued so far, in the same order (e.g. updating the board row). */
  after(work: () => Promise<void>, what: string): void {
    this.writing = this.writing.then(work).catch((err) => console.error(`collab: board ${this.boardId}: ${what} failed:`, err));
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
      await appendBoardChanges(this.ctx, this.boardId, batch);
      this.rows += batch.length;
    } catch (err) {
      if (this.discarded || !(await boardStillExists(this.ctx, this.boardId).catch(() => true))) return this.discard();
      // Nothing of the batch was written (one transaction): keep it for the next flush.
      this.pending.unshift(...batch);
      console.error(`collab: board ${this.boardId}: storing ${batch.length} update(s) failed; will retry:`, err);
      return;
    }
    if (this.rows <= this.compactThreshold()) return;
    try {
      await compactBoardRows(this.ctx, this.boardId, this.doc, batch[batch.length - 1].seq);
      this.rows = 1;
    } catch (err) {
      console.error(`collab: board ${this.boardId}: compaction failed (the rows are kept):`, err);
    }
  }
}
