/**
 * Seeded random combinational circuits for tests and benchmarks (shared with the analysis tests).
 *
 * `randomCircuit(opts: RandomCircuitOptions): BoardFile` — a valid, acyclic board:
 * - switches `i0…` labelled `I0…` (`inputs`, default 4), in file order;
 * - `gates` gates `g0…` (default 40) of `kinds` (default all gates plus NOT and buffer), each with
 *   2…`maxFanIn` inputs (default 3) taken from the inputs and earlier gates (mostly recent ones, so
 *   the circuit has depth); mux2 / mux4 may be listed in `kinds` too;
 * - lamps `o0…` labelled `O0…` (`outputs`, default 4) on the last gates;
 * - the same `seed` always gives the same board (mulberry32).
 */
import { BoardFileSchema, type BoardFile, type FamilyId } from '../../shared/board';
import { mulberry32 } from '../../shared/sim';

export type RandomKind = 'and' | 'or' | 'nand' | 'nor' | 'xor' | 'xnor' | 'not' | 'buffer' | 'mux2' | 'mux4';

export interface RandomCircuitOptions {
  seed: number;
  inputs?: number;
  gates?: number;
  outputs?: number;
  kinds?: RandomKind[];
  maxFanIn?: number;
  family?: FamilyId;
  title?: string;
}

const DEFAULT_KINDS: RandomKind[] = ['and', 'or', 'nand', 'nor', 'xor', 'xnor', 'not', 'buffer'];
const PINS: Partial<Record<RandomKind, string[]>> = { mux2: ['sel', 'd0', 'd1'], mux4: ['sel0', 'sel1', 'd0', 'd1', 'd2', 'd3'] };

/** A random acyclic board (see the module comment). */
export function randomCircuit(opts: RandomCircuitOptions): BoardFile {
  const rnd = mulberry32(opts.seed);
  const nIn = opts.inputs ?? 4;
  const nGates = opts.gates ?? 40;
  const nOut = Math.min(opts.outputs ?? 4, nGates);
  const kinds = opts.kinds ?? DEFAULT_KINDS;
  const maxFanIn = Math.max(2, opts.maxFanIn ?? 3);
  const pick = (n: number) => Math.floor(rnd() * n);
  const parts: Record<string, unknown>[] = [];
  const wires: { id: string; from: string; to: string }[] = [];
  const signals: string[] = [];
  for (let i = 0; i < nIn; i++) {
    parts.push({ id: `i${i}`, kind: 'switch', label: `I${i}`, x: 0, y: i * 60, on: false });
    signals.push(`i${i}.out`);
  }
  // a source: three times in four one of the last 8 signals, else any
  const source = () => (rnd() < 0.75 ? signals[signals.length - 1 - pick(Math.min(8, signals.length))] : signals[pick(signals.length)]);
  for (let g = 0; g < nGates; g++) {
    const kind = kinds[pick(kinds.length)];
    const id = `g${g}`;
    let pins: string[];
    if (kind === 'not' || kind === 'buffer') {
      parts.push({ id, kind, x: 100 + (g % 50) * 40, y: Math.floor(g / 50) * 60 });
      pins = ['in0'];
    } else if (PINS[kind]) {
      parts.push({ id, kind, x: 100 + (g % 50) * 40, y: Math.floor(g / 50) * 60 });
      pins = PINS[kind]!;
    } else {
      const n = 2 + pick(maxFanIn - 1);
      parts.push({ id, kind, inputs: n, x: 100 + (g % 50) * 40, y: Math.floor(g / 50) * 60 });
      pins = Array.from({ length: n }, (_, k) => `in${k}`);
    }
    for (const pin of pins) wires.push({ id: `w${wires.length}`, from: source(), to: `${id}.${pin}` });
    signals.push(`${id}.out`);
  }
  for (let o = 0; o < nOut; o++) {
    parts.push({ id: `o${o}`, kind: 'lamp', label: `O${o}`, x: 2200, y: o * 60 });
    wires.push({ id: `w${wires.length}`, from: `g${nGates - nOut + o}.out`, to: `o${o}.in` });
  }
  return BoardFileSchema.parse({
    format: 'gatefold-board', version: 1, title: opts.title ?? `Random circuit ${opts.seed}`, family: opts.family ?? 'ideal', parts, wires,
  });
}
