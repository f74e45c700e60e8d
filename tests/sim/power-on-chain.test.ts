/**
 * Power-on resolution of a long chain of gate loops (decision 002): a 64-stage shift register of six-NAND
 * D flip-flops, where a stage's loops can only be resolved once the stage before has its level, so the
 * simulator goes through one power-on round per stage. The expected states are derived here from the
 * documented rule (in every loop whose entering nets all read 0 or 1, the X net whose driver is listed
 * first powers on low; a chosen level holds against X) and the NAND truth table (IEEE Std 1364 `nand`
 * primitive: a 0 input gives 1 whatever the others are).
 * Per-stage states with CLK = 0 (011101 for D = 0, 111001 for D = 1): NJIT Digital Commons
 * "dld-animations" 84, Fig. 6.18, 2023 (the structure of the 7474 logic diagram).
 * Shifting: each rising clock edge moves every stage's Q into the next stage (common practice, no source).
 */
import { describe, expect, it } from 'vitest';
import { compileBoard, Simulator } from '../../shared/sim';
import { BoardBuilder } from './board-builder';

const STAGES = 64;

/** Stage s: gates s{s}g1 … s{s}g6 wired as tests/sim/circuits.ts sixNandDff; D of stage s + 1 is Q (g5) of s. */
function shiftRegister(d: boolean, clk: boolean): BoardBuilder {
  const b = new BoardBuilder('ideal', 'Room 14 shift register').switch('d', 'D', d).switch('clk', 'CLK', clk);
  let data = 'd.out';
  for (let s = 0; s < STAGES; s++) {
    const g = (k: number) => `s${s}g${k}`;
    b.gate(g(1), 'nand', [`${g(2)}.out`, `${g(4)}.out`]);
    b.gate(g(2), 'nand', [`${g(1)}.out`, 'clk.out']);
    b.gate(g(3), 'nand', ['clk.out', `${g(2)}.out`, `${g(4)}.out`]);
    b.gate(g(4), 'nand', [data, `${g(3)}.out`]);
    b.gate(g(5), 'nand', [`${g(2)}.out`, `${g(6)}.out`]);
    b.gate(g(6), 'nand', [`${g(3)}.out`, `${g(5)}.out`]);
    data = `${g(5)}.out`;
  }
  return b.lamp('q', 'Q', data);
}

/** G1…G6 of every stage, as strings of 0/1/X. */
function stageStates(sim: Simulator): string[] {
  return Array.from({ length: STAGES }, (_, s) => [1, 2, 3, 4, 5, 6].map((k) => sim.pinLevel(`s${s}g${k}`, 'out')).join(''));
}

function setUp(d: boolean, clk: boolean) {
  const netlist = compileBoard(shiftRegister(d, clk).board());
  const sim = new Simulator(netlist);
  const netName = (id: string) => netlist.nets[netlist.netOf(id, 'out')].name;
  return { sim, report: sim.settle(), netName };
}

describe('power-on of a 64-stage six-NAND shift register', () => {
  it('CLK = 0: G2 = G3 = 1, G4 = ¬D, G1 = D; every output loop is fed by known G2, G3, so each G5 is chosen low at once', () => {
    for (const d of [false, true]) {
      const { sim, report, netName } = setUp(d, false);
      // stage 0 reads the switch; every later stage reads Q = 0 of the stage before
      const expected = Array.from({ length: STAGES }, (_, s) => {
        const ds = s === 0 && d ? 1 : 0;
        return `${ds}11${1 - ds}01`;
      });
      expect(report.settled).toBe(true);
      expect(stageStates(sim)).toEqual(expected);
      expect(expected[0]).toBe(d ? '111001' : '011101'); // the published states
      expect(report.powerOn).toEqual(Array.from({ length: STAGES }, (_, s) => netName(`s${s}g5`)));
      expect(sim.outputValues()).toEqual({ Q: '0' });
    }
  });

  it('CLK = 1, D = 0: G4 = 1; each stage\'s input loop waits for the stage before, then G1 is chosen low (one round per stage)', () => {
    const { sim, report, netName } = setUp(false, true);
    // G1 = 0 chosen → G2 = NAND(0, 1) = 1 → G3 = NAND(1, 1, 1) = 0 → G6 = NAND(0, ·) = 1 → G5 = NAND(1, 1) = 0
    expect(report.settled).toBe(true);
    expect(stageStates(sim)).toEqual(Array.from({ length: STAGES }, () => '010101'));
    expect(report.powerOn).toEqual(Array.from({ length: STAGES }, (_, s) => netName(`s${s}g1`)));
  });

  it('CLK = 1, D = 1: stage 0 needs two choices (G1, then G3 of the G3–G4 loop left at X), the others one each', () => {
    const { sim, report, netName } = setUp(true, true);
    // stage 0: G1 = 0 held → G2 = 1, G3 = ¬G4 and G4 = ¬G3 still X → G3 = 0 chosen → G4 = 1, G6 = 1, G5 = 0
    expect(report.settled).toBe(true);
    expect(stageStates(sim)).toEqual(Array.from({ length: STAGES }, () => '010101'));
    expect(report.powerOn).toEqual([netName('s0g1'), netName('s0g3'), ...Array.from({ length: STAGES - 1 }, (_, s) => netName(`s${s + 1}g1`))]);
  });

  it('after power-on with CLK = 0, each rising edge shifts D = 1 one stage further', () => {
    const { sim } = setUp(true, false);
    const qs = () => Array.from({ length: STAGES }, (_, s) => sim.pinLevel(`s${s}g5`, 'out')).join('');
    for (let edges = 1; edges <= 3; edges++) {
      sim.setInput('clk', 1);
      expect(sim.settle().settled).toBe(true);
      sim.setInput('clk', 0);
      expect(sim.settle().settled).toBe(true);
      expect(qs()).toBe('1'.repeat(edges) + '0'.repeat(STAGES - edges));
    }
  });
});
