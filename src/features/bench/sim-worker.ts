/**
 * The simulation worker: runs the board's simulator off the page's thread so the canvas never stutters.
 * Messages are handled in order. A `load` directly followed by another load with the same input values
 * is skipped (each load carries the whole board, so only the newest matters) — but never one whose
 * switch or button values differ, or a quick press and release would be lost.
 */
import type { ToWorker } from './protocol';
import { inputSignature } from './board-diff';
import { BenchEngine } from './sim-engine';

const engine = new BenchEngine((msg, transfer) => self.postMessage(msg, { transfer: transfer ?? [] }));
const queue: ToWorker[] = [];
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

self.onmessage = (event: MessageEvent<ToWorker>) => {
  queue.push(event.data);
  if (!scheduled) {
    scheduled = true;
    setTimeout(drain, 0);
  }
};
