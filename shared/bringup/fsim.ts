/**
 * Bit-parallel fault simulation on the combinational model: 32 patterns per word, W words per net; the
 * fault-free circuit is evaluated once per block of patterns, then one fault at a time re-evaluates only
 * the gates in the fan-out cone of its pin (in evaluation order) and compares the lamps.
 */
import { OP, type Model } from './model';
import type { Fault } from './types';

/** Where a fault acts: a whole net forced (an output pin), one gate input forced, or one lamp input forced. */
export type Site =
  | { kind: 'net'; net: number; value: 0 | 1 }
  | { kind: 'pin'; gate: number; pin: number; value: 0 | 1 }
  | { kind: 'obs'; output: number; value: 0 | 1 }
  /** a pin the model does not evaluate (it reaches no lamp): never detected */
  | { kind: 'none'; value: 0 | 1 };

/** The site of each fault in the model. */
export function faultSites(model: Model, faults: Fault[]): Site[] {
  const gateOf = new Map(model.gates.map((g, i) => [g.part, i]));
  const outOf = new Map(model.outputs.map((o, i) => [o.part, i]));
  return faults.map((f): Site => {
    const p = model.netlist.partById(f.part)!;
    const outPin = p.outputPins.indexOf(f.pin);
    if (outPin >= 0) return { kind: 'net', net: p.outputs[outPin], value: f.value };
    const g = gateOf.get(f.part);
    if (g !== undefined) return { kind: 'pin', gate: g, pin: p.inputPins.indexOf(f.pin), value: f.value };
    const o = outOf.get(f.part);
    if (o !== undefined) return { kind: 'obs', output: o, value: f.value };
    return { kind: 'none', value: f.value };
  });
}

/** Evaluates gate g over W words of V into V[out]; input `fp` (−1: none) reads the word `fw` instead. */
export function evalGate(op: number, ins: Int32Array, out: number, V: Int32Array, W: number, fp: number, fw: number): void {
  const o = out * W;
  const k = ins.length;
  for (let j = 0; j < W; j++) {
    let v: number;
    switch (op) {
      case OP.buffer: case OP.not: {
        const a = fp === 0 ? fw : V[ins[0] * W + j];
        v = op === OP.not ? ~a : a;
        break;
      }
      case OP.and: case OP.nand: {
        v = -1;
        for (let i = 0; i < k; i++) v &= i === fp ? fw : V[ins[i] * W + j];
        if (op === OP.nand) v = ~v;
        break;
      }
      case OP.or: case OP.nor: {
        v = 0;
        for (let i = 0; i < k; i++) v |= i === fp ? fw : V[ins[i] * W + j];
        if (op === OP.nor) v = ~v;
        break;
      }
      case OP.xor: case OP.xnor: {
        v = 0;
        for (let i = 0; i < k; i++) v ^= i === fp ? fw : V[ins[i] * W + j];
        if (op === OP.xnor) v = ~v;
        break;
      }
      case OP.mux2: {
        const s = fp === 0 ? fw : V[ins[0] * W + j];
        const d0 = fp === 1 ? fw : V[ins[1] * W + j];
        const d1 = fp === 2 ? fw : V[ins[2] * W + j];
        v = (d0 & ~s) | (d1 & s);
        break;
      }
      default: {
        const r = (i: number) => (i === fp ? fw : V[ins[i] * W + j]);
        const s0 = r(0); const s1 = r(1);
        v = (~s1 & ((r(2) & ~s0) | (r(3) & s0))) | (s1 & ((r(4) & ~s0) | (r(5) & s0)));
      }
    }
    V[o + j] = v;
  }
}

/** A fault simulator for one model and block width. */
export class FaultSimulator {
  readonly good: Int32Array;
  private readonly bad: Int32Array;
  private readonly cones = new Map<number, Int32Array>();
  private readonly readers: number[][];

  constructor(readonly model: Model, readonly W: number) {
    this.good = new Int32Array(model.nNets * W);
    this.bad = new Int32Array(model.nNets * W);
    this.readers = Array.from({ length: model.nNets }, () => []);
    model.gates.forEach((g, gi) => { for (const n of new Set(g.ins)) this.readers[n].push(gi); });
    for (const f of model.fixed) this.good.fill(f.value ? -1 : 0, f.net * W, f.net * W + W);
  }

  /** Sets the inputs from words: `words[i][j]` is word j of input i (bit b = pattern 32·j + b). */
  load(words: Int32Array[]): void {
    const { W, good } = this;
    this.model.inputs.forEach((inp, i) => {
      for (const { net, invert } of inp.nets) for (let j = 0; j < W; j++) good[net * W + j] = invert ? ~words[i][j] : words[i][j];
    });
  }

  /** Loads patterns r0 … r0 + 32W − 1 of the counting order (first input = most significant bit). */
  loadCounting(r0: number): void {
    const n = this.model.inputs.length;
    const words = Array.from({ length: n }, (_, i) => {
      const s = n - 1 - i;
      return Int32Array.from({ length: this.W }, (_, j) => {
        let w = 0;
        for (let b = 0; b < 32; b++) if (((r0 + j * 32 + b) / 2 ** s) & 1) w |= 1 << b;
        return w;
      });
    });
    this.load(words);
  }

  /** Evaluates the fault-free circuit for the loaded block. */
  run(): void {
    const { W, good } = this;
    for (const g of this.model.gates) evalGate(g.op, g.ins, g.out, good, W, -1, 0);
    this.bad.set(good);
  }

  /** Gates in the fan-out cone of a net, in evaluation order. */
  private cone(net: number): Int32Array {
    let c = this.cones.get(net);
    if (c) return c;
    const mark = new Uint8Array(this.model.gates.length);
    const stack = [...this.readers[net]];
    while (stack.length) {
      const g = stack.pop()!;
      if (mark[g]) continue;
      mark[g] = 1;
      for (const r of this.readers[this.model.gates[g].out]) stack.push(r);
    }
    const list: number[] = [];
    mark.forEach((m, i) => { if (m) list.push(i); });
    c = Int32Array.from(list);
    this.cones.set(net, c);
    return c;
  }

  /**
   * Simulates one fault on the loaded block. Writes into `det` (W words) where it shows on some lamp, and,
   * when `outs` is given (outputs × W words), the faulty lamp words. Returns true when any pattern shows it.
   */
  simulate(site: Site, det: Int32Array, outs?: Int32Array): boolean {
    const { W, good, bad, model } = this;
    det.fill(0);
    if (site.kind === 'none') {
      if (outs) model.outputs.forEach((o, k) => outs.set(good.subarray(o.net * W, o.net * W + W), k * W));
      return false;
    }
    const fv = site.value ? -1 : 0;
    let cone: Int32Array | undefined;
    let forced = -1;
    if (site.kind === 'net') {
      forced = site.net;
      bad.fill(fv, forced * W, forced * W + W);
      cone = this.cone(forced);
    } else if (site.kind === 'pin') {
      const g = model.gates[site.gate];
      evalGate(g.op, g.ins, g.out, bad, W, site.pin, fv);
      forced = g.out;
      cone = this.cone(g.out);
    }
    if (cone) for (let c = 0; c < cone.length; c++) { const g = model.gates[cone[c]]; if (g.out !== forced) evalGate(g.op, g.ins, g.out, bad, W, -1, 0); }
    let any = 0;
    model.outputs.forEach((o, k) => {
      for (let j = 0; j < W; j++) {
        const b = site.kind === 'obs' && site.output === k ? fv : bad[o.net * W + j];
        det[j] |= b ^ good[o.net * W + j];
        if (outs) outs[k * W + j] = b;
      }
    });
    for (let j = 0; j < W; j++) any |= det[j];
    if (forced >= 0) {
      bad.set(good.subarray(forced * W, forced * W + W), forced * W);
      if (cone) for (let c = 0; c < cone.length; c++) { const o = model.gates[cone[c]].out * W; bad.set(good.subarray(o, o + W), o); }
    }
    return any !== 0;
  }

  /** The fault-free lamp words (outputs × W). */
  goodOutputs(): Int32Array {
    const { W } = this;
    const out = new Int32Array(this.model.outputs.length * W);
    this.model.outputs.forEach((o, k) => out.set(this.good.subarray(o.net * W, o.net * W + W), k * W));
    return out;
  }
}

/** Packs vectors (one 0/1 per input each) into input words for FaultSimulator.load, W words per input. */
export function packVectors(vectors: ArrayLike<number>[], nInputs: number, W: number): Int32Array[] {
  const words = Array.from({ length: nInputs }, () => new Int32Array(W));
  vectors.forEach((v, p) => { for (let i = 0; i < nInputs; i++) if (v[i]) words[i][p >> 5] |= 1 << (p & 31); });
  return words;
}

/** Bit p of a word array. */
export function bit(words: ArrayLike<number>, p: number): number {
  return (words[p >> 5] >>> (p & 31)) & 1;
}
