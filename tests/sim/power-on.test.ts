/**
 * Power-on resolution of gate loops (decision 002): a real node never stays unknown, so a loop whose X
 * only feeds itself picks a level at power-on; X from a real source of X is kept.
 * SR NOR latch behaviour: CHECKS.md "Sequential references" (textbook classic, common practice).
 * Ring oscillator: Rabaey et al., *Digital Integrated Circuits*, 2nd ed., 2003 — from memory.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { FamilyId } from '../../shared/board';
import { compileBoard, Simulator } from '../../shared/sim';
import { buildLayout } from '../../shared/sim/layout';
import { findFeedbackLoops } from '../../shared/sim/loops';
import { BoardBuilder } from './board-builder';
import { inverterRing, norSrLatch } from './circuits';

/** A NOR latch whose R input (n1.in0) is left open. */
function latchWithOpenR(family: FamilyId): Simulator {
  const b = new BoardBuilder(family).switch('s', 'S');
  b.part({ id: 'n1', kind: 'nor', inputs: 2 }).wire('n2.out', 'n1.in1');
  b.gate('n2', 'nor', ['s.out', 'n1.out']);
  b.lamp('q', 'Q', 'n1.out').lamp('qn', 'QN', 'n2.out');
  return new Simulator(compileBoard(b.board()));
}

describe('power-on resolution', () => {
  it('keeps X that comes from an open input of the ideal family (it reads X)', () => {
    const sim = latchWithOpenR('ideal');
    const r = sim.settle();
    expect(r.powerOn).toEqual([]);
    expect(r.undrivenInputs).toEqual(['n1.in0']);
    expect(sim.outputValues()).toEqual({ Q: 'X', QN: 'X' });
  });

  it('resolves the same latch where the open input reads a level (CMOS pull-down 0; TTL reads 1 — from memory)', () => {
    const cmos = latchWithOpenR('cmos-74hc');
    expect(cmos.settle().powerOn).toEqual(['Q']);
    expect(cmos.outputValues()).toEqual({ Q: '0', QN: '1' });
    // an open TTL input reads high: R = 1 resets the latch, nothing to choose
    const ttl = latchWithOpenR('ttl-74ls');
    expect(ttl.settle().powerOn).toEqual([]);
    expect(ttl.outputValues()).toEqual({ Q: '0', QN: '1' });
  });

  it('keeps X that comes from a conflict (two switches on S)', () => {
    const b = norSrLatch(new BoardBuilder().switch('s2', 'S2', true)).wire('s2.out', 's.out');
    const sim = new Simulator(compileBoard(b.board()));
    const r = sim.settle();
    expect(r.conflicts).toHaveLength(1);
    expect(r.powerOn).toEqual([]);
    expect(sim.outputValues()).toMatchObject({ Q: 'X', QN: 'X' });
  });

  it('resolves a loop fed by another loop once that one has its level', () => {
    // a ring of two inverters, and a NOR latch whose S is the ring's first net (low once resolved)
    const b = inverterRing(2);
    b.switch('r', 'R').gate('n1', 'nor', ['r.out', 'n2.out']).gate('n2', 'nor', ['i0.out', 'n1.out']);
    b.lamp('q', 'Q', 'n1.out').lamp('qn', 'QN', 'n2.out');
    const sim = new Simulator(compileBoard(b.board()));
    const r = sim.settle();
    expect(r.settled).toBe(true);
    expect(r.powerOn).toEqual(['i0_out', 'Q']);
    expect(sim.outputValues()).toEqual({ Y: '1', Q: '0', QN: '1' });
  });

  it('resolves a loop whose inputs become known only while another part of the board oscillates', () => {
    // S = Y xor Y is X until the ring has a level, then 0 for good; the ring never settles
    const b = inverterRing(3).gate('x', 'xor', ['i2.out', 'i2.out']);
    b.switch('r', 'R').gate('n1', 'nor', ['r.out', 'n2.out']).gate('n2', 'nor', ['x.out', 'n1.out']);
    b.lamp('q', 'Q', 'n1.out').lamp('qn', 'QN', 'n2.out');
    const sim = new Simulator(compileBoard(b.board()), { eventBudget: 500 });
    const r = sim.settle();
    expect(r.settled).toBe(false);
    expect(r.powerOn).toEqual(['i0_out', 'Q']);
    expect(r.oscillating).toContain('Y');
    expect(r.oscillating).not.toContain('Q');
    expect(sim.outputValues()).toMatchObject({ Q: '0', QN: '1' });
  });

  it('resolves independent loops on one board', () => {
    const b = norSrLatch(inverterRing(4));
    const sim = new Simulator(compileBoard(b.board()));
    expect(sim.settle()).toMatchObject({ settled: true, powerOn: ['i0_out', 'Q'] });
    expect(sim.outputValues()).toEqual({ Y: '1', Q: '0', QN: '1' });
  });

  it('powerOn: \'x\' leaves every loop at X', () => {
    const sim = new Simulator(compileBoard(norSrLatch().board()), { powerOn: 'x' });
    expect(sim.settle().powerOn).toEqual([]);
    expect(sim.outputValues()).toEqual({ Q: 'X', QN: 'X' });
  });
});

/**
 * Independent reference for the loop finder: two nets are in one loop when each reaches the other
 * through gates (the definition of a strongly connected component, common practice, no source), found
 * here by plain breadth-first search from every net.
 */
function loopsByReachability(netlist: ReturnType<typeof compileBoard>): string[] {
  const n = netlist.nets.length;
  const next: number[][] = netlist.nets.map(() => []);
  for (const p of netlist.parts) {
    if (!['and', 'or', 'nand', 'nor', 'xor', 'xnor', 'not', 'buffer'].includes(p.kind)) continue;
    for (const i of p.inputs) if (netlist.nets[i].drivers.length === 1) next[i].push(...p.outputs.filter((o) => netlist.nets[o].drivers.length === 1));
  }
  const reach = next.map((_, s) => {
    const seen = new Set<number>();
    const queue = [...next[s]];
    while (queue.length) { const v = queue.pop()!; if (seen.has(v)) continue; seen.add(v); queue.push(...next[v]); }
    return seen;
  });
  const groups = new Map<string, number[]>();
  for (let v = 0; v < n; v++) {
    if (!reach[v].has(v)) continue;
    const key = [...reach[v]].filter((w) => reach[w].has(v)).sort((a, b) => a - b).join(',');
    groups.set(key, key.split(',').map(Number));
  }
  return [...groups.keys()].sort();
}

describe('feedback loop finder (iterative Tarjan)', () => {
  it('finds the same loops as mutual reachability on random gate boards with feedback (fast-check)', () => {
    const kinds = ['and', 'or', 'nand', 'nor', 'xor', 'xnor', 'not', 'buffer'];
    fc.assert(fc.property(fc.integer({ min: 1, max: 30 }), fc.array(fc.tuple(fc.nat(), fc.nat(), fc.nat()), { minLength: 1, maxLength: 30 }), (nIn, specs) => {
      const b = new BoardBuilder();
      const inputs = Math.min(nIn, 3);
      for (let i = 0; i < inputs; i++) b.switch(`s${i}`);
      const sources = (k: number) => (k % (inputs + specs.length) < inputs ? `s${k % (inputs + specs.length)}.out` : `g${k % (inputs + specs.length) - inputs}.out`);
      specs.forEach(([kind, a, c], g) => {
        const kd = kinds[kind % kinds.length];
        b.gate(`g${g}`, kd, kd === 'not' || kd === 'buffer' ? [sources(a)] : [sources(a), sources(c)]);
      });
      const netlist = compileBoard(b.board());
      const lay = buildLayout(netlist.parts, netlist.nets.length);
      const gate = Uint8Array.from(netlist.parts, (p) => (p.kind === 'switch' ? 0 : 1));
      const loops = findFeedbackLoops(lay, gate, netlist.nets.length);
      const ours = Array.from({ length: loops.count }, (_, k) => [...loops.loopNet.slice(loops.loopStart[k], loops.loopStart[k + 1])].sort((x, y) => x - y).join(',')).sort();
      expect(ours).toEqual(loopsByReachability(netlist));
    }), { numRuns: 300, seed: 7 });
  });
});
