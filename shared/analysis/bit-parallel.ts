import { isInputKind, type Part } from '../board';
import type { CompiledPart, Level, Netlist } from '../sim';
import type { Levelised } from './levelise';

/**
 * Bit-parallel evaluation of the combinational part of a netlist: 32 truth-table rows per Uint32 word,
 * four values in two bit-planes per net — T (surely 1) and F (surely 0); X is neither. Z exists only on
 * undriven nets, whose readers see the family's floating value; a net with two drivers reads X. The
 * rules are those of the event simulator (a controlling value wins over X; any X or Z otherwise gives X).
 */
export class BitParallelEvaluator {
  private readonly nNets: number;
  private readonly inputShift = new Map<number, number>();
  private readonly fixed: { net: number; t: number; f: number }[] = [];

  constructor(
    private readonly netlist: Netlist,
    private readonly lev: Levelised,
    /** the enumerated input parts, first = most significant */
    private readonly inputs: CompiledPart[],
    floating: Level,
  ) {
    this.nNets = netlist.nets.length;
    const k = inputs.length;
    inputs.forEach((p, i) => this.inputShift.set(p.index, k - 1 - i));
    const fl = planesOf(floating);
    for (const id of netlist.undriven) this.fixed.push({ net: id, ...fl });
    for (const id of netlist.conflicts) this.fixed.push({ net: id, t: 0, f: 0 });
    for (const p of netlist.parts) {
      if (!isInputKind(p.kind) || this.inputShift.has(p.index)) continue;
      const v = sourceBit(p.part);
      p.outputs.forEach((net, pin) => { if (netlist.nets[net].drivers.length === 1) this.fixed.push({ net, ...planesOf(pin === 0 ? v : v === '1' ? '0' : '1') }); });
    }
  }

  /**
   * Evaluates words [w0, w0 + count) — rows 32·w0 … — and returns the planes of every net:
   * T[net * count + j], F[net * count + j].
   */
  evaluate(w0: number, count: number): { T: Uint32Array; F: Uint32Array } {
    const T = new Uint32Array(this.nNets * count);
    const F = new Uint32Array(this.nNets * count);
    for (const fx of this.fixed) { T.fill(fx.t, fx.net * count, fx.net * count + count); F.fill(fx.f, fx.net * count, fx.net * count + count); }
    for (const p of this.inputs) {
      const s = this.inputShift.get(p.index)!;
      p.outputs.forEach((net, pin) => {
        if (this.netlist.nets[net].drivers.length !== 1) return;
        for (let j = 0; j < count; j++) {
          const word = inputWord(s, w0 + j);
          T[net * count + j] = pin === 0 ? word : ~word >>> 0;
          F[net * count + j] = pin === 0 ? ~word >>> 0 : word;
        }
      });
    }
    for (const p of this.lev.order) this.gate(p, T, F, count);
    return { T, F };
  }

  private gate(p: CompiledPart, T: Uint32Array, F: Uint32Array, W: number): void {
    const out = p.outputs[0];
    if (this.netlist.nets[out].drivers.length !== 1) return; // a conflict net stays X
    const o = out * W;
    const ins = p.inputs.map((n) => n * W);
    const n = ins.length;
    // the kind is decided once per part and chunk; the word loops stay free of branches and allocation
    switch (p.kind) {
      case 'buffer': case 'not': {
        const a = ins[0];
        const inv = p.kind === 'not';
        for (let j = 0; j < W; j++) { T[o + j] = inv ? F[a + j] : T[a + j]; F[o + j] = inv ? T[a + j] : F[a + j]; }
        return;
      }
      case 'and': case 'nand': case 'or': case 'nor': {
        // AND: T = ∧T, F = ∨F; OR is the dual; the inverted kinds swap the planes
        const isAnd = p.kind === 'and' || p.kind === 'nand';
        const inv = p.kind === 'nand' || p.kind === 'nor';
        const A = isAnd ? T : F;
        const B = isAnd ? F : T;
        const toA = (isAnd !== inv) ? T : F;
        const toB = toA === T ? F : T;
        for (let j = 0; j < W; j++) {
          let a = 0xffffffff;
          let b = 0;
          for (let i = 0; i < n; i++) { a &= A[ins[i] + j]; b |= B[ins[i] + j]; }
          toA[o + j] = a >>> 0;
          toB[o + j] = b >>> 0;
        }
        return;
      }
      case 'xor': case 'xnor': {
        const inv = p.kind === 'xnor' ? 0xffffffff : 0;
        for (let j = 0; j < W; j++) {
          let known = 0xffffffff;
          let v = inv;
          for (let i = 0; i < n; i++) { known &= T[ins[i] + j] | F[ins[i] + j]; v ^= T[ins[i] + j]; }
          T[o + j] = (known & v) >>> 0;
          F[o + j] = (known & ~v) >>> 0;
        }
        return;
      }
      case 'mux2': case 'mux4': {
        // a data input counts when the select does not rule it out; all counted must agree
        const sels = p.kind === 'mux2' ? 1 : 2;
        for (let j = 0; j < W; j++) {
          let t = 0xffffffff;
          let f = 0xffffffff;
          for (let d = 0; d < 1 << sels; d++) {
            let ruledOut = 0;
            for (let b = 0; b < sels; b++) ruledOut |= d & (1 << b) ? F[ins[b] + j] : T[ins[b] + j];
            t &= ruledOut | T[ins[sels + d] + j];
            f &= ruledOut | F[ins[sels + d] + j];
          }
          T[o + j] = t >>> 0;
          F[o + j] = f >>> 0;
        }
        return;
      }
      default:
        throw new Error(`not combinational: ${p.kind}`);
    }
  }
}

/** Word w of the pattern of the input with shift s (its bit in the row number). */
function inputWord(s: number, w: number): number {
  if (s < 5) return [0xaaaaaaaa, 0xcccccccc, 0xf0f0f0f0, 0xff00ff00, 0xffff0000][s];
  return (w >>> (s - 5)) & 1 ? 0xffffffff : 0;
}

function planesOf(v: Level): { t: number; f: number } {
  return v === '1' ? { t: 0xffffffff, f: 0 } : v === '0' ? { t: 0, f: 0xffffffff } : { t: 0, f: 0 };
}

/** The board value of an input part (a clock rests low). */
export function sourceBit(part: Part): Level {
  switch (part.kind) {
    case 'switch': return part.on ? '1' : '0';
    case 'button': return part.pressed ? '1' : '0';
    case 'const': return part.value === 1 ? '1' : '0';
    default: return '0';
  }
}
