/**
 * Conversion to NOR-only or NAND-only: technology mapping of the decomposed logic, demand-driven by
 * polarity. Each signal is built once in the polarity its gate gives natively (a NOR gives an OR's
 * complement, a NOR of complemented inputs gives an AND…); the other polarity costs one shared inverter,
 * made only when something reads it, and a switch's complement pin (`outn`) stands in for an inverter.
 * So double inversions never appear, an inverter is shared by every reader, and single two-input gates
 * take no more gates than the minimum counts of CHECKS.md (Wikipedia "NOR logic", "NAND logic").
 * Storage parts become their gate circuits (NOR latch, four-NAND D latch, six-NAND D flip-flop), whose
 * power-on state is then that of a gate loop (decision 002), not the part's `init`.
 */
import { flattenBoard, isInputKind, isOutputKind, type BoardFile, type Part } from '../board';
import { decompose, type Lit, type SignalDef } from './decompose';
import { BuildError } from './values';

export type ConvertTarget = 'nor' | 'nand';

export interface ConvertOptions {
  /** use the complement pins (`outn`) of switches and buttons instead of inverters (default true) */
  complements?: boolean;
}

export interface ConvertResult {
  board: BoardFile;
  target: ConvertTarget;
  /** gates of the converted board, inverters (a gate with its inputs tied) included */
  gates: number;
  inverters: number;
  /** complement pins (`outn`) used instead of an inverter */
  complementsUsed: number;
  /** gate, multiplexer and storage parts of the board before conversion */
  partsBefore: number;
}

type Pol = 0 | 1;
type Net = string | null;

const GRID = 20;
const snap = (n: number) => Math.round(n / GRID) * GRID;

/** Converts a board to `target` gates only (see the module comment). */
export function convertBoard(hierarchical: BoardFile, target: ConvertTarget, opts: ConvertOptions = {}): ConvertResult {
  // the converted board is flat: one gate kind throughout, the instances' insides in place
  const board = flattenBoard(hierarchical);
  if (target !== 'nor' && target !== 'nand') throw new BuildError(`unknown target "${String(target)}" (nor or nand)`, { to: String(target) });
  const logicParts = board.parts.filter((p) => !isInputKind(p.kind) && !isOutputKind(p.kind) && p.kind !== 'note');
  if (!logicParts.length) throw new BuildError('nothing to convert: the board has no gates, multiplexers or storage parts', { parts: 'no logic' });
  const { netlist, defs, logicSignals } = decompose(board);
  const m = new Mapper(board, target, defs, opts.complements !== false);
  for (const out of netlist.outputs) {
    const net = m.get(`n${out.inputs[0]}`, 0);
    if (net) m.wire(net, `${out.id}.in`);
  }
  // logic that reaches no lamp or probe is kept too, in its cheapest polarity
  for (const s of logicSignals) if (!m.isBuilt(s)) m.get(s, m.cheapest(s));
  const kept = board.parts.filter((p) => isInputKind(p.kind) || isOutputKind(p.kind) || p.kind === 'note');
  return {
    board: {
      format: 'gatefold-board', version: 1,
      title: `${board.title} (${target.toUpperCase()} only)`.slice(0, 200),
      family: board.family,
      parts: [...kept, ...m.parts],
      wires: m.wires.map(([from, to], i) => ({ id: `w${i + 1}`, from, to })),
    },
    target, gates: m.parts.length, inverters: m.inverters, complementsUsed: m.complementsUsed.size, partsBefore: logicParts.length,
  };
}

class Mapper {
  readonly parts: Part[] = [];
  readonly wires: [string, string][] = [];
  inverters = 0;
  readonly complementsUsed = new Set<string>();
  private readonly memo = new Map<string, Net>();
  /** a signal's own gate (XOR structures: the polarity it came out in) */
  private readonly built = new Map<string, Pol>();
  private readonly used: Set<string>;
  private readonly placed = new Map<string, number>();
  private readonly at: Map<string, Part>;
  private nextId = 1;

  constructor(board: BoardFile, private readonly target: 'nor' | 'nand', private readonly defs: Map<string, SignalDef>, private readonly complements: boolean) {
    this.used = new Set(board.parts.map((p) => p.id));
    this.at = new Map(board.parts.map((p) => [p.id, p]));
  }

  wire(from: string, to: string): void {
    this.wires.push([from, to]);
  }

  isBuilt(sig: string): boolean {
    return this.built.has(sig) || this.memo.has(`${sig}|0`) || this.memo.has(`${sig}|1`);
  }

  /** The polarity a signal costs least in. */
  cheapest(sig: string): Pol {
    const def = this.def(sig);
    return def.t === 'node' ? this.nativePol(def) : 0;
  }

  private def(sig: string): SignalDef {
    const d = this.defs.get(sig);
    if (!d) throw new Error(`no signal ${sig}`);
    return d;
  }

  /** The polarity in which a node's own gate gives its signal (1: the complement). */
  private nativePol(d: Extract<SignalDef, { t: 'node' }>): Pol {
    const same = (this.target === 'nor') === (d.op === 'or');
    return ((d.inv ? 1 : 0) ^ (same ? 1 : 0)) as Pol;
  }

  /** A target gate of n inputs (n = 1: an inverter, its two inputs tied) placed beside `origin`. */
  private gate(origin: string, n: number): string {
    let id: string;
    do id = `${this.target}${this.nextId++}`; while (this.used.has(id));
    this.used.add(id);
    const k = this.placed.get(origin) ?? 0;
    this.placed.set(origin, k + 1);
    const o = this.at.get(origin);
    const x = snap((o?.x ?? 0) + (k % 3) * 60);
    const y = snap((o?.y ?? 0) + Math.floor(k / 3) * 80 + (k % 3) * 20);
    this.parts.push({ id, kind: this.target, inputs: Math.max(2, n), x, y } as Part);
    return id;
  }

  private connect(net: Net, gate: string, pins: number[]): void {
    if (net === null) return; // an undriven input stays undriven: it reads the family's floating value
    for (const k of pins) this.wire(net, `${gate}.in${k}`);
  }

  /** Is `sig` in polarity `pol` available without a new inverter? */
  private free(sig: string, pol: Pol, depth = 0): boolean {
    if (this.memo.has(`${sig}|${pol}`)) return true;
    const d = this.def(sig);
    switch (d.t) {
      case 'float': return pol === 0;
      case 'source': return pol === 0 || (this.complements && d.comp !== undefined);
      case 'alias': return depth < 64 && this.free(d.of.sig, (pol ^ (d.of.neg ? 1 : 0)) as Pol, depth + 1);
      case 'node': return this.nativePol(d) === pol;
      case 'xor': return this.built.get(sig) === pol;
    }
  }

  private lit(l: Lit, flip: number): Net {
    return this.get(l.sig, ((l.neg ? 1 : 0) ^ flip) as Pol);
  }

  /** The net carrying `sig` (pol 0) or its complement (pol 1), built on first demand. */
  get(sig: string, pol: Pol): Net {
    const key = `${sig}|${pol}`;
    if (this.memo.has(key)) return this.memo.get(key)!;
    const d = this.def(sig);
    switch (d.t) {
      case 'float':
        return pol === 0 ? null : this.invert(sig, pol, d.t);
      case 'source':
        if (pol === 0) return d.pin;
        if (this.complements && d.comp) {
          this.complementsUsed.add(d.comp);
          this.memo.set(key, d.comp);
          return d.comp;
        }
        return this.invert(sig, pol, d.origin);
      case 'alias': {
        const net = this.get(d.of.sig, (pol ^ (d.of.neg ? 1 : 0)) as Pol);
        this.memo.set(key, net);
        return net;
      }
      case 'node': {
        const native = this.nativePol(d);
        if (pol !== native) return this.invert(sig, pol, d.origin);
        const id = this.gate(d.origin, d.lits.length);
        const net = `${id}.out`;
        this.memo.set(key, net);
        this.built.set(sig, pol);
        // NOR of complements is an AND; NAND of complements is an OR
        const flip = (this.target === 'nor') === (d.op === 'and') ? 1 : 0;
        d.lits.forEach((l, k) => this.connect(this.lit(l, flip), id, d.lits.length === 1 ? [0, 1] : [k]));
        return net;
      }
      case 'xor': {
        const made = this.built.get(sig);
        if (made !== undefined) return this.invert(sig, pol, d.origin);
        return this.xor(sig, d, pol);
      }
    }
  }

  /** An inverter of the other polarity, shared by every later reader. */
  private invert(sig: string, pol: Pol, origin: string): Net {
    const id = this.gate(origin, 1);
    const net = `${id}.out`;
    this.memo.set(`${sig}|${pol}`, net);
    this.inverters++;
    this.connect(this.get(sig, (1 - pol) as Pol), id, [0, 1]);
    return net;
  }

  /**
   * XOR/XNOR of two literals: three gates when both polarities of both inputs are at hand (NOR: NOR(NOR(x',y'),
   * NOR(x,y)) = x⊕y; NAND: NAND(NAND(x,y'), NAND(x',y)) = x⊕y), else the four-gate structure on the
   * cheapest polarities (NOR gives XNOR(x,y), NAND gives XOR(x,y)), whichever costs fewer gates.
   */
  private xor(sig: string, d: Extract<SignalDef, { t: 'xor' }>, pol: Pol): Net {
    const inv = d.inv ? 1 : 0;
    const an = d.a.neg ? 1 : 0;
    const bn = d.b.neg ? 1 : 0;
    const cost = (l: Lit, q: number) => (this.free(l.sig, ((l.neg ? 1 : 0) ^ q) as Pol) ? 0 : 1);
    const costB = 3 + cost(d.a, 0) + cost(d.a, 1) + cost(d.b, 0) + cost(d.b, 1);
    let best = { qa: 0, qb: 0, p: 0 as Pol, cost: Infinity };
    for (const qa of [0, 1]) for (const qb of [0, 1]) {
      const p = (inv ^ qa ^ qb ^ (this.target === 'nor' ? 1 : 0)) as Pol;
      const c = 4 + cost(d.a, qa) + cost(d.b, qb) + (p === pol ? 0 : 1);
      if (c < best.cost) best = { qa, qb, p, cost: c };
    }
    const key = (p: Pol) => `${sig}|${p}`;
    if (costB < best.cost) {
      const q = pol ^ inv;
      const [g1, g2, out] = [this.gate(d.origin, 2), this.gate(d.origin, 2), this.gate(d.origin, 2)];
      this.memo.set(key(pol), `${out}.out`);
      this.built.set(sig, pol);
      const x = (c: number) => this.get(d.a.sig, (an ^ c) as Pol);
      const y = (c: number) => this.get(d.b.sig, (bn ^ q ^ c) as Pol);
      if (this.target === 'nor') {
        this.connect(x(1), g1, [0]); this.connect(y(1), g1, [1]);
        this.connect(x(0), g2, [0]); this.connect(y(0), g2, [1]);
      } else {
        this.connect(x(0), g1, [0]); this.connect(y(1), g1, [1]);
        this.connect(x(1), g2, [0]); this.connect(y(0), g2, [1]);
      }
      this.wire(`${g1}.out`, `${out}.in0`);
      this.wire(`${g2}.out`, `${out}.in1`);
      return `${out}.out`;
    }
    const [n1, n2, n3, n4] = [0, 1, 2, 3].map(() => this.gate(d.origin, 2));
    this.memo.set(key(best.p), `${n4}.out`);
    this.built.set(sig, best.p);
    const x = this.get(d.a.sig, (an ^ best.qa) as Pol);
    const y = this.get(d.b.sig, (bn ^ best.qb) as Pol);
    this.connect(x, n1, [0]); this.connect(y, n1, [1]);
    this.connect(x, n2, [0]); this.wire(`${n1}.out`, `${n2}.in1`);
    this.connect(y, n3, [0]); this.wire(`${n1}.out`, `${n3}.in1`);
    this.wire(`${n2}.out`, `${n4}.in0`); this.wire(`${n3}.out`, `${n4}.in1`);
    return best.p === pol ? `${n4}.out` : this.invert(sig, pol, d.origin);
  }
}
