/**
 * The simulation worker: a thin adapter that runs the shared live engine (shared/sim/live) off the page's
 * thread so the canvas never stutters, with the real timers. Messages are handled in order. A `load`
 * directly followed by another load with the same input values is skipped (each load carries the whole
 * board, so only the newest matters) — but never one whose switch or button values differ, or a quick
 * press and release would be lost.
 */
import { inputSignature, LiveEngine, type LiveCommand, type Timers } from '../../../shared/sim';

const timers: Timers = {
  now: () => performance.now(),
  setTimeout: (fn, ms) => setTimeout(fn, ms),
  clearTimeout: (h) => clearTimeout(h as ReturnType<typeof setTimeout>),
};
const engine = new LiveEngine((msg, transfer) => self.postMessage(msg, { transfer: transfer ?? [] }), timers);
const queue: LiveCommand[] = [];
let scheduled = false;

function drain(): void {
  scheduled = false;
  const batch = queue.splice(0);
  batch.forEach((msg, i) => {
    const next = batch[i + 1];
    if (msg.type === 'load' && next?.type === 'load' && inputSignature(msg.board) === inputSignature(next.board)) return;
    engine.handle(msg);
  });
}

self.onmessage = (event: MessageEvent<LiveCommand>) => {
  queue.push(event.data);
  if (!scheduled) {
    scheduled = true;
    setTimeout(drain, 0);
  }
};
