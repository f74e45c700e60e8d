/**
 * Boards with storage (built-in latches and flip-flops, or gates in a loop): a vector is a step of a
 * sequence applied from power-on. Each sequence starts at power-on with its first step's settings in
 * place; every step sets all the hand inputs, lets the board settle (shared/sim's event simulator) and
 * reads the lamps. Sequences are random walks that change one switch per step (as a builder would);
 * each is cut after the last step that first showed a fault.
 */
import type { BoardFile } from '../board';
import { compileBoard, mulberry32, Simulator, type Netlist } from '../sim';
import { withStuckPin } from './rewrite';
import type { ModelInput, ModelOutput } from './model';
import type { Fault, TestVector } from './types';

/** Lamp readings (one string per step, a character per output) of the board over the steps. */
export function runSteps(board: BoardFile | Netlist, inputs: ModelInput[], outputs: ModelOutput[], steps: number[][]): string[] {
  const netlist = 'nets' in board ? board : compileBoard(board);
  const sim = new Simulator(netlist);
  const out: string[] = [];
  for (const step of steps) {
    inputs.forEach((inp, i) => sim.setInput(inp.part, step[i] ? 1 : 0));
    sim.settle();
    out.push(outputs.map((o) => sim.level(netlist.netOf(o.part, 'in'))).join(''));
  }
  return out;
}

/** The lamp readings of a faulty board (see withStuckPin). */
export function runFaulty(board: BoardFile, netlist: Netlist, fault: Fault, inputs: ModelInput[], outputs: ModelOutput[], steps: number[][]): string[] {
  return runSteps(withStuckPin(board, netlist, fault.part, fault.pin, fault.value), inputs, outputs, steps);
}

/** True when two readings differ where both are 0 or 1. */
export function differs(a: string, b: string): boolean {
  for (let i = 0; i < a.length; i++) if ((a[i] === '0' || a[i] === '1') && (b[i] === '0' || b[i] === '1') && a[i] !== b[i]) return true;
  return false;
}

/** A random walk of `length` steps from all inputs off, one input changed per step. */
export function randomWalk(nInputs: number, length: number, random: () => number): number[][] {
  const steps: number[][] = [];
  let cur = new Array<number>(nInputs).fill(0);
  steps.push(cur.slice());
  for (let s = 1; s < length; s++) {
    cur = cur.slice();
    if (nInputs) cur[Math.floor(random() * nInputs)] ^= 1;
    steps.push(cur);
  }
  return steps;
}

export interface SequentialTests {
  vectors: TestVector[];
  detected: Set<number>;
  sequences: number[][][];
}

/** Random-walk sequences for the faults, each cut after its last first detection. */
export function sequentialTests(board: BoardFile, netlist: Netlist, faults: Fault[], candidates: number[], inputs: ModelInput[], outputs: ModelOutput[], seed = 1): SequentialTests {
  const random = mulberry32(seed);
  const left = new Set(candidates);
  const detected = new Set<number>();
  const sequences: number[][][] = [];
  const vectors: TestVector[] = [];
  const length = 32 + 16 * Math.min(inputs.length, 4);
  let idle = 0;
  for (let attempt = 0; attempt < 8 && left.size && idle < 3; attempt++) {
    const walk = randomWalk(inputs.length, length, random);
    const good = runSteps(board, inputs, outputs, walk);
    let last = -1;
    const found: number[] = [];
    for (const f of left) {
      const bad = runFaulty(board, netlist, faults[f], inputs, outputs, walk);
      const at = good.findIndex((g, s) => differs(g, bad[s]));
      if (at >= 0) { found.push(f); last = Math.max(last, at); }
    }
    if (!found.length) { idle++; continue; }
    idle = 0;
    for (const f of found) { left.delete(f); detected.add(f); }
    const seq = walk.slice(0, last + 1);
    const k = sequences.length;
    sequences.push(seq);
    seq.forEach((step, s) => vectors.push({ in: step.join(''), out: good[s], sequence: k, step: s }));
  }
  return { vectors, detected, sequences };
}
