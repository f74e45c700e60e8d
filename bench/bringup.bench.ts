/**
 * Bring-up speed. Test vectors for ISCAS-85 c880 (383 gates, 60 inputs: larger than the c432 the issue
 * sizes the target by; goal ≤ 2 s) and c17; fault simulation throughput (faults × patterns per second)
 * of the bit-parallel simulator on c880, against the plain pin-by-pin evaluator of the tests.
 */
import { readFileSync } from 'node:fs';
import type { BenchOptions, BenchRow } from './run';
import { boardOf, buildModel, faultList, faultSites, FaultSimulator, packVectors, testVectors } from '../shared/bringup';
import { compileBoard, mulberry32 } from '../shared/sim';
import { PlainBoard, parseFault } from '../tests/bringup/plain-eval';

const load = (name: string) => boardOf(JSON.parse(readFileSync(new URL(`../tests/fixtures/${name}`, import.meta.url), 'utf8')));
const median = (xs: number[]) => xs.slice().sort((a, b) => a - b)[Math.floor(xs.length / 2)];

export default async function bringupBench(_opts: BenchOptions): Promise<BenchRow[]> {
  const c880 = load('iscas85-c880.gatefold.json');
  const c17 = load('iscas85-c17.gatefold.json');
  let last = testVectors(c880);
  const runs = [1, 2, 3].map((seed) => { const t = performance.now(); last = testVectors(c880, { seed }); return performance.now() - t; });
  const c17ms = median([1, 2, 3].map(() => { const t = performance.now(); testVectors(c17); return performance.now() - t; }));

  // throughput: every fault of c880 on 256 random patterns per block, no fault dropping
  const model = buildModel(c880);
  const faults = faultList(compileBoard(c880));
  const sites = faultSites(model, faults);
  const W = 8;
  const sim = new FaultSimulator(model, W);
  const det = new Int32Array(W);
  const random = mulberry32(5);
  const blocks = 8;
  const t0 = performance.now();
  for (let b = 0; b < blocks; b++) {
    const vecs = Array.from({ length: 32 * W }, () => Array.from({ length: model.inputs.length }, () => (random() < 0.5 ? 1 : 0)));
    sim.load(packVectors(vecs, model.inputs.length, W));
    sim.run();
    for (const s of sites) sim.simulate(s, det);
  }
  const fast = (faults.length * blocks * 32 * W) / ((performance.now() - t0) / 1000);
  // the plain evaluator: one pattern, one fault at a time, on a sample
  const plain = new PlainBoard(c880);
  const sample = faults.slice(0, 200);
  const pattern = Array.from({ length: model.inputs.length }, () => (random() < 0.5 ? 1 : 0));
  const t1 = performance.now();
  for (const f of sample) plain.run(pattern, parseFault(f.name));
  const slow = sample.length / ((performance.now() - t1) / 1000);

  return [
    { name: 'test vectors, c880 (383 gates, 60 inputs)', value: Math.round(median(runs)), unit: 'ms', goal: { max: 2000 },
      note: `median of 3 seeds; ${last.vectors.length} vectors, ${last.detected}/${last.faults} faults, lower bound ${last.minimalNote.match(/at least (\d+)/)?.[1] ?? '?'}` },
    { name: 'test vectors, c17', value: Math.round(c17ms * 10) / 10, unit: 'ms', note: 'exact cover over all 32 settings' },
    { name: 'fault simulation, c880', value: Math.round(fast), unit: 'faults×patterns/s', reference: { name: 'plain pin-by-pin evaluator', value: Math.round(slow), unit: 'faults×patterns/s' },
      ratio: Math.round((fast / slow) * 10) / 10, note: `${faults.length} faults × ${blocks * 32 * W} patterns, 32 patterns per word, cone-only re-evaluation` },
  ];
}
