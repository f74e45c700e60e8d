import * as Y from 'yjs';
import { WebSocket } from 'ws';
import { checkDocChanges, emptyTouched, metaMap, partsMap, touchedBy, wiresMap, type DocProblem, type DocTouched } from '../../shared/board';
import { CLOSE, SocketRefusal, type CollabOptions } from './types';

/** Bytes a document holds waiting for missing dependencies (Yjs pending structs and deletes). */
export function pendingBytes(doc: Y.Doc): number {
  return (doc.store.pendingStructs?.update.byteLength ?? 0) + (doc.store.pendingDs?.byteLength ?? 0);
}

/**
 * Checks an editor's update BEFORE the room applies it: the update goes into a shadow copy of the
 * room's document first, and what it touched there is checked with the board rules (shared/board
 * doc-check: the import's rules, per part/wire/meta key), the part and wire limits and the pending
 * bytes limit. A refused update never reaches the room's document, the store or anyone else; the
 * shadow, which took it, is rebuilt from the room's document.
 *
 * The shadow follows every other change of the room's document (server edits, repairs, remote
 * servers) through its 'update' event; updates from sockets are skipped there, the shadow had them
 * first. Cost per update: applying it twice, and checking only what it touched.
 */
export class UpdateGuard {
  private shadow: Y.Doc;
  private touched: DocTouched = emptyTouched();

  constructor(
    private readonly doc: Y.Doc,
    private readonly options: () => CollabOptions,
  ) {
    this.shadow = this.cloneDoc();
    doc.on('update', this.follow);
  }

  /**
   * Throws SocketRefusal (invalid board, too large, too much pending) or the decoder's error for a
   * malformed update; returns when `update` may be applied to the room's document.
   */
  check(update: Uint8Array): void {
    const { maxParts, maxWires, maxPendingBytes } = this.options();
    const parts = partsMap(this.shadow).size;
    const wires = wiresMap(this.shadow).size;
    const pendingBefore = pendingBytes(this.shadow);
    this.touched = emptyTouched();
    try {
      Y.applyUpdate(this.shadow, update);
      const pending = pendingBytes(this.shadow);
      if (pending > maxPendingBytes && pending > pendingBefore) {
        throw new SocketRefusal(CLOSE.pendingTooLarge, 'pending_too_large', `${pending} bytes would wait for missing updates (limit ${maxPendingBytes})`);
      }
      const partsAfter = partsMap(this.shadow).size;
      const wiresAfter = wiresMap(this.shadow).size;
      if (partsAfter > maxParts && partsAfter > parts) {
        throw new SocketRefusal(CLOSE.boardTooLarge, 'board_too_large', `${partsAfter} parts (limit ${maxParts})`);
      }
      if (wiresAfter > maxWires && wiresAfter > wires) {
        throw new SocketRefusal(CLOSE.boardTooLarge, 'board_too_large', `${wiresAfter} wires (limit ${maxWires})`);
      }
      const problems: DocProblem[] = checkDocChanges(this.shadow, this.touched).filter((p) => p.kind === 'shape');
      if (problems.length) {
        const more = problems.length > 1 ? ` (and ${problems.length - 1} more)` : '';
        throw new SocketRefusal(CLOSE.invalidBoard, 'invalid_board', problems[0].message + more);
      }
    } catch (err) {
      this.rebuild();
      throw err;
    }
  }

  /** The room's document failed to take a checked update (it should not): start the shadow again from it. */
  rebuild(): void {
    this.shadow.off('afterTransaction', this.collect);
    this.shadow.destroy();
    this.shadow = this.cloneDoc();
  }

  destroy(): void {
    this.doc.off('update', this.follow);
    this.shadow.destroy();
  }

  private cloneDoc(): Y.Doc {
    const shadow = new Y.Doc({ gc: this.doc.gc });
    // typed first: a root first made by an update is a plain AbstractType, replaced when opened as a map
    partsMap(shadow);
    wiresMap(shadow);
    metaMap(shadow);
    Y.applyUpdate(shadow, Y.encodeStateAsUpdate(this.doc));
    shadow.on('afterTransaction', this.collect);
    return shadow;
  }

  private collect = (tr: Y.Transaction): void => {
    touchedBy(tr, this.touched);
  };

  // Updates from sockets were checked (and so applied) in the shadow first.
  private follow = (update: Uint8Array, origin: unknown): void => {
    if (origin instanceof WebSocket) return;
    try {
      Y.applyUpdate(this.shadow, update);
    } catch {
      this.rebuild();
    }
  };
}
