/**
 * The tube group's demo 1-bit processor (examples/one-bit-processor.gatefold.json): every gate a NOR,
 * built from modules. Its program is run through the command line and through our simulator, clock by
 * clock, and checked against a small interpreter written here from the instruction table on the board's
 * note (not from the simulator). Its decoder alone is run by Icarus Verilog against the same table. The
 * build sheet plans one 6AU6 per NOR gate, with no output driving more than the family's four loads, and
 * the board is laid out without parts over each other.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { flattenBoard, parseBoardFile, splitPinRef, type BoardFile } from '../../shared/board';
import { compileBoard, Simulator, toHierarchicalVerilog } from '../../shared/sim';
import { analyzeBoard } from '../../shared/analysis';
import { familyFacts } from '../../shared/build/families';
import { runCli } from '../cli/run-cli';
import { runIverilog } from '../sim/iverilog';
import { layoutReport } from '../helpers/board-layout';
import { buildOneBitProcessor, EXAMPLE_FILE } from '../helpers/one-bit-processor';

const FILE = EXAMPLE_FILE.pathname;

function load(): BoardFile {
  const parsed = parseBoardFile(JSON.parse(readFileSync(EXAMPLE_FILE, 'utf8')));
  if (!parsed.ok) throw new Error(parsed.problems.map((p) => p.message).join('; '));
  return parsed.board;
}

// ---- reference interpreter, from the instruction table (opcode I3 I2 I1 I0; D = DIN AND IEN) ----
interface State { step: number; rr: number; ien: number; oen: number; out: number }
type Exec = (s: State, din: number) => void;
const rrOp = (f: (rr: number, d: number) => number): Exec => (s, din) => { s.rr = f(s.rr, din & s.ien); };
const OPS: Array<[string, Exec]> = [
  ['NOP', rrOp((rr) => rr)],
  ['LD', rrOp((_, d) => d)],
  ['LDN', rrOp((_, d) => 1 - d)],
  ['AND', rrOp((rr, d) => rr & d)],
  ['ANDN', rrOp((rr, d) => rr & (1 - d))],
  ['OR', rrOp((rr, d) => rr | d)],
  ['ORN', rrOp((rr, d) => rr | (1 - d))],
  ['XOR', rrOp((rr, d) => rr ^ d)],
  ['XNOR', rrOp((rr, d) => 1 - (rr ^ d))],
  ['NOT', rrOp((rr) => 1 - rr)],
  ['CLR', rrOp(() => 0)],
  ['SET', rrOp(() => 1)],
  ['IEN', (s, din) => { s.ien = din; }],
  ['OEN', (s, din) => { s.oen = din; }],
  ['STO', (s) => { if (s.oen) s.out = s.rr; }],
  ['STON', (s) => { if (s.oen) s.out = 1 - s.rr; }],
];
/** The logic unit's result Y(RR, D) each instruction writes (RR for the register ones, OUT for STO and STON); none for IEN, OEN. */
const RESULT: Record<string, (rr: number, d: number) => number> = {
  NOP: (rr) => rr, LD: (_, d) => d, LDN: (_, d) => 1 - d, AND: (rr, d) => rr & d, ANDN: (rr, d) => rr & (1 - d),
  OR: (rr, d) => rr | d, ORN: (rr, d) => rr | (1 - d), XOR: (rr, d) => rr ^ d, XNOR: (rr, d) => 1 - (rr ^ d),
  NOT: (rr) => 1 - rr, CLR: () => 0, SET: () => 1, STO: (rr) => rr, STON: (rr) => 1 - rr,
};
// the counter steps 00 → 01 → 11 → 10 (a two-stage Johnson counter: common practice, no source)
const STEP_CODE = ['00', '01', '11', '10'];

function observe(s: State, program: number[]): Record<string, string> {
  const op = program[s.step];
  const bits = op.toString(2).padStart(4, '0');
  const write = (OPS[op][0] === 'STO' || OPS[op][0] === 'STON') && s.oen ? 1 : 0;
  return {
    STEP1: STEP_CODE[s.step][0], STEP0: STEP_CODE[s.step][1],
    I3: bits[0], I2: bits[1], I1: bits[2], I0: bits[3],
    IEN: String(s.ien), OEN: String(s.oen), RR: String(s.rr), WRITE: String(write), OUT: String(s.out),
  };
}

/** What the outputs read after each clock: the instruction at the counter runs on the rising edge, then the counter steps. */
function interpret(program: number[], din: number[]): Array<Record<string, string>> {
  const s: State = { step: 0, rr: 0, ien: 0, oen: 0, out: 0 }; // every register powers on at 0 (the board's note)
  return din.map((d) => {
    OPS[program[s.step]][1](s, d);
    s.step = (s.step + 1) % 4;
    return observe(s, program);
  });
}

/** The program in the ROM module, read from its constants `c_s<step>_b<bit>`. */
function romProgram(board: BoardFile): number[] {
  const rom = board.modules!.find((m) => m.id === 'rom')!;
  const value = (id: string) => (rom.parts.find((p) => p.id === id) as { value: number }).value;
  return [0, 1, 2, 3].map((st) => [3, 2, 1, 0].reduce((w, k) => w * 2 + value(`c_s${st}_b${k}`), 0));
}

function withProgram(board: BoardFile, program: number[]): BoardFile {
  const modules = board.modules!.map((m) => (m.id !== 'rom' ? m : {
    ...m,
    parts: m.parts.map((p) => {
      const hit = /^c_s(\d)_b(\d)$/.exec(p.id);
      return hit ? { ...p, value: (program[Number(hit[1])] >> Number(hit[2])) & 1 } : p;
    }),
  }));
  return { ...board, modules } as BoardFile;
}

/** Our simulator, clocked as `simulate --clock` clocks: DIN set, then CLK high, settle, CLK low, settle. */
function simulate(board: BoardFile, din: number[]): Array<Record<string, string>> {
  const sim = new Simulator(compileBoard(board));
  expect(sim.settle().settled).toBe(true);
  return din.map((d) => {
    sim.setInput('din', d as 0 | 1);
    expect(sim.settle().settled).toBe(true);
    sim.setInput('clk', 1);
    expect(sim.settle().settled).toBe(true);
    sim.setInput('clk', 0);
    expect(sim.settle().settled).toBe(true);
    return sim.outputValues();
  });
}

/** A small seeded generator (a linear congruential one: Numerical Recipes' constants, from memory). */
function lcg(seed: number): () => number {
  let x = seed >>> 0;
  return () => {
    x = (Math.imul(x, 1664525) + 1013904223) >>> 0;
    return x / 2 ** 32;
  };
}

/** The flat demo board's nets from its wires alone (pins joined by wires), each with its drivers and loads. */
function flatNets() {
  const flat = flattenBoard(load());
  const kind = new Map(flat.parts.map((p) => [p.id, p.kind]));
  const parent = new Map<string, string>();
  const find = (x: string): string => { let r = x; while (parent.has(r)) r = parent.get(r)!; return r; };
  for (const w of flat.wires) { const a = find(w.from); const b = find(w.to); if (a !== b) parent.set(a, b); }
  const nets = new Map<string, { drivers: string[]; loads: string[] }>();
  for (const w of flat.wires) {
    for (const ref of [w.from, w.to]) {
      const net = nets.get(find(ref)) ?? { drivers: [], loads: [] };
      nets.set(find(ref), net);
      const { part, pin } = splitPinRef(ref)!;
      const list = pin.startsWith('out') ? net.drivers : net.loads;
      if (!list.includes(ref)) list.push(ref);
      expect(kind.has(part)).toBe(true);
    }
  }
  return { kind, nets };
}

describe('1-bit processor demo', () => {
  it('the example file is what the generator writes, and everything is built of NOR gates in modules', () => {
    const board = load();
    expect(readFileSync(EXAMPLE_FILE, 'utf8')).toBe(JSON.stringify(buildOneBitProcessor(), null, 2) + '\n');
    expect(board.family).toBe('tube-drl-nor');
    const instances = board.parts.filter((p) => p.kind === 'module') as Array<{ module: string }>;
    expect(instances.filter((p) => p.module === 'nor_dff').length).toBeGreaterThanOrEqual(6);
    expect(new Set(instances.map((p) => p.module))).toEqual(new Set(['nor_dff', 'rom', 'decoder', 'logic_unit']));
    const gates = flattenBoard(board).parts.filter((p) => !['switch', 'clock', 'const', 'lamp', 'note'].includes(p.kind));
    expect(new Set(gates.map((p) => p.kind))).toEqual(new Set(['nor']));
    for (const p of board.parts) expect([p.id, p.x % 20, p.y % 20]).toEqual([p.id, 0, 0]);
  });

  it('the note documents the instruction table the reference interpreter follows, and the ROM holds the documented program', () => {
    const board = load();
    const note = (board.parts.find((p) => p.kind === 'note') as { text: string }).text;
    OPS.forEach(([name], op) => expect(note).toContain(`${op.toString(2).padStart(4, '0')} ${name}:`));
    expect(note).toContain('step 0 IEN, step 1 OEN, step 2 XOR, step 3 STO');
    expect(romProgram(board).map((op) => OPS[op][0])).toEqual(['IEN', 'OEN', 'XOR', 'STO']);
  });

  it('the logic unit module gives all 16 functions of two inputs, its function code being the truth table', () => {
    // the logic unit alone on a board: A, B and the function code F3…F0 on switches, Y on a lamp
    const lu = load().modules!.find((m) => m.id === 'logic_unit')!;
    const codes = ['F3', 'F2', 'F1', 'F0'];
    const parsed = parseBoardFile({
      format: 'gatefold-board', version: 1, title: 'Logic unit alone', family: 'ideal', modules: [lu],
      parts: [
        ...['A', 'B', ...codes].map((label, i) => ({ id: label.toLowerCase(), kind: 'switch', label, x: 0, y: 80 * i, on: false })),
        { id: 'u', kind: 'module', module: 'logic_unit', x: 200, y: 0 },
        { id: 'y', kind: 'lamp', label: 'Y', x: 400, y: 0 },
      ],
      wires: [
        ...['A', 'B', ...codes].map((label) => ({ id: `w_${label}`, from: `${label.toLowerCase()}.out`, to: `u.${label}` })),
        { id: 'w_y', from: 'u.Y', to: 'y.in' },
      ],
    });
    if (!parsed.ok) throw new Error(parsed.problems.map((p) => p.message).join('; '));
    const result = analyzeBoard(parsed.board, { inputs: ['A', 'B', ...codes], select: codes });
    // Function names by output column over AB = 00, 01, 10, 11 (0000 … 1111): Wikipedia "Truth table",
    // section "Binary operations" (the same order as CONTRACTS §2). Code F3 F2 F1 F0 puts Fk at AB = k.
    const NAMES = ['FALSE', 'AND', 'A_AND_NOT_B', 'A', 'NOT_A_AND_B', 'B', 'XOR', 'OR', 'NOR', 'XNOR', 'NOT_B', 'A_OR_NOT_B', 'NOT_A', 'NOT_A_OR_B', 'NAND', 'TRUE'];
    const got = Object.fromEntries(result.functionMap.map((e) => [e.select, e.functions.Y.name]));
    const want = Object.fromEntries(Array.from({ length: 16 }, (_, code) => {
      const select = code.toString(2).padStart(4, '0');
      const column = [...select].reverse().join(''); // F0 F1 F2 F3: Y at AB = 00, 01, 10, 11
      return [select, NAMES[Number.parseInt(column, 2)]];
    }));
    expect(got).toEqual(want);
    expect(new Set(Object.values(got)).size).toBe(16);
  });

  it('runs its program through `simulate --clock`: with DIN on, OUT changes every fourth clock', async () => {
    const board = load();
    const program = romProgram(board);
    const r = await runCli(['simulate', FILE, '--set', 'DIN=1', '--clock', 'CLK', '--cycles', '12']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout) as { settled: boolean; conflicts: string[]; trace: Array<{ cycle: number; outputs: Record<string, string> }> };
    expect(out.settled).toBe(true);
    expect(out.conflicts).toEqual([]);
    const expected = interpret(program, Array(12).fill(1));
    expect(out.trace.map((t) => t.outputs)).toEqual(expected);
    // the documented result: OUT reads 1 after clocks 4 to 7, 0 after 8 to 11, 1 again after 12
    expect(expected.map((o) => o.OUT).join('')).toBe('000111100001');
    // with DIN off, IEN and OEN stay 0 and nothing is written
    const off = await runCli(['simulate', FILE, '--clock', 'CLK', '--cycles', '8']);
    expect(JSON.parse(off.stdout).trace.map((t: { outputs: unknown }) => t.outputs)).toEqual(interpret(program, Array(8).fill(0)));
  });

  it('runs any program of the 16 instructions with DIN changing between clocks, as the interpreter says', () => {
    const board = load();
    const rand = lcg(14);
    const programs: number[][] = [];
    // every opcode in every step at least once, then random programs
    for (let op = 0; op < 16; op++) programs.push([12, 13, op, (op + 7) % 16]);
    for (let n = 0; n < 8; n++) programs.push([0, 1, 2, 3].map(() => Math.floor(rand() * 16)));
    for (const program of programs) {
      const din = Array.from({ length: 16 }, () => (rand() < 0.6 ? 1 : 0));
      expect([program, simulate(withProgram(board, program), din)]).toEqual([program, interpret(program, din)]);
    }
  });

  it('the decoder alone gives each opcode its control lines, under Icarus Verilog as under our analysis', () => {
    // the decoder module on a board of its own: I3…I0 on switches, its eight control lines on lamps
    const dec = load().modules!.find((m) => m.id === 'decoder')!;
    const ins = ['I3', 'I2', 'I1', 'I0'];
    const outs = ['F0', 'F1', 'F2', 'F3', 'LDR', 'LDI', 'LDO', 'WR'];
    const parsed = parseBoardFile({
      format: 'gatefold-board', version: 1, title: 'Decoder alone', family: 'ideal', modules: [dec],
      parts: [
        ...ins.map((label, i) => ({ id: label.toLowerCase(), kind: 'switch', label, x: 0, y: 80 * i, on: false })),
        { id: 'u', kind: 'module', module: 'decoder', x: 200, y: 0 },
        ...outs.map((label, i) => ({ id: `l_${label.toLowerCase()}`, kind: 'lamp', label, x: 400, y: 60 * i })),
      ],
      wires: [
        ...ins.map((label) => ({ id: `w_${label}`, from: `${label.toLowerCase()}.out`, to: `u.${label}` })),
        ...outs.map((label) => ({ id: `w_${label}`, from: `u.${label}`, to: `l_${label.toLowerCase()}.in` })),
      ],
    });
    if (!parsed.ok) throw new Error(parsed.problems.map((p) => p.message).join('; '));
    const table = analyzeBoard(parsed.board, { inputs: ins });
    // Icarus Verilog (Debian's iverilog, an independent IEEE Std 1364 simulator) runs the hierarchical export
    const icarus = runIverilog(toHierarchicalVerilog(parsed.board), table.inputs, table.outputs, table.rows.map((r) => [...r.in].map(Number)));
    expect(icarus).toEqual(table.rows.map((r) => r.out));
    // what each opcode must give, from the instruction table: Fk = Y at k = 2·RR + D for the instructions
    // that write a result, LDR for the twelve register instructions, LDI for IEN, LDO for OEN, WR for the stores
    expect(table.outputs).toEqual(outs);
    for (const row of table.rows) {
      const op = Number.parseInt(row.in, 2);
      const name = OPS[op][0];
      const got = Object.fromEntries(outs.map((o, i) => [o, row.out[i]]));
      const f = RESULT[name];
      const want = {
        ...(f ? Object.fromEntries([0, 1, 2, 3].map((k) => [`F${k}`, String(f(k >> 1, k & 1))])) : {}),
        LDR: op < 12 ? '1' : '0', LDI: name === 'IEN' ? '1' : '0', LDO: name === 'OEN' ? '1' : '0', WR: name === 'STO' || name === 'STON' ? '1' : '0',
      };
      expect([name, Object.fromEntries(Object.keys(want).map((k) => [k, got[k]]))]).toEqual([name, want]);
    }
  });

  it('build sheet for the tube family: one tube per NOR gate, heater current = tubes × 0.3 A', async () => {
    const board = load();
    const nors = flattenBoard(board).parts.filter((p) => p.kind === 'nor').length;
    // six flip-flops of 14 NOR gates, the decoder, the logic unit (12), the ROM, five at the top: 171 in all
    const inside = (id: string) => board.modules!.find((m) => m.id === id)!.parts.filter((p) => p.kind === 'nor').length;
    const top = board.parts.filter((p) => p.kind === 'nor').length;
    expect(inside('nor_dff')).toBe(14);
    expect(nors).toBe(6 * inside('nor_dff') + inside('decoder') + inside('logic_unit') + inside('rom') + top);
    const r = await runCli(['build-sheet', FILE, '--family', 'tube-drl-nor']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const sheet = JSON.parse(r.stdout) as {
      builtAs: { gates: number }; devices: { tubes: number }; heater: { amps: number; tubes: number };
      fanOut: { limit: number; warnings: Array<{ drivers: number; levels: number; advice: string }> };
      criticalPath: { parts: string[]; levels: number; delayNs: number; tpdNs: number };
      maxClockHz: { typical: number; worstCase: number };
    };
    expect(sheet.builtAs.gates).toBe(nors);
    expect(sheet.devices.tubes).toBe(nors);
    // 6AU6 heater: 6.3 V, 0.3 A (RCA receiving tube data, from memory)
    expect(sheet.heater.tubes).toBe(nors);
    expect(sheet.heater.amps).toBeCloseTo(nors * 0.3, 6);
    // no gate output drives more than the family's fan-out (four diode-resistor inputs per plate load); the
    // clock does, once per flip-flop gate it clocks: the sheet says so and how to buffer it without skew
    expect(sheet.fanOut.limit).toBe(4);
    const clockLoads = [...flatNets().nets.values()].find((n) => n.drivers.includes('clk.out'))!.loads.length;
    expect(clockLoads).toBe(24);
    expect(sheet.fanOut.warnings).toEqual([expect.objectContaining({ net: 'CLK', driver: 'clk.out', kind: 'clock', loads: clockLoads, limit: 4 })]);
    // a buffer per four loads (6), then a buffer per four of those (2): the clock drives 2 (common practice, no source)
    expect(sheet.fanOut.warnings[0]).toMatchObject({ drivers: 8, levels: 2 });
    expect(sheet.fanOut.warnings[0].advice).toMatch(/^Buffer it: 6 buffers .* 2 more feed those 6 \(8 in all\); the clock then drives 2\. .*same number of stages.*\(skew\)/);
    // the critical path starts at the clock and is counted in gate delays; the drivers and the predecoding
    // lengthen it a little (47 levels, about 53 kHz before them), it stays in the tens of kilohertz
    expect(sheet.criticalPath.parts[0]).toBe('clk');
    expect(sheet.criticalPath.delayNs).toBe(sheet.criticalPath.levels * sheet.criticalPath.tpdNs);
    expect(sheet.criticalPath.levels).toBeLessThanOrEqual(56);
    expect(sheet.maxClockHz.typical).toBeCloseTo(1e9 / sheet.criticalPath.delayNs, 2);
    expect(sheet.maxClockHz.typical).toBeGreaterThan(40_000);
  });

  it('no gate output drives more than four loads, counted here net by net on the flat board', () => {
    // each gate input and each lamp is one load; an inverter's two tied inputs are two (as the build sheet counts)
    const limit = familyFacts('tube-drl-nor')!.fanOut.value!;
    expect(limit).toBe(4);
    const { kind, nets } = flatNets();
    const gateNets = [...nets.values()].filter((n) => n.drivers.some((d) => kind.get(splitPinRef(d)!.part) === 'nor'));
    expect(gateNets.length).toBeGreaterThan(150);
    const over = gateNets.filter((n) => n.loads.length > limit).map((n) => `${n.drivers.join('+')}: ${n.loads.length}`);
    expect(over).toEqual([]);
    for (const n of gateNets) expect(n.drivers).toHaveLength(1);
  });

  it('is laid out for the canvas: no part over another, few wires drawn through a part', () => {
    const board = load();
    const circuits = [{ id: 'top', circuit: board }, ...board.modules!.map((m) => ({ id: m.id, circuit: m }))];
    let crossings = 0;
    for (const { id, circuit } of circuits) {
      const report = layoutReport(board, circuit);
      expect([id, report.overlaps]).toEqual([id, []]);
      crossings += report.crossings.length;
    }
    // measured when the drivers went in: 38 (mostly the clock fanning out and the logic unit's literals);
    // the board before had 20 overlapping parts and 314 wires through parts
    expect(crossings).toBeLessThanOrEqual(40);
  });
});
