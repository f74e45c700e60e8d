/**
 * Power-on resolution of gate loops (decision 002): a real node never stays unknown, so a loop whose X
 * only feeds itself picks a level at power-on; X from a real source of X is kept.
 * SR NOR latch behaviour: CHECKS.md "Sequential references" (textbook classic, common practice).
 * Ring oscillator: Rabaey et al., *Digital Integrated Circuits*, 2nd ed., 2003 — from memory.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { FamilyId } from '../../shared/board';
import { compileBoard, familyDelays, Simulator } from '../../shared/sim';
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

  it('the chosen level arrives after the gate\'s t_PHL, as an ordinary change (74LS delays)', () => {
    const d = familyDelays('ttl-74ls');
    const netlist = compileBoard(inverterRing(3, new BoardBuilder('ttl-74ls')).board());
    const sim = new Simulator(netlist, { eventBudget: 200 });
    const first: [number, string][] = [];
    const i0 = netlist.netOf('i0', 'out');
    sim.onChange((t, net, level) => { if (net === i0 && first.length < 2) first.push([t, level]); });
    sim.settle();
    // low after t_PHL; high again when the change has gone round: i1 rises, i2 falls, i0 rises
    expect(first[0]).toEqual([d.fall, '0']);
    expect(first[1]).toEqual([d.fall + d.rise + d.fall + d.rise, '1']);
  });

  it('a gate reading its own output keeps its chosen level while its other input is still X', () => {
    // G0 = OR(G3, G0), G3 = XOR(G0, S0): with S0 = 0 both levels are stable; the choice is 0
    const b = new BoardBuilder().switch('s0', 'S0');
    b.gate('g0', 'or', ['g3.out', 'g0.out']).gate('g3', 'xor', ['g0.out', 's0.out']);
    const sim = new Simulator(compileBoard(b.board()));
    const r = sim.settle();
    expect(r).toMatchObject({ settled: true, powerOn: ['g0_out'] });
    expect([sim.pinLevel('g0', 'out'), sim.pinLevel('g3', 'out')]).toEqual(['0', '0']);
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

/** A random board of up to 3 switches and gates reading any switch or gate output (so with feedback). */
function randomLoopBoard(nIn: number, specs: [number, number, number][], on: number): BoardBuilder {
  const kinds = ['and', 'or', 'nand', 'nor', 'xor', 'xnor', 'not', 'buffer'];
  const b = new BoardBuilder();
  const inputs = Math.min(nIn, 3);
  for (let i = 0; i < inputs; i++) b.switch(`s${i}`, `S${i}`, ((on >> i) & 1) === 1);
  const all = inputs + specs.length;
  const source = (k: number) => (k % all < inputs ? `s${k % all}.out` : `g${k % all - inputs}.out`);
  specs.forEach(([kind, a, c], g) => {
    const kd = kinds[kind % kinds.length];
    b.gate(`g${g}`, kd, kd === 'not' || kd === 'buffer' ? [source(a)] : [source(a), source(c)]);
  });
  return b;
}

const boardArgs = fc.tuple(fc.integer({ min: 1, max: 3 }), fc.array(fc.tuple(fc.nat(), fc.nat(), fc.nat()), { minLength: 1, maxLength: 30 }), fc.nat(7));

describe('power-on resolution on random boards with feedback (fast-check)', () => {
  // A gate with only 0/1 inputs gives 0/1 (IEEE Std 1364 primitive tables), so once no loop's X can
  // sustain itself a quiet board whose sources are all 0/1 has no X left (common practice, no source).
  it('a board that settles after power-on has no X net left, and the same board gives the same choice', () => {
    fc.assert(fc.property(boardArgs, ([nIn, specs, on]) => {
      const netlist = compileBoard(randomLoopBoard(nIn, specs, on).board());
      const sim = new Simulator(netlist, { eventBudget: 5000 });
      const r = sim.settle();
      const again = new Simulator(netlist, { eventBudget: 5000 }).settle();
      expect(again.powerOn).toEqual(r.powerOn);
      if (!r.settled) return;
      const x = netlist.nets.filter((n) => n.drivers.length > 0 && sim.level(n.id) === 'X').map((n) => n.name);
      expect(x).toEqual([]);
    }), { numRuns: 300, seed: 11 });
  });
});

describe('feedback loop finder (iterative Tarjan)', () => {
  it('finds the same loops as mutual reachability on random gate boards with feedback (fast-check)', () => {
    fc.assert(fc.property(boardArgs, ([nIn, specs, on]) => {
      const b = randomLoopBoard(nIn, specs, on);
      const netlist = compileBoard(b.board());
      const lay = buildLayout(netlist.parts, netlist.nets.length);
      const gate = Uint8Array.from(netlist.parts, (p) => (p.kind === 'switch' ? 0 : 1));
      const loops = findFeedbackLoops(lay, gate, netlist.nets.length);
      const ours = Array.from({ length: loops.count }, (_, k) => [...loops.loopNet.slice(loops.loopStart[k], loops.loopStart[k + 1])].sort((x, y) => x - y).join(',')).sort();
      expect(ours).toEqual(loopsByReachability(netlist));
    }), { numRuns: 300, seed: 7 });
  });
});
