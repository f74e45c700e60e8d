/**
 * Deterministic search for one fault's test (PODEM: decisions only on the inputs the builder sets,
 * three-valued implication of the fault-free and the faulty circuit, backtrack on a contradiction).
 * When every decision has been tried both ways without a test, no input setting detects the fault:
 * the search is the proof that it is undetectable.
 */
import { OP, type Model } from './model';
import type { Site } from './fsim';

const X = 2;

/** Three-valued gate evaluation; input `fp` reads `fv`. */
function eval3(op: number, ins: Int32Array, V: Int8Array, fp: number, fv: number): number {
  const r = (i: number) => (i === fp ? fv : V[ins[i]]);
  switch (op) {
    case OP.buffer: return r(0);
    case OP.not: { const a = r(0); return a === X ? X : 1 - a; }
    case OP.and: case OP.nand: case OP.or: case OP.nor: {
      const isAnd = op === OP.and || op === OP.nand;
      const c = isAnd ? 0 : 1;
      let unknown = false;
      let v = 1 - c;
      for (let i = 0; i < ins.length; i++) { const a = r(i); if (a === c) { v = c; unknown = false; break; } if (a === X) unknown = true; }
      if (unknown) return X;
      return op === OP.nand || op === OP.nor ? 1 - v : v;
    }
    case OP.xor: case OP.xnor: {
      let v = op === OP.xnor ? 1 : 0;
      for (let i = 0; i < ins.length; i++) { const a = r(i); if (a === X) return X; v ^= a; }
      return v;
    }
    case OP.mux2: {
      const s = r(0); const d0 = r(1); const d1 = r(2);
      if (s === 0) return d0;
      if (s === 1) return d1;
      return d0 === d1 ? d0 : X;
    }
    default: {
      const s0 = r(0); const s1 = r(1);
      const vals: number[] = [];
      for (let d = 0; d < 4; d++) if ((s0 === X || s0 === (d & 1)) && (s1 === X || s1 === (d >> 1))) vals.push(r(2 + d));
      return vals.every((v) => v === vals[0]) ? vals[0] : X;
    }
  }
}

export type SearchResult = { kind: 'test'; bits: Int8Array } | { kind: 'undetectable' } | { kind: 'gave-up' };

/** Searches a test for the fault at `site`; `limit` bounds the backtracks. Unset inputs in `bits` are 2. */
export function podem(model: Model, site: Site, limit = 20000): SearchResult {
  if (site.kind === 'none') return { kind: 'undetectable' };
  const { gates, inputs, nNets } = model;
  const good = new Int8Array(nNets);
  const bad = new Int8Array(nNets);
  const assign = new Int8Array(inputs.length).fill(X);
  const forcedNet = site.kind === 'net' ? site.net : -1;
  const pinGate = site.kind === 'pin' ? site.gate : -1;
  const pinIndex = site.kind === 'pin' ? site.pin : -1;
  const fv = site.value;
  const siteNet = site.kind === 'net' ? site.net : site.kind === 'pin' ? gates[site.gate].ins[site.pin] : model.outputs[site.output].net;

  const imply = () => {
    good.fill(X); bad.fill(X);
    for (const f of model.fixed) { good[f.net] = f.value; bad[f.net] = f.value; }
    inputs.forEach((inp, i) => {
      const a = assign[i];
      for (const { net, invert } of inp.nets) { const v = a === X ? X : invert ? 1 - a : a; good[net] = v; bad[net] = v; }
    });
    if (forcedNet >= 0) bad[forcedNet] = fv;
    for (let gi = 0; gi < gates.length; gi++) {
      const g = gates[gi];
      good[g.out] = eval3(g.op, g.ins, good, -1, 0);
      bad[g.out] = g.out === forcedNet ? fv : eval3(g.op, g.ins, bad, gi === pinGate ? pinIndex : -1, fv);
    }
  };
  const detected = () => model.outputs.some((o, k) => {
    const g = good[o.net];
    const b = site.kind === 'obs' && site.output === k ? fv : bad[o.net];
    return g !== X && b !== X && g !== b;
  });
  const isD = (net: number) => good[net] !== X && bad[net] !== X && good[net] !== bad[net];

  /** The next objective (net, value, plane), or null when this branch cannot lead to a test. */
  const objective = (): [number, number, Int8Array] | null => {
    const sg = good[siteNet];
    if (sg === fv) return null;
    if (sg === X) return [siteNet, 1 - fv, good];
    if (site.kind === 'obs') return null; // activated on a lamp input is detected already
    // D-frontier: an undecided gate with a fault effect on an input
    let best = -1;
    for (let gi = gates.length - 1; gi >= 0 && best < 0; gi--) {
      const g = gates[gi];
      if (good[g.out] !== X && bad[g.out] !== X) continue;
      for (let i = 0; i < g.ins.length; i++) {
        const eff = gi === pinGate && i === pinIndex ? good[g.ins[i]] !== X && good[g.ins[i]] !== fv : isD(g.ins[i]);
        if (eff) { best = gi; break; }
      }
    }
    if (best < 0) return null;
    const g = gates[best];
    const nc = g.op === OP.or || g.op === OP.nor ? 0 : 1;
    for (let i = 0; i < g.ins.length; i++) {
      const n = g.ins[i];
      if (best === pinGate && i === pinIndex) continue;
      if (good[n] === X) return [n, g.op <= OP.nor ? nc : g.op === OP.xor || g.op === OP.xnor ? 0 : 1, good];
    }
    for (let i = 0; i < g.ins.length; i++) if (bad[g.ins[i]] === X) return [g.ins[i], nc, bad];
    return null;
  };

  /** Walks an objective back to an input the builder sets: [input index, value]. */
  const backtrace = (net: number, v: number, plane: Int8Array): [number, number] | null => {
    for (let guard = 0; guard <= gates.length + 1; guard++) {
      const di = model.driverInput[net];
      if (di >= 0) return [di, model.driverInvert[net] ? 1 - v : v];
      const gi = model.driverGate[net];
      if (gi < 0) return null;
      const g = gates[gi];
      let next = -1;
      for (let i = 0; i < g.ins.length; i++) if (plane[g.ins[i]] === X) { next = g.ins[i]; break; }
      if (next < 0) return null;
      if (g.op === OP.not || g.op === OP.nand || g.op === OP.nor || g.op === OP.xnor) v = 1 - v;
      net = next;
    }
    return null;
  };

  const stack: { input: number; flipped: boolean }[] = [];
  let backtracks = 0;
  for (;;) {
    imply();
    if (detected()) return { kind: 'test', bits: assign.slice() };
    const obj = objective();
    let decision: [number, number] | null = null;
    if (obj) {
      decision = backtrace(obj[0], obj[1], obj[2]);
      if (!decision) { const free = assign.indexOf(X); if (free >= 0) decision = [free, obj[1]]; }
    }
    if (decision) {
      assign[decision[0]] = decision[1];
      stack.push({ input: decision[0], flipped: false });
      continue;
    }
    // backtrack: flip the latest decision not yet flipped
    for (;;) {
      const top = stack.pop();
      if (!top) return { kind: 'undetectable' };
      if (!top.flipped) {
        if (++backtracks > limit) return { kind: 'gave-up' };
        assign[top.input] = 1 - assign[top.input];
        stack.push({ input: top.input, flipped: true });
        break;
      }
      assign[top.input] = X;
    }
  }
}
