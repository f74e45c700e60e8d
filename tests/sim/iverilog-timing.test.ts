/**
 * Timing cross-check against Icarus Verilog (an independent IEEE Std 1364 event-driven simulator): the
 * netlist exported with its delays (`#(t_PLH, t_PHL)` on every primitive) shows the same changes at the
 * same times as Gatefold — ring oscillators (period 2·N·t_pd or N·(t_PLH + t_PHL): Rabaey et al.,
 * *Digital Integrated Circuits*, 2nd ed., 2003 — from memory), the SR NOR latch release race, and the
 * six-NAND D flip-flop trace (NJIT Digital Commons "dld-animations" 84, Fig. 6.18, 2023).
 */
import { describe, expect, it } from 'vitest';
import type { BoardFile } from '../../shared/board';
import { compileBoard, Simulator, toVerilog } from '../../shared/sim';
import { BoardBuilder } from './board-builder';
import { norSrLatch, ringOscillator, sixNandDff } from './circuits';
import { runIverilogTrace, type Stimulus } from './iverilog';

/** Gatefold's changes of the watched outputs (by label) under the same stimulus, as `NAME@time=level`. */
function gatefoldTrace(board: BoardFile, watch: string[], stimulus: Stimulus[], until: number): string[] {
  const netlist = compileBoard(board);
  const byLabel = new Map(netlist.parts.map((p) => [p.name, p]));
  // strict X at power-on, as Icarus Verilog has it (a gate loop stays X until it is loaded)
  const sim = new Simulator(netlist, { eventBudget: 1e9, powerOn: 'x' });
  const nets = new Map(watch.map((w) => { const p = byLabel.get(w)!; return [p.kind === 'lamp' || p.kind === 'probe' ? p.inputs[0] : p.outputs[0], w]; }));
  const seen: string[] = [];
  for (const s of stimulus.filter((s) => s.time === 0)) sim.setInput(byLabel.get(s.port)!.id, s.value);
  sim.onChange((time, net, level) => { const w = nets.get(net); if (w) seen.push(`${w}@${time}=${level}`); });
  for (const s of stimulus.filter((s) => s.time > 0).sort((a, b) => a.time - b.time)) {
    sim.runFor(s.time - sim.time, { clocks: false });
    sim.setInput(byLabel.get(s.port)!.id, s.value);
  }
  sim.runFor(until - sim.time, { clocks: false });
  return seen;
}

function crossCheck(board: BoardFile, inputs: string[], watch: string[], stimulus: Stimulus[], until: number): string[] {
  const ours = gatefoldTrace(board, watch, stimulus, until);
  const theirs = runIverilogTrace(toVerilog(board, compileBoard(board), { delays: true }), inputs, watch, stimulus, until);
  // Icarus reports the time-0 X → level of an input port as a change; Gatefold's inputs start at their level
  expect(theirs.filter((l) => !inputs.some((i) => l.startsWith(`${i}@0=`)))).toEqual(ours);
  return ours;
}

const rises = (trace: string[], name: string) => trace.filter((l) => l.startsWith(`${name}@`) && l.endsWith('=1')).map((l) => Number(/@(\d+)=/.exec(l)![1]));

describe('timing agrees with Icarus Verilog', () => {
  for (const [n, family] of [[3, 'ideal'], [5, 'ideal'], [3, 'ttl-74ls'], [5, 'cmos-4000b']] as const) {
    it(`ring oscillator of ${n} stages, family ${family}`, () => {
      const board = ringOscillator(n, new BoardBuilder(family, 'Ring')).board();
      const d = compileBoard(board).parts.find((p) => p.id === 'r0')!;
      const until = 40 * n * (d.rise + d.fall);
      const trace = crossCheck(board, ['EN'], ['Y'], [{ time: 0, port: 'EN', value: 0 }, { time: 10 * (d.rise + d.fall), port: 'EN', value: 1 }], until);
      const r = rises(trace, 'Y');
      expect(r.length).toBeGreaterThan(10);
      expect(new Set(r.slice(2).map((t, i) => t - r[i + 1]))).toEqual(new Set([n * (d.rise + d.fall)]));
    });
  }

  it('the SR NOR latch released from S = R = 1 oscillates in both simulators', () => {
    const board = norSrLatch(new BoardBuilder('ideal', 'Latch')).board();
    const stimulus: Stimulus[] = [
      { time: 0, port: 'S', value: 1 }, { time: 0, port: 'R', value: 1 },
      { time: 10, port: 'S', value: 0 }, { time: 10, port: 'R', value: 0 },
    ];
    const trace = crossCheck(board, ['S', 'R'], ['Q', 'QN'], stimulus, 30);
    expect(trace.filter((l) => l.startsWith('Q@')).length).toBeGreaterThan(15);
  });

  it('the six-NAND D flip-flop follows the published trace with unit delays', () => {
    const b = sixNandDff(new BoardBuilder('ideal', 'Six NAND'));
    for (const g of [1, 2, 3, 4]) b.lamp(`lg${g}`, `G${g}`, `g${g}.out`);
    const board = b.board();
    // prime with one clock at D = 0, then the trace: D↑, CLK↑, CLK↓, D↓, CLK↑ (20 time units apart)
    const steps: [string, 0 | 1][] = [['CLK', 1], ['CLK', 0], ['D', 1], ['CLK', 1], ['CLK', 0], ['D', 0], ['CLK', 1]];
    const stimulus: Stimulus[] = [{ time: 0, port: 'D', value: 0 }, { time: 0, port: 'CLK', value: 0 },
      ...steps.map(([port, value], k): Stimulus => ({ time: 20 * (k + 1), port, value }))];
    const watch = ['G1', 'G2', 'G3', 'G4', 'Q', 'QN'];
    const trace = crossCheck(board, ['D', 'CLK'], watch, stimulus, 20 * (steps.length + 1));
    // the state just before each next step, rebuilt from the change list
    const at = (t: number) => watch.map((w) => {
      const last = trace.filter((l) => l.startsWith(`${w}@`) && Number(/@(\d+)=/.exec(l)![1]) < t).at(-1);
      return last ? last.slice(-1) : 'X';
    }).join('');
    expect([60, 80, 100, 120, 140, 160].map(at)).toEqual(['011101', '111001', '101010', '111010', '011110', '010101']);
  });
});
