/**
 * When the server takes automatic snapshots by itself: once a burst of editing has settled (no update
 * for `settleMs` after at least `minUpdates` of them), and when the last person leaves a board that
 * changed since its last snapshot. Only edits from people count, not the server's own changes.
 */
import { ServerOrigin, type BoardActivity } from '../boards-live';

export interface AutoSnapshotOptions {
  /** quiet time after the last edit before an automatic snapshot */
  settleMs: number;
  /** edits since the last snapshot needed for a settle snapshot */
  minUpdates: number;
}

export const DEFAULT_AUTO_OPTIONS: AutoSnapshotOptions = { settleMs: 120_000, minUpdates: 20 };

interface BoardState {
  edits: number;
  timer?: ReturnType<typeof setTimeout>;
}

export class AutoSnapshots {
  private readonly boards = new Map<number, BoardState>();
  private readonly pending = new Set<Promise<void>>();
  private closed = false;

  constructor(
    private readonly options: AutoSnapshotOptions,
    private readonly take: (boardId: number, reason: 'settled' | 'left') => Promise<unknown>,
  ) {}

  /** Feed from the registry's activity. */
  readonly onActivity = (activity: BoardActivity): void => {
    if (this.closed) return;
    if (activity.type === 'update') {
      if (activity.origin instanceof ServerOrigin) return;
      const s = this.state(activity.boardId);
      s.edits++;
      clearTimeout(s.timer);
      s.timer = setTimeout(() => {
        s.timer = undefined;
        if (s.edits >= this.options.minUpdates) this.run(activity.boardId, 'settled');
      }, this.options.settleMs);
      s.timer.unref?.();
    } else {
      const s = this.boards.get(activity.boardId);
      if (!s) return;
      clearTimeout(s.timer);
      if (s.edits > 0) this.run(activity.boardId, 'left');
      this.boards.delete(activity.boardId);
    }
  };

  /** A snapshot of the board was taken (by anyone): count edits from zero again. */
  taken(boardId: number): void {
    const s = this.boards.get(boardId);
    if (s) s.edits = 0;
  }

  /** Stops the timers and waits for snapshots being taken. */
  async close(): Promise<void> {
    this.closed = true;
    for (const s of this.boards.values()) clearTimeout(s.timer);
    this.boards.clear();
    await Promise.allSettled([...this.pending]);
  }

  private state(boardId: number): BoardState {
    let s = this.boards.get(boardId);
    if (!s) this.boards.set(boardId, (s = { edits: 0 }));
    return s;
  }

  private run(boardId: number, reason: 'settled' | 'left'): void {
    const p = this.take(boardId, reason)
      .then(() => undefined)
      .catch((err: unknown) => console.error(`snapshots: automatic snapshot of board ${boardId} failed:`, err))
      .finally(() => this.pending.delete(p));
    this.pending.add(p);
  }
}
