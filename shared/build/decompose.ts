/**
 * A board as logic for technology mapping: every net driven by a gate, multiplexer or storage part
 * becomes an AND/OR node or a two-input XOR over literals (a signal or its complement), NOT and buffer
 * become aliases (a NOT costs nothing until someone needs the other polarity), inputs are sources
 * (with their complement pin `outn` when they have one).
 */
import { isInputKind, type BoardFile } from '../board';
import { compileBoard, type Netlist } from '../sim';
import { BuildError } from './values';

/** A signal or its complement. */
export interface Lit {
  sig: string;
  neg: boolean;
}

/** How a signal is made. `origin` is the board part it comes from (new gates are placed beside it). */
export type SignalDef =
  | { t: 'source'; pin: string; comp?: string; origin: string }
  | { t: 'float' }
  | { t: 'alias'; of: Lit; origin: string }
  | { t: 'node'; op: 'and' | 'or'; lits: Lit[]; inv: boolean; origin: string }
  | { t: 'xor'; a: Lit; b: Lit; inv: boolean; origin: string };

export interface Decomposed {
  netlist: Netlist;
  defs: Map<string, SignalDef>;
  /** signals of the nets that gates, multiplexers and storage parts drive, in file order */
  logicSignals: string[];
}

const lit = (sig: string, neg = false): Lit => ({ sig, neg });

/** Decomposes a board (see the module comment); a net with two drivers is a BuildError. */
export function decompose(board: BoardFile): Decomposed {
  const netlist = compileBoard(board);
  const defs = new Map<string, SignalDef>();
  const sig = (net: number) => `n${net}`;
  let virtual = 0;
  const v = (def: SignalDef): string => {
    const name = `v${virtual++}`;
    defs.set(name, def);
    return name;
  };
  for (const net of netlist.nets) {
    if (net.drivers.length > 1) {
      throw new BuildError(`net ${net.name} has ${net.drivers.length} drivers (${net.drivers.map((d) => `${d.part}.${d.pin}`).join(', ')}): give every net one driver before converting`, { [net.drivers[0].part]: 'conflict' });
    }
    if (net.drivers.length === 0) defs.set(sig(net.id), { t: 'float' });
  }
  const logicSignals: string[] = [];
  for (const p of netlist.parts) {
    const ins = p.inputs.map((n) => lit(sig(n)));
    const out = (pin: string) => sig(p.outputs[p.outputPins.indexOf(pin)]);
    const origin = p.id;
    const set = (s: string, def: SignalDef) => defs.set(s, def);
    const part = p.part;
    if (isInputKind(part.kind)) {
      for (const pin of p.outputPins) {
        const other = pin === 'out' ? 'outn' : 'out';
        const comp = p.outputPins.includes(other) ? `${p.id}.${other}` : undefined;
        set(out(pin), { t: 'source', pin: `${p.id}.${pin}`, comp, origin });
      }
      continue;
    }
    if (p.outputs.length) logicSignals.push(...p.outputs.map(sig));
    switch (part.kind) {
      case 'buffer': set(out('out'), { t: 'alias', of: ins[0], origin }); break;
      case 'not': set(out('out'), { t: 'alias', of: lit(ins[0].sig, true), origin }); break;
      case 'and': case 'nand': case 'or': case 'nor':
        set(out('out'), { t: 'node', op: part.kind === 'and' || part.kind === 'nand' ? 'and' : 'or', lits: ins, inv: part.kind === 'nand' || part.kind === 'nor', origin });
        break;
      case 'xor': case 'xnor': {
        // parity of N inputs as a chain of two-input XORs; XNOR inverts the last
        let acc = ins[0];
        for (let k = 1; k < ins.length; k++) {
          const last = k === ins.length - 1;
          const def: SignalDef = { t: 'xor', a: acc, b: ins[k], inv: last && part.kind === 'xnor', origin };
          if (last) set(out('out'), def);
          else acc = lit(v(def));
        }
        break;
      }
      case 'mux2': {
        const [sel, d0, d1] = ins;
        const a = v({ t: 'node', op: 'and', lits: [lit(sel.sig, true), d0], inv: false, origin });
        const b = v({ t: 'node', op: 'and', lits: [sel, d1], inv: false, origin });
        set(out('out'), { t: 'node', op: 'or', lits: [lit(a), lit(b)], inv: false, origin });
        break;
      }
      case 'mux4': {
        const [s0, s1, ...d] = ins;
        const terms = d.map((dk, k) => lit(v({ t: 'node', op: 'and', lits: [lit(s1.sig, !(k & 2)), lit(s0.sig, !(k & 1)), dk], inv: false, origin })));
        set(out('out'), { t: 'node', op: 'or', lits: terms, inv: false, origin });
        break;
      }
      case 'srlatch': {
        // the NOR latch: Q = NOR(R, Q'), Q' = NOR(S, Q)
        const [s, r] = ins;
        const q = out('q');
        const qn = out('qn');
        set(q, { t: 'node', op: 'or', lits: [r, lit(qn)], inv: true, origin });
        set(qn, { t: 'node', op: 'or', lits: [s, lit(q)], inv: true, origin });
        break;
      }
      case 'dlatch': {
        // the gated D latch of four NANDs (common practice, no source)
        const [d, en] = ins;
        const q = out('q');
        const qn = out('qn');
        const a = v({ t: 'node', op: 'and', lits: [d, en], inv: true, origin });
        const b = v({ t: 'node', op: 'and', lits: [lit(a), en], inv: true, origin });
        set(q, { t: 'node', op: 'and', lits: [lit(a), lit(qn)], inv: true, origin });
        set(qn, { t: 'node', op: 'and', lits: [lit(b), lit(q)], inv: true, origin });
        break;
      }
      case 'dff': {
        // the six-NAND edge-triggered D flip-flop (the 7474 structure without preset and clear; CHECKS.md)
        const [d, clk] = ins;
        const q = out('q');
        const qn = out('qn');
        const g = ['g1', 'g2', 'g3', 'g4'].map(() => `v${virtual++}`);
        const nand = (lits: Lit[]): SignalDef => ({ t: 'node', op: 'and', lits, inv: true, origin });
        defs.set(g[0], nand([lit(g[1]), lit(g[3])]));
        defs.set(g[1], nand([lit(g[0]), clk]));
        defs.set(g[2], nand([lit(g[1]), clk, lit(g[3])]));
        defs.set(g[3], nand([lit(g[2]), d]));
        set(q, nand([lit(g[1]), lit(qn)]));
        set(qn, nand([lit(g[2]), lit(q)]));
        break;
      }
      case 'lamp': case 'probe': case 'note':
      case 'port': case 'module': // flattened away before (compileBoard)
        break;
      default: {
        const never: never = part.kind;
        throw new Error(`cannot decompose ${JSON.stringify(never)}`);
      }
    }
  }
  breakAliasLoops(defs);
  return { netlist, defs, logicSignals };
}

/** A ring of NOTs and buffers only would alias forever: such aliases become one-input nodes (real gates). */
function breakAliasLoops(defs: Map<string, SignalDef>): void {
  for (const [name, def] of defs) {
    if (def.t !== 'alias') continue;
    const seen = new Set([name]);
    let cur: SignalDef | undefined = def;
    while (cur?.t === 'alias') {
      if (seen.has(cur.of.sig)) {
        defs.set(name, { t: 'node', op: 'or', lits: [lit(def.of.sig)], inv: def.of.neg, origin: def.origin });
        break;
      }
      seen.add(cur.of.sig);
      cur = defs.get(cur.of.sig);
    }
  }
}

