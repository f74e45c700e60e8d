/**
 * compileBoard lays a board with modules out per module (shared/sim/compile-levels.ts) instead of
 * compiling flattenBoard's flat board; the netlist must be the one of the flat board, field for field —
 * parts, path ids, pins, nets, net names, problems, netOf and partById — on random module splits of
 * random circuits, on the demo processor, and on broken splits that the fast way hands to the flattening.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { flattenBoard, type BoardFile, type Part, type Wire } from '../../shared/board';
import { compileBoard, mulberry32, type Netlist } from '../../shared/sim';
import { moduleLayout } from '../../shared/sim/compile-levels';
import { randomCircuit } from '../helpers/random-circuit';
import { randomSequentialCircuit, splitIntoModules } from '../helpers/module-split';
import { buildOneBitProcessor } from '../helpers/one-bit-processor';

/** Everything a netlist tells, as plain data (errors as their message). */
function view(netlist: Netlist) {
  const attempt = <T,>(f: () => T): T | string => { try { return f(); } catch (e) { return (e as Error).message; } };
  return {
    parts: netlist.parts.map((p) => ({ ...p, part: JSON.stringify(p.part) })),
    nets: netlist.nets.map((n) => ({ ...n })),
    inputs: netlist.inputs.map((p) => p.index), outputs: netlist.outputs.map((p) => p.index),
    undriven: netlist.undriven, conflicts: netlist.conflicts, problems: netlist.problems, family: netlist.family,
    board: JSON.stringify(netlist.board),
    netOf: netlist.parts.flatMap((p) => [...p.inputPins, ...p.outputPins, 'nope'].map((pin) => attempt(() => netlist.netOf(p.id, pin)))),
    partById: [...netlist.parts.map((p) => p.id), 'nope'].map((id) => netlist.partById(id)?.index),
  };
}

/** The netlist of the flat board, or the error the flattening gives. */
const reference = (board: BoardFile) => { try { return view(compileBoard(flattenBoard(board))); } catch (e) { return (e as Error).message; } };
const ours = (board: BoardFile) => { try { return view(compileBoard(board)); } catch (e) { return (e as Error).message; } };

/** A small change a half-finished edit could leave: a repeated id, a wire to a missing pin, a stray port… */
function damage(board: BoardFile, rnd: () => number): BoardFile {
  const out = structuredClone(board);
  const levels: { parts: Part[]; wires: Wire[] }[] = [out, ...(out.modules ?? [])];
  const level = levels[Math.floor(rnd() * levels.length)];
  const pick = <T,>(xs: T[]): T | undefined => xs[Math.floor(rnd() * xs.length)];
  const part = pick(level.parts);
  const wire = pick(level.wires);
  switch (Math.floor(rnd() * 9)) {
    case 0: if (part) level.parts.push({ ...part }); break;
    case 1: if (wire) wire.to = wire.to.replace(/\.[^.]*$/, '.zz'); break;
    case 2: level.parts.push({ id: 'pp', kind: 'port', dir: 'in', label: 'PX', x: 0, y: 0 }); break;
    case 3: { const port = pick(level.parts.filter((p) => p.kind === 'port')); if (port) port.label = rnd() < 0.5 ? '' : level.parts.find((p) => p.kind === 'port')!.label; break; }
    case 4: { const inst = pick(level.parts.filter((p) => p.kind === 'module')); if (inst && inst.kind === 'module') inst.module = rnd() < 0.5 ? 'missing' : out.modules![0].id; break; }
    case 5: if (part) { level.parts.push({ id: 'lp', kind: 'lamp', label: 'LQ', x: 0, y: 0 }); level.wires.push({ id: 'wlp', from: `${part.id}.out`, to: 'lp.in' }); } break;
    case 6: if (part) { level.parts.push({ id: 'k1', kind: 'const', value: 1, label: 'KK', x: 0, y: 0 }); level.wires.push({ id: 'wk', from: 'k1.out', to: `${part.id}.in0` }); } break;
    case 7: if (part) part.id = 'a/b'; break;
    default: if (wire && level.wires.length > 1) wire.from = pick(level.wires)!.to; break;
  }
  return out;
}

function randomSplit(seed: number, splitSeed: number, splits: number, sequential: boolean): BoardFile {
  const flat = sequential
    ? randomSequentialCircuit({ seed, inputs: 3, gates: 20, outputs: 3, flipFlops: 3 })
    : randomCircuit({ seed, inputs: 4, gates: 24, outputs: 3, kinds: ['and', 'or', 'nand', 'nor', 'xor', 'not', 'mux2'] });
  return splitIntoModules(flat, splitSeed, splits);
}

describe('compileBoard of a board with modules', () => {
  it('gives the netlist of its flat board, laid out per module', () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 1_000_000 }), fc.integer({ min: 1, max: 1_000_000 }), fc.integer({ min: 1, max: 4 }), fc.boolean(), (seed, splitSeed, splits, sequential) => {
      const board = randomSplit(seed, splitSeed, splits, sequential);
      if (board.modules?.length) expect(moduleLayout(board)).not.toBeNull();
      expect(ours(board)).toEqual(reference(board));
    }), { numRuns: 150 });
  });

  it('gives the netlist of the flat 1-bit processor (modules nested, one used six times)', () => {
    const board = buildOneBitProcessor();
    expect(moduleLayout(board)).not.toBeNull();
    const netlist = compileBoard(board);
    expect(view(netlist)).toEqual(reference(board));
    // a signal inside an instance is named by its path
    expect(netlist.parts.some((p) => p.id.includes('/'))).toBe(true);
  });

  it('gives the same netlist or the same error as the flattening on damaged boards', () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 1_000_000 }), fc.integer({ min: 1, max: 1_000_000 }), fc.integer({ min: 1, max: 2 }), (seed, splitSeed, damages) => {
      const rnd = mulberry32(seed ^ splitSeed);
      let board = randomSplit(seed, splitSeed, 3, seed % 2 === 0);
      for (let i = 0; i < damages; i++) board = damage(board, rnd);
      expect(ours(board)).toEqual(reference(board));
    }), { numRuns: 200 });
  });
});
