/**
 * Explain, step by step: the settle of one input row replayed in event order, one output change at a
 * time, each with its reason in the trade's words ("NOR g3: input 2 is 1, so the output is 0").
 *
 * The simulator runs as usual (from power-on: every gate output unknown, storage at its initial value,
 * the row's inputs set) and reports every net change through onChange. For each change of a part's
 * output the reason is worked out from the levels of that part's inputs when it evaluated — the change
 * time less the part's delay (delays are inertial, so the inputs then decided the change). The final
 * levels are the simulator's own settled levels.
 *
 * Input rows follow the truth table's convention: the board's switches and buttons in file order, row r
 * spells them in binary, the first input most significant.
 */
import type { BoardFile, PartKind } from '../board';
import { compileBoard } from './compile';
import { Simulator } from './simulator';
import type { Level } from './levels';
import type { CompiledPart, Netlist } from './types';

/** One output change of the settle, with its reason. */
export interface ExplainStep {
  /** simulation time of the change */
  time: number;
  /** the part whose output changed (for a switch or button: the input set for the row) */
  partId: string;
  pin: string;
  /** name of the net it drives */
  net: string;
  from: Level;
  to: Level;
  /** 'input': a switch set for the row; 'logic': the part's function; 'power-on': a loop of gates given a level */
  cause: 'input' | 'logic' | 'power-on';
  /** e.g. "NOR g3: input 2 is 1, so the output is 0" */
  reason: string;
}

/** The settle of one input row, explained. */
export interface Explanation {
  row: number;
  /** input part id → level of the row */
  inputs: Record<string, Level>;
  steps: ExplainStep[];
  /** true when the settle came to rest (false: it oscillates, and the steps stop at the event budget) */
  settled: boolean;
  /** every pin's settled level, keyed `partId.pin` (the simulator's levels()) */
  levels: Map<string, Level>;
}

export interface ExplainOptions {
  /** most steps kept (default 2,000); an oscillating board is cut there */
  maxSteps?: number;
}

/** The inputs a row spells: switches and buttons in file order. */
export function explainInputs(netlist: Netlist): CompiledPart[] {
  return netlist.inputs.filter((p) => p.kind === 'switch' || p.kind === 'button');
}

/** Number of input rows (2^inputs, at most 2^16). */
export function explainRowCount(netlist: Netlist): number {
  return 2 ** Math.min(16, explainInputs(netlist).length);
}

/** The input levels row r spells (first input most significant). */
export function rowInputs(netlist: Netlist, row: number): Record<string, Level> {
  const ins = explainInputs(netlist);
  const out: Record<string, Level> = {};
  ins.forEach((p, i) => { out[p.id] = ((row >> (ins.length - 1 - i)) & 1) === 1 ? '1' : '0'; });
  return out;
}

const KIND_WORD: Partial<Record<PartKind, string>> = {
  buffer: 'Buffer', not: 'NOT', and: 'AND', or: 'OR', nand: 'NAND', nor: 'NOR', xor: 'XOR', xnor: 'XNOR',
  srlatch: 'SR latch', dlatch: 'D latch', dff: 'D flip-flop', mux2: '2:1 mux', mux4: '4:1 mux',
  switch: 'Switch', button: 'Button', clock: 'Clock', const: 'Constant',
};

/** "NOR g3" / "AND carry" — the kind and the part's label, else its id. */
export function partTitle(part: CompiledPart): string {
  const label = 'label' in part.part && typeof part.part.label === 'string' && part.part.label ? part.part.label : part.id;
  return `${KIND_WORD[part.kind] ?? part.kind} ${label}`;
}

function known(v: Level): v is '0' | '1' {
  return v === '0' || v === '1';
}

/** Four-valued reading inside a gate: Z reads as X. */
function rd(v: Level): Level {
  return v === 'Z' ? 'X' : v;
}

const GATE_KINDS = new Set<PartKind>(['and', 'or', 'nand', 'nor', 'xor', 'xnor']);

/**
 * Output and reason of a gate (and, or, nand, nor, xor, xnor, not, buffer) for input levels `ins`
 * (input k of the reason counts from 1). Z reads as X.
 */
export function gateReason(kind: PartKind, ins: Level[]): { out: Level; reason: string } {
  const v = ins.map(rd);
  if (kind === 'not' || kind === 'buffer') {
    const a = v[0];
    const out: Level = !known(a) ? 'X' : kind === 'buffer' ? a : a === '1' ? '0' : '1';
    return { out, reason: known(a) ? `the input is ${a}, so the output is ${out}` : 'the input is unknown (X), so the output is X' };
  }
  if (!GATE_KINDS.has(kind)) throw new Error(`${kind} is not a gate`);
  if (kind === 'xor' || kind === 'xnor') {
    const x = v.findIndex((a) => !known(a));
    if (x >= 0) return { out: 'X', reason: `input ${x + 1} is unknown (X), so the output is X` };
    const ones = v.filter((a) => a === '1').length;
    const odd = ones % 2 === 1;
    const out: Level = (kind === 'xor') === odd ? '1' : '0';
    const count = ones === 1 ? '1 input is 1' : `${ones} inputs are 1`;
    return { out, reason: `${count} (an ${odd ? 'odd' : 'even'} number), so the output is ${out}` };
  }
  // and/nand: a 0 decides; or/nor: a 1 decides
  const decider: Level = kind === 'and' || kind === 'nand' ? '0' : '1';
  const inverted = kind === 'nand' || kind === 'nor';
  const flip = (a: '0' | '1'): '0' | '1' => (inverted ? (a === '1' ? '0' : '1') : a);
  const k = v.indexOf(decider);
  if (k >= 0) {
    const out = flip(decider as '0' | '1');
    return { out, reason: `input ${k + 1} is ${decider}, so the output is ${out}` };
  }
  const other: '0' | '1' = decider === '0' ? '1' : '0';
  const x = v.findIndex((a) => !known(a));
  if (x >= 0) return { out: 'X', reason: `no input is ${decider} and input ${x + 1} is unknown (X), so the output is X` };
  const out = flip(other);
  return { out, reason: `${v.length === 2 ? 'both' : 'all'} inputs are ${other}, so the output is ${out}` };
}

function muxReason(kind: 'mux2' | 'mux4', ins: Level[]): { out: Level; reason: string } {
  const data = (a: Level): Level => (known(a) ? a : 'X');
  if (kind === 'mux2') {
    const [s, d0, d1] = ins.map(rd);
    if (known(s)) {
      const d = s === '0' ? d0 : d1;
      return { out: data(d), reason: `select is ${s}, so the output passes d${s}, which is ${d}` };
    }
    const same = data(d0) === data(d1);
    return same
      ? { out: data(d0), reason: `select is unknown (X) but d0 and d1 are both ${data(d0)}, so the output is ${data(d0)}` }
      : { out: 'X', reason: 'select is unknown (X) and d0, d1 differ, so the output is X' };
  }
  const [s0, s1, ...d] = ins.map(rd);
  if (known(s0) && known(s1)) {
    const k = (s1 === '1' ? 2 : 0) + (s0 === '1' ? 1 : 0);
    return { out: data(d[k]), reason: `select S1 S0 is ${s1}${s0}, so the output passes d${k}, which is ${d[k]}` };
  }
  const cands: number[] = [];
  for (let k = 0; k < 4; k++) {
    if (known(s0) && (k & 1) !== Number(s0)) continue;
    if (known(s1) && (k >> 1) !== Number(s1)) continue;
    cands.push(k);
  }
  const vals = new Set(cands.map((k) => data(d[k])));
  const names = cands.map((k) => `d${k}`).join(', ');
  if (vals.size === 1) {
    const out = [...vals][0];
    return { out, reason: `select is partly unknown (X) but ${names} are all ${out}, so the output is ${out}` };
  }
  return { out: 'X', reason: `select is partly unknown (X) and ${names} differ, so the output is X` };
}

/** Level of a net at time t (the last change at or before t) from its change history. */
function levelAt(hist: { t: number; v: Level }[], t: number): Level {
  let v: Level = hist[0].v;
  for (const h of hist) { if (h.t <= t) v = h.v; else break; }
  return v;
}

/** Level of a net just before time t (the last change strictly before t). */
function levelBefore(hist: { t: number; v: Level }[], t: number): Level {
  let v: Level = hist[0].v;
  for (const h of hist) { if (h.t < t) v = h.v; else break; }
  return v;
}

function storageReason(
  part: CompiledPart, pin: string, ins: Level[], prevClk: Level, to: Level,
): string {
  const q = pin === 'q' ? 'Q' : "Q'";
  const r = (a: Level): Level => rd(a);
  if (part.kind === 'srlatch') {
    const [s, rr] = ins.map(r);
    if (s === '1' && rr === '1') return `S and R are both 1 (not allowed), so Q and Q' are both 0: ${q} is ${to}`;
    if (s === '1' && rr === '0') return `S is 1 and R is 0: set, so ${q} is ${to}`;
    if (s === '0' && rr === '1') return `R is 1 and S is 0: reset, so ${q} is ${to}`;
    if (s === '0' && rr === '0') return to === 'X'
      ? `S and R fell from 1 together: which way the latch falls is unknown, so ${q} is X`
      : `S and R are 0: hold, ${q} keeps ${to}`;
    return `S or R is unknown (X) and the readings disagree, so ${q} is ${to}`;
  }
  if (part.kind === 'dlatch') {
    const [d, en] = ins.map(r);
    if (en === '1') return `enable is 1, so the latch is transparent: D is ${d}, so ${q} is ${to}`;
    if (en === '0') return `enable is 0: hold, ${q} keeps ${to}`;
    return `enable is unknown (X) and D differs from Q, so ${q} is ${to}`;
  }
  // dff
  const [d, clk] = ins.map(r);
  if (prevClk === '0' && clk === '1') return `rising clock edge with D = ${d}, so ${q} becomes ${to}`;
  if (to === 'X') return `the clock edge is uncertain (X) and D differs from Q, so ${q} is X`;
  return `clock edge: D is ${d}, so ${q} becomes ${to}`;
}

/** The settle of input row `row` (see rowInputs), explained one output change at a time. */
export function explainRow(board: BoardFile | Netlist, row: number, opts: ExplainOptions = {}): Explanation {
  const netlist = 'nets' in board ? board : compileBoard(board);
  const maxSteps = opts.maxSteps ?? 2000;
  const sim = new Simulator(netlist);
  const hist: { t: number; v: Level }[][] = netlist.nets.map((n) => [{ t: -1, v: sim.level(n.id) }]);
  const driverOf = new Map<number, { part: CompiledPart; pin: string }>();
  for (const part of netlist.parts) {
    part.outputs.forEach((net, k) => { if (!driverOf.has(net)) driverOf.set(net, { part, pin: part.outputPins[k] }); });
  }
  const changes: { t: number; net: number; from: Level; to: Level }[] = [];
  const off = sim.onChange((t, net, level) => {
    const h = hist[net];
    changes.push({ t, net, from: h[h.length - 1].v, to: level });
    h.push({ t, v: level });
  });
  const inputs = rowInputs(netlist, row);
  for (const [id, v] of Object.entries(inputs)) sim.setInput(id, v);
  const report = sim.settle();
  off();
  const floating = sim.floating;
  const inLevel = (net: number, t: number): Level => {
    const v = levelAt(hist[net], t);
    return v === 'Z' ? floating : v;
  };
  const steps: ExplainStep[] = [];
  for (const c of changes) {
    if (steps.length >= maxSteps) break;
    const drv = driverOf.get(c.net);
    if (!drv) continue;
    const { part, pin } = drv;
    const base = { time: c.t, partId: part.id, pin, net: netlist.nets[c.net].name, from: c.from, to: c.to };
    const title = partTitle(part);
    if (part.inputs.length === 0) {
      const what = pin === 'outn' ? `its normally-closed contact reads ${c.to}` : `set to ${c.to}`;
      steps.push({ ...base, cause: 'input', reason: `${title}: ${what}` });
      continue;
    }
    const d = Math.max(1, c.to === '1' ? part.rise : c.to === '0' ? part.fall : Math.min(part.rise, part.fall));
    const te = c.t - d;
    const ins = part.inputs.map((net) => inLevel(net, te));
    let result: { out: Level; reason: string } | null = null;
    if (GATE_KINDS.has(part.kind) || part.kind === 'not' || part.kind === 'buffer') result = gateReason(part.kind, ins);
    else if (part.kind === 'mux2' || part.kind === 'mux4') result = muxReason(part.kind, ins);
    if (result) {
      if (result.out === c.to) steps.push({ ...base, cause: 'logic', reason: `${title}: ${result.reason}` });
      else if (c.from === 'X') {
        steps.push({ ...base, cause: 'power-on', reason: `${title}: its inputs are still unknown in a loop of gates, so at power-on the output starts at ${c.to}` });
      } else steps.push({ ...base, cause: 'logic', reason: `${title}: the output becomes ${c.to}` });
      continue;
    }
    const prevClk = part.kind === 'dff' ? levelBefore(hist[part.inputs[1]], te) : 'X';
    steps.push({ ...base, cause: 'logic', reason: `${title}: ${storageReason(part, pin, ins, prevClk, c.to)}` });
  }
  return { row, inputs, steps, settled: report.settled, levels: sim.levels() };
}
