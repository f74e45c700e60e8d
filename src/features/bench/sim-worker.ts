/**
 * The simulation worker: runs the board's simulator off the page's thread so the canvas never stutters.
 * Messages are handled in order; a run of `load` messages collapses into the newest one, because each
 * load carries the whole board and only the last one matters.
 */
import type { ToWorker } from './protocol';
import { BenchEngine } from './sim-engine';

const engine = new BenchEngine((msg, transfer) => self.postMessage(msg, { transfer: transfer ?? [] }));
const queue: ToWorker[] = [];
let scheduled = false;

function drain(): void {
  scheduled = false;
  const batch = queue.splice(0);
  batch.forEach((msg, i) => {
    if (msg.type === 'load' && batch[i + 1]?.type === 'load') return;
    engine.handle(msg);
  });
}

self.onmessage = (event: MessageEvent<ToWorker>) => {
  queue.push(event.data);
  if (!scheduled) {
    scheduled = true;
    setTimeout(drain, 0);
  }
};
