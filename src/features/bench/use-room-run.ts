import { useEffect } from 'react';
import type * as Y from 'yjs';
import { appendSimLog, inputValuesOf, partsMap, readSimLog, simLogArray, type NewSimLogEntry } from '../../../shared/board';
import type { LiveCommand } from '../../../shared/sim';

/**
 * The bench in the room's run (decision 005): the engine follows the room's simulation record; an
 * editor's clock, reset and input changes go into the record, never straight to the engine. A viewer
 * who steps or runs the clock leaves the room's run for a private try-out (`following` false).
 */
export function useRoomRun(doc: Y.Doc, origin: object, { editor, following, send }: { editor: boolean; following: boolean; send: (msg: LiveCommand) => void }) {
  useEffect(() => {
    send({ type: 'room', me: doc.clientID, following });
  }, [doc, following, send]);

  useEffect(() => {
    const log = simLogArray(doc);
    const push = () => send({ type: 'room-log', entries: readSimLog(doc) });
    log.observe(push);
    push();
    return () => log.unobserve(push);
  }, [doc, send]);

  // An editor's own input changes (bench, canvas, undo) join the record, with the value before.
  useEffect(() => {
    if (!editor) return;
    const parts = partsMap(doc);
    const onChange = (events: Y.YEvent<Y.Map<unknown>>[], tr: Y.Transaction) => {
      if (!tr.local) return;
      const changed: { part: string; value: boolean; was: boolean }[] = [];
      for (const ev of events) {
        const id = ev.target === parts ? null : (ev.target as Y.Map<unknown>).get('id');
        if (typeof id !== 'string') continue;
        for (const key of ['on', 'pressed']) {
          const c = ev.changes.keys.get(key);
          if (!c || c.action !== 'update') continue;
          changed.push({ part: id, value: (ev.target as Y.Map<unknown>).get(key) === true, was: c.oldValue === true });
        }
      }
      if (!changed.length) return;
      queueMicrotask(() => appendSimLog(doc, changed.map((c) => ({ kind: 'input', ...c })), origin, () => {
        const now = inputValuesOf(doc);
        for (const c of changed) now[c.part] = c.was;
        return now;
      }));
    };
    parts.observeDeep(onChange);
    return () => parts.unobserveDeep(onChange);
  }, [doc, origin, editor]);

  return {
    /** an editor's clock, reset or rate change, for everyone */
    append: (entries: NewSimLogEntry[]) => appendSimLog(doc, entries, origin, () => inputValuesOf(doc)),
  };
}
