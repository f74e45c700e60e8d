import fc from 'fast-check';
import type { BoardFile, Part, Wire } from '../../shared/board';

const KINDS = ['and', 'or', 'nand', 'nor', 'xor', 'xnor', 'not', 'buffer', 'mux2', 'mux4'] as const;
type Kind = (typeof KINDS)[number];
const INPUT_PINS: Record<Kind, (n: number) => string[]> = {
  and: (n) => Array.from({ length: n }, (_, i) => `in${i}`), or: (n) => INPUT_PINS.and(n), nand: (n) => INPUT_PINS.and(n),
  nor: (n) => INPUT_PINS.and(n), xor: (n) => INPUT_PINS.and(n), xnor: (n) => INPUT_PINS.and(n),
  not: () => ['in0'], buffer: () => ['in0'], mux2: () => ['sel', 'd0', 'd1'], mux4: () => ['sel0', 'sel1', 'd0', 'd1', 'd2', 'd3'],
};

export interface RandomBoardOptions {
  maxInputs?: number;
  maxGates?: number;
  /** leave some gate and lamp inputs unconnected (undriven nets) */
  loose?: boolean;
  /**
   * with `loose`: leave open only the second and later inputs of AND/OR/NAND/NOR/XOR/XNOR gates, and
   * lamps. An event-driven Verilog simulator never evaluates a gate none of whose inputs ever changes
   * (it keeps its initial z), and passes a selected open multiplexer input on as z where we read X.
   */
  verilogSafe?: boolean;
  /** sometimes wire a second gate output onto a gate's input net (a conflict) */
  conflicts?: boolean;
}

/**
 * Random acyclic combinational boards: switches I0…, a constant, gates of every combinational kind
 * reading switches (either pin), the constant or earlier gates, and lamps O0… on random signals.
 */
export function randomBoardArb(opts: RandomBoardOptions = {}): fc.Arbitrary<BoardFile> {
  const maxInputs = opts.maxInputs ?? 6;
  const maxGates = opts.maxGates ?? 24;
  return fc.record({
    k: fc.integer({ min: 1, max: maxInputs }),
    gates: fc.array(fc.record({ kind: fc.constantFrom(...KINDS), n: fc.integer({ min: 2, max: 4 }), picks: fc.array(fc.nat(), { minLength: 6, maxLength: 6 }) }), { minLength: 1, maxLength: maxGates }),
    lamps: fc.array(fc.nat(), { minLength: 1, maxLength: 4 }),
    constValue: fc.constantFrom(0 as const, 1 as const),
    looseRoll: fc.array(fc.nat({ max: 19 }), { minLength: 64, maxLength: 64 }),
    conflictRoll: fc.nat({ max: 3 }),
  }).map(({ k, gates, lamps, constValue, looseRoll, conflictRoll }) => {
    const parts: Part[] = [];
    const wires: Wire[] = [];
    const sources: string[] = [];
    for (let i = 0; i < k; i++) {
      parts.push({ id: `s${i}`, kind: 'switch', label: `I${i}`, x: 0, y: 60 * i, on: false });
      sources.push(`s${i}.out`, `s${i}.outn`);
    }
    parts.push({ id: 'k', kind: 'const', label: 'K', value: constValue, x: 0, y: 60 * k });
    sources.push('k.out');
    let roll = 0;
    const loose = () => opts.loose === true && looseRoll[roll++ % looseRoll.length] === 0;
    gates.forEach((g, gi) => {
      const id = `g${gi}`;
      const base = { id, x: 150 + 100 * gi, y: 0 };
      if (g.kind === 'not' || g.kind === 'buffer' || g.kind === 'mux2' || g.kind === 'mux4') parts.push({ ...base, kind: g.kind });
      else parts.push({ ...base, kind: g.kind, inputs: g.n });
      INPUT_PINS[g.kind](g.n).forEach((pin, p) => {
        const mayOpen = !opts.verilogSafe || (p > 0 && g.kind !== 'not' && g.kind !== 'buffer' && g.kind !== 'mux2' && g.kind !== 'mux4');
        if (mayOpen && loose()) return;
        wires.push({ id: `w${gi}_${p}`, from: sources[g.picks[p] % sources.length], to: `${id}.${pin}` });
      });
      sources.push(`${id}.out`);
    });
    if (opts.conflicts && conflictRoll === 0) {
      // a second driver on gate g0's output net: an OR of two switch pins (no loop, since it reads only switches)
      parts.push({ id: 'gc', kind: 'or', inputs: 2, x: 150, y: 300 });
      wires.push({ id: 'wc0', from: sources[0], to: 'gc.in0' }, { id: 'wc1', from: sources[1], to: 'gc.in1' }, { id: 'wc', from: 'gc.out', to: 'g0.out' });
    }
    lamps.forEach((pick, li) => {
      parts.push({ id: `l${li}`, kind: 'lamp', label: `O${li}`, x: 2000, y: 60 * li });
      if (!loose()) wires.push({ id: `wl${li}`, from: sources[pick % sources.length], to: `l${li}.in` });
    });
    return { format: 'gatefold-board', version: 1, title: 'rc', family: 'ideal', parts, wires } satisfies BoardFile;
  });
}
