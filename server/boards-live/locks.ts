/**
 * Per-board locks of one server process, so that opening a room, unloading it and writing a board
 * without a room never interleave (a file written while a room loads would otherwise be missed by
 * the room). Several servers on one board need the fan-out (store.ts) besides; these stay per process.
 */
export class BoardLocks {
  private readonly tails = new Map<number, Promise<unknown>>();

  /** Runs `fn` once every earlier holder of the board's lock is done; its failure does not block later ones. */
  run<T>(boardId: number, fn: () => Promise<T>): Promise<T> {
    const before = this.tails.get(boardId) ?? Promise.resolve();
    const run = before.catch(() => undefined).then(fn);
    const tail = run.catch(() => undefined);
    this.tails.set(boardId, tail);
    void tail.then(() => {
      if (this.tails.get(boardId) === tail) this.tails.delete(boardId);
    });
    return run;
  }
}
