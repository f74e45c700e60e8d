import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { levelise } from '../../shared/analysis';
import { tableCone } from '../../shared/analysis/cone';
import { compileBoard, type Netlist } from '../../shared/sim';
import { BoardBuilder } from '../sim/board-builder';
import { randomSequentialCircuit } from '../helpers/module-split';
import { randomBoardArb } from './random-board';

/**
 * Reference: `levelise` (Kahn's algorithm over the whole board plus one strongly-connected-components
 * pass, itself checked in levelise.test.ts). The cone's depth-first pass must say the same of every
 * lamp: stateful or not; and for the combinational ones list a fan-in in which every part comes after
 * the single drivers of its inputs.
 */
function expectSameAsLevelise(netlist: Netlist): void {
  const nets = netlist.outputs.map((o) => o.inputs[0]);
  const cone = tableCone(netlist, nets);
  const lev = levelise(netlist);
  expect(Array.from(cone.stateful)).toEqual(nets.map((n) => lev.stateful[n]));
  const at = new Map<number, number>();
  cone.order.forEach((p, i) => at.set(p, i));
  for (const [i, p] of cone.order.entries()) {
    for (const net of netlist.parts[p].inputs) {
      const d = cone.driver[net];
      if (d >= 0 && at.has(d)) expect(at.get(d)!).toBeLessThan(i);
    }
  }
  // every combinational part driving a clean output's net (directly) is in the order
  nets.forEach((net, i) => {
    const d = cone.driver[net];
    if (!cone.stateful[i] && d >= 0 && cone.kindClass[d] === 1) expect(at.has(d)).toBe(true);
  });
}

/** Gates reading any switch or gate output: loops wherever a gate reads a later one. */
function loopBoard(nIn: number, specs: [number, number, number][], lamps: number[]): BoardBuilder {
  const kinds = ['and', 'or', 'nand', 'nor', 'xor', 'xnor', 'not', 'buffer'];
  const b = new BoardBuilder();
  for (let i = 0; i < nIn; i++) b.switch(`s${i}`, `S${i}`);
  const all = nIn + specs.length;
  const source = (k: number) => (k % all < nIn ? `s${k % all}.out` : `g${k % all - nIn}.out`);
  specs.forEach(([kind, a, c], g) => {
    const kd = kinds[kind % kinds.length];
    b.gate(`g${g}`, kd, kd === 'not' || kd === 'buffer' ? [source(a)] : [source(a), source(c)]);
  });
  lamps.forEach((k, i) => b.part({ id: `l${i}`, kind: 'lamp', label: `L${i}` }).wire(source(k), `l${i}.in`));
  return b;
}

describe('truth-table cone', () => {
  it('agrees with levelise on random boards with feedback loops', () => {
    const arb = fc.tuple(fc.integer({ min: 1, max: 3 }), fc.array(fc.tuple(fc.nat(), fc.nat(), fc.nat()), { minLength: 1, maxLength: 30 }),
      fc.array(fc.nat(), { minLength: 1, maxLength: 5 }));
    fc.assert(fc.property(arb, ([nIn, specs, lamps]) => expectSameAsLevelise(compileBoard(loopBoard(nIn, specs, lamps).board()))), { numRuns: 300 });
  });

  it('agrees with levelise on boards with two drivers on a net and open inputs', () => {
    fc.assert(fc.property(randomBoardArb({ loose: true, conflicts: true }), (board) => expectSameAsLevelise(compileBoard(board))), { numRuns: 200 });
  });

  it('agrees with levelise on random circuits with flip-flops', () => {
    fc.assert(fc.property(fc.record({ seed: fc.integer(), inputs: fc.integer({ min: 1, max: 6 }), gates: fc.integer({ min: 4, max: 60 }), flipFlops: fc.integer({ min: 1, max: 3 }) }),
      (o) => expectSameAsLevelise(compileBoard(randomSequentialCircuit(o)))), { numRuns: 100 });
  });
});
