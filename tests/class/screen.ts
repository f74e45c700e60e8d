/**
 * One screen of the room's simulation in Node: the bench's own engine (shared/sim/live LiveEngine) fed
 * from a client's live document exactly as the bench's worker is fed — the board on every change and
 * the room's simulation record — with real timers. A screen that drives the room's clock appends its
 * due cycles to the record, as the page does.
 */
import type * as Y from 'yjs';
import { appendSimLog, docToBoard, inputValuesOf, readSimLog } from '../../shared/board';
import { LiveEngine, type LiveUpdate, type Timers } from '../../shared/sim';

type State = Extract<LiveUpdate, { type: 'state' }>;

const timers: Timers = {
  now: () => performance.now(),
  setTimeout: (fn, ms) => setTimeout(fn, ms),
  clearTimeout: (h) => clearTimeout(h as ReturnType<typeof setTimeout>),
};

export interface Screen {
  engine: LiveEngine;
  state(): State | null;
  cycles(): number;
  /** level of each listed pin (`part.pin`) on this screen */
  levels(pins: string[]): string;
  /** leave the room's run for a private try-out of the clock (viewers), or come back */
  follow(on: boolean): void;
  close(): void;
}

export function openScreen(doc: Y.Doc, origin: object = {}): Screen {
  let last: State | null = null;
  const engine = new LiveEngine((msg) => {
    if (msg.type === 'state') last = msg;
    if (msg.type === 'due') appendSimLog(doc, [{ kind: 'cycles', n: msg.cycles }], origin, () => inputValuesOf(doc));
    if (msg.type === 'error') throw new Error(msg.message);
  }, timers);
  engine.handle({ type: 'room', me: doc.clientID, following: true });
  const sync = () => {
    engine.handle({ type: 'load', board: docToBoard(doc), tryOut: [] });
    engine.handle({ type: 'room-log', entries: readSimLog(doc) });
  };
  doc.on('update', sync);
  sync();
  return {
    engine,
    state: () => last,
    cycles: () => last?.clock.cycles ?? -1,
    levels: (pins) => pins.map((p) => { const [part, pin] = p.split('.'); return engine.live.sim?.pinLevel(part, pin) ?? '?'; }).join(''),
    follow: (on) => engine.handle({ type: 'room', me: doc.clientID, following: on }),
    close: () => { doc.off('update', sync); engine.dispose(); },
  };
}
