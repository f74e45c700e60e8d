/**
 * Builds the tube group's demo 1-bit processor (examples/one-bit-processor.gatefold.json) from NOR gates
 * only, in modules: a NOR D flip-flop with load enable (six instances), an instruction decoder, a logic
 * unit of 16 operations and a 4-step program ROM. Run `npx tsx tests/helpers/one-bit-processor.ts` to
 * write the example file again.
 */
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { canonicalBoard, parseBoardFile, type BoardFile } from '../../shared/board';

type RawPart = Record<string, unknown> & { id: string; kind: string; x: number; y: number };
interface RawWire { id: string; from: string; to: string }

/** Parts and wires of one circuit, with wire ids counted up. */
class Sheet {
  parts: RawPart[] = [];
  wires: RawWire[] = [];
  add(part: RawPart): string {
    this.parts.push(part);
    return part.id;
  }
  nor(id: string, x: number, y: number, inputs: string[]): string {
    // a one-input NOR (an inverter) is drawn as a 2-input NOR with both inputs tied, as a tube builder wires it
    const ins = inputs.length === 1 ? [inputs[0], inputs[0]] : inputs;
    this.add({ id, kind: 'nor', inputs: ins.length, x, y });
    ins.forEach((from, i) => this.wire(from, `${id}.in${i}`));
    return `${id}.out`;
  }
  wire(from: string, to: string): void {
    this.wires.push({ id: `w${this.wires.length + 1}`, from, to });
  }
  port(id: string, dir: 'in' | 'out', label: string, x: number, y: number): string {
    this.add({ id, kind: 'port', dir, label, x, y });
    return dir === 'in' ? `${id}.out` : `${id}.in`;
  }
}

/**
 * The instruction set (opcode = I3 I2 I1 I0). D is the data input masked by IEN (D = DIN AND IEN). The
 * logic unit's function code F3 F2 F1 F0 is the truth table of its result Y over (RR, D): Fk = Y at
 * k = 2·RR + D. LDR loads RR with Y, LDI loads IEN with DIN, LDO loads OEN with DIN, WR writes Y into the
 * output latch OUT (only while OEN is 1).
 */
export const INSTRUCTIONS: Array<{ op: number; name: string; effect: string; f: string; ldr?: true; ldi?: true; ldo?: true; wr?: true }> = [
  { op: 0, name: 'NOP', effect: 'RR ← RR', f: '1100', ldr: true },
  { op: 1, name: 'LD', effect: 'RR ← D', f: '1010', ldr: true },
  { op: 2, name: 'LDN', effect: 'RR ← NOT D', f: '0101', ldr: true },
  { op: 3, name: 'AND', effect: 'RR ← RR AND D', f: '1000', ldr: true },
  { op: 4, name: 'ANDN', effect: 'RR ← RR AND NOT D', f: '0100', ldr: true },
  { op: 5, name: 'OR', effect: 'RR ← RR OR D', f: '1110', ldr: true },
  { op: 6, name: 'ORN', effect: 'RR ← RR OR NOT D', f: '1101', ldr: true },
  { op: 7, name: 'XOR', effect: 'RR ← RR XOR D', f: '0110', ldr: true },
  { op: 8, name: 'XNOR', effect: 'RR ← RR XNOR D', f: '1001', ldr: true },
  { op: 9, name: 'NOT', effect: 'RR ← NOT RR', f: '0011', ldr: true },
  { op: 10, name: 'CLR', effect: 'RR ← 0', f: '0000', ldr: true },
  { op: 11, name: 'SET', effect: 'RR ← 1', f: '1111', ldr: true },
  { op: 12, name: 'IEN', effect: 'IEN ← DIN', f: '1100', ldi: true },
  { op: 13, name: 'OEN', effect: 'OEN ← DIN', f: '1100', ldo: true },
  { op: 14, name: 'STO', effect: 'OUT ← RR if OEN (WRITE)', f: '1100', wr: true },
  { op: 15, name: 'STON', effect: 'OUT ← NOT RR if OEN (WRITE)', f: '0011', wr: true },
];

/** The demo program in the ROM, step 0 first: a blinker — while DIN is on, OUT changes every pass. */
export const PROGRAM = ['IEN', 'OEN', 'XOR', 'STO'] as const;

/** NOR D flip-flop with load enable: a D mux, a master NOR latch open while CLK is 0, a slave open while CLK is 1 (rising edge). */
function flipFlopModule() {
  const s = new Sheet();
  // Q and QN first: the power-on resolution (decision 002) settles a held latch with its first gate low, so Q = 0.
  s.add({ id: 'g_q', kind: 'nor', inputs: 2, x: 920, y: 80 });
  s.add({ id: 'g_qn', kind: 'nor', inputs: 2, x: 920, y: 200 });
  const d = s.port('p_d', 'in', 'D', 0, 40);
  const le = s.port('p_le', 'in', 'LE', 0, 160);
  const clk = s.port('p_clk', 'in', 'CLK', 0, 280);
  const nle = s.nor('g_nle', 120, 160, [le]);
  const nd = s.nor('g_nd', 120, 40, [d]);
  const take = s.nor('g_take', 260, 40, [nle, nd]); // LE AND D
  const keep = s.nor('g_keep', 260, 160, [le, 'g_qn.out']); // NOT LE AND Q
  const ndm = s.nor('g_ndm', 400, 100, [take, keep]); // NOT D'
  const dm = s.nor('g_dm', 520, 40, [ndm]); // D'
  const sm = s.nor('g_sm', 520, 160, [ndm, clk]); // set master: D' AND NOT CLK
  const rm = s.nor('g_rm', 520, 280, [dm, clk]); // reset master
  const qm = s.nor('g_qm', 640, 160, [rm, 'g_qnm.out']);
  s.nor('g_qnm', 640, 280, [sm, qm]);
  const nclk = s.nor('g_nclk', 520, 400, [clk]);
  const ss = s.nor('g_ss', 780, 80, ['g_qnm.out', nclk]); // set slave: Qm AND CLK
  const rs = s.nor('g_rs', 780, 200, [qm, nclk]);
  s.wire(rs, 'g_q.in0');
  s.wire('g_qn.out', 'g_q.in1');
  s.wire(ss, 'g_qn.in0');
  s.wire('g_q.out', 'g_qn.in1');
  s.wire('g_q.out', s.port('p_q', 'out', 'Q', 1060, 80));
  s.wire('g_qn.out', s.port('p_qn', 'out', 'QN', 1060, 200));
  return { id: 'nor_dff', title: 'NOR D flip-flop with load enable', parts: s.parts, wires: s.wires };
}

/** Logic unit of 16 operations: Y = F[2·A + B], every function of two inputs picked by the function code. */
function logicUnitModule() {
  const s = new Sheet();
  const a = s.port('p_a', 'in', 'A', 0, 40);
  const b = s.port('p_b', 'in', 'B', 0, 120);
  const f = [0, 1, 2, 3].map((k) => s.port(`p_f${k}`, 'in', `F${k}`, 0, 220 + 80 * k));
  const na = s.nor('g_na', 140, 40, [a]);
  const nb = s.nor('g_nb', 140, 120, [b]);
  const nf = f.map((fk, k) => s.nor(`g_nf${k}`, 140, 220 + 80 * k, [fk]));
  // term k is 1 when F k is 1 and (A, B) is row k: a NOR of NOT Fk and the literals that are 0 in row k
  const lit = [[a, b], [a, nb], [na, b], [na, nb]];
  const terms = lit.map((l, k) => s.nor(`g_t${k}`, 300, 220 + 80 * k, [nf[k], ...l]));
  const ny = s.nor('g_ny', 440, 320, terms);
  s.wire(s.nor('g_y', 560, 320, [ny]), s.port('p_y', 'out', 'Y', 700, 320));
  return { id: 'logic_unit', title: 'Logic unit, 16 operations', parts: s.parts, wires: s.wires };
}

/** Instruction decoder: 16 opcode lines (NOR of four literals each), then each control line from them. */
function decoderModule() {
  const s = new Sheet();
  const i = [0, 1, 2, 3].map((k) => s.port(`p_i${k}`, 'in', `I${k}`, 0, 40 + 80 * (3 - k)));
  const ni = i.map((ik, k) => s.nor(`g_ni${k}`, 140, 40 + 80 * (3 - k), [ik]));
  // opcode line n: 1 when every literal that is 0 for n is 0
  const line = Array.from({ length: 16 }, (_, n) =>
    s.nor(`g_op${n}`, 320, 40 + 60 * n, [3, 2, 1, 0].map((k) => ((n >> k) & 1 ? ni[k] : i[k]))));
  const outputs: Array<[string, (n: number) => boolean]> = [
    ...[0, 1, 2, 3].map((k): [string, (n: number) => boolean] => [`F${k}`, (n) => INSTRUCTIONS[n].f[3 - k] === '1']),
    ['LDR', (n) => Boolean(INSTRUCTIONS[n].ldr)],
    ['LDI', (n) => Boolean(INSTRUCTIONS[n].ldi)],
    ['LDO', (n) => Boolean(INSTRUCTIONS[n].ldo)],
    ['WR', (n) => Boolean(INSTRUCTIONS[n].wr)],
  ];
  outputs.forEach(([label, on], j) => {
    const y = 40 + 120 * j;
    const ones = line.filter((_, n) => on(n));
    const zeros = line.filter((_, n) => !on(n));
    const id = label.toLowerCase();
    // a NOR of the opcode lines where the output is 0 gives it at once; with more than eight such lines,
    // a NOR of the lines where it is 1 and an inverter
    const out = zeros.length <= 8
      ? s.nor(`g_${id}`, 520, y, zeros)
      : s.nor(`g_${id}`, 660, y, [s.nor(`g_n${id}`, 520, y, ones)]);
    s.wire(out, s.port(`p_${id}`, 'out', label, 800, y));
  });
  return { id: 'decoder', title: 'Instruction decoder', parts: s.parts, wires: s.wires };
}

/** Program ROM, 4 steps × 4 bits: one constant per bit, picked by the step (a 2-bit Johnson count). */
function romModule() {
  const s = new Sheet();
  const q1 = s.port('p_q1', 'in', 'Q1', 0, 40);
  const qn1 = s.port('p_qn1', 'in', 'QN1', 0, 120);
  const q0 = s.port('p_q0', 'in', 'Q0', 0, 200);
  const qn0 = s.port('p_qn0', 'in', 'QN0', 0, 280);
  // step s is the count Q1 Q0 = 00, 01, 11, 10; the literals that are 0 in each step
  const stepLits = [[q1, q0], [q1, qn0], [qn1, qn0], [qn1, q0]];
  const words = PROGRAM.map((name) => INSTRUCTIONS.find((ins) => ins.name === name)!.op);
  for (let k = 3; k >= 0; k--) {
    const y0 = 40 + 320 * (3 - k);
    // zero term (step s, bit k): 1 in step s when the stored bit is 0; the bit is the NOR of the zero terms
    const zeroTerms = stepLits.map((lits, st) => {
      const c = s.add({ id: `c_s${st}_b${k}`, kind: 'const', value: (words[st] >> k) & 1, x: 160, y: y0 + 80 * st - 20 });
      return s.nor(`g_z${st}_b${k}`, 320, y0 + 80 * st - 20, [...lits, `${c}.out`]);
    });
    s.wire(s.nor(`g_b${k}`, 480, y0 + 100, zeroTerms), s.port(`p_i${k}`, 'out', `I${k}`, 620, y0 + 100));
  }
  return { id: 'rom', title: 'Program ROM, 4 steps × 4 bits', parts: s.parts, wires: s.wires };
}

function note(): string {
  const table = INSTRUCTIONS.map((i) => `${i.op.toString(2).padStart(4, '0')} ${i.name}: ${i.effect}`).join('; ');
  return [
    'Larkspur Street Makerspace, tube group: a 1-bit controller of 6AU6 NOR gates, built from modules.',
    'Each rising edge of CLK runs the instruction at the program counter (a 2-bit Johnson count STEP1 STEP0: 00, 01, 11, 10) and steps it.',
    'D = DIN AND IEN. Instructions (I3 I2 I1 I0):', table + '.',
    `Program in the ROM: ${PROGRAM.map((p, i) => `step ${i} ${p}`).join(', ')} — a blinker: while DIN is on, OUT changes every pass (every fourth clock).`,
    'WRITE lights while the instruction at the counter will write OUT on the next edge. Registers power on at 0.',
    'Caution: tube circuits use voltages that can hurt; follow your local electrical code and qualified practice.',
  ].join(' ');
}

export function buildOneBitProcessor(): BoardFile {
  const s = new Sheet();
  s.add({ id: 'din', kind: 'switch', label: 'DIN', x: 40, y: 440, on: false });
  s.add({ id: 'clk', kind: 'clock', label: 'CLK', x: 40, y: 80 });
  s.add({ id: 'one', kind: 'const', value: 1, x: 40, y: 200 });
  // program counter: two flip-flops, always loading (LE = 1), counting 00 → 01 → 11 → 10
  s.add({ id: 'pc0', kind: 'module', module: 'nor_dff', x: 200, y: 40 });
  s.add({ id: 'pc1', kind: 'module', module: 'nor_dff', x: 200, y: 200 });
  s.add({ id: 'rom', kind: 'module', module: 'rom', x: 400, y: 120 });
  s.add({ id: 'dec', kind: 'module', module: 'decoder', x: 600, y: 120 });
  s.add({ id: 'ien', kind: 'module', module: 'nor_dff', x: 600, y: 440 });
  s.add({ id: 'oen', kind: 'module', module: 'nor_dff', x: 600, y: 600 });
  const dMask = s.nor('g_d', 800, 440, ['din.outn', 'ien.QN']); // D = DIN AND IEN
  s.add({ id: 'lu', kind: 'module', module: 'logic_unit', x: 1000, y: 200 });
  s.add({ id: 'rr', kind: 'module', module: 'nor_dff', x: 1200, y: 120 });
  const nwr = s.nor('g_nwr', 1000, 600, ['dec.WR']);
  const we = s.nor('g_we', 1200, 600, [nwr, 'oen.QN']); // WR AND OEN
  s.add({ id: 'out', kind: 'module', module: 'nor_dff', x: 1400, y: 400 });
  const lamps: Array<[string, string, string, number, number]> = [
    ['l_s1', 'STEP1', 'pc1.Q', 400, 40], ['l_s0', 'STEP0', 'pc0.Q', 400, 0],
    ['l_i3', 'I3', 'rom.I3', 800, 0], ['l_i2', 'I2', 'rom.I2', 860, 0], ['l_i1', 'I1', 'rom.I1', 920, 0], ['l_i0', 'I0', 'rom.I0', 980, 0],
    ['l_ien', 'IEN', 'ien.Q', 1000, 440], ['l_oen', 'OEN', 'oen.Q', 1000, 720],
    ['l_rr', 'RR', 'rr.Q', 1400, 120], ['l_we', 'WRITE', we, 1400, 600], ['l_out', 'OUT', 'out.Q', 1600, 400],
  ];
  // wires
  for (const ff of ['pc0', 'pc1', 'ien', 'oen', 'rr', 'out']) s.wire('clk.out', `${ff}.CLK`);
  s.wire('one.out', 'pc0.LE'); s.wire('one.out', 'pc1.LE');
  s.wire('pc1.QN', 'pc0.D'); s.wire('pc0.Q', 'pc1.D');
  s.wire('pc1.Q', 'rom.Q1'); s.wire('pc1.QN', 'rom.QN1'); s.wire('pc0.Q', 'rom.Q0'); s.wire('pc0.QN', 'rom.QN0');
  for (const k of [0, 1, 2, 3]) s.wire(`rom.I${k}`, `dec.I${k}`);
  for (const k of [0, 1, 2, 3]) s.wire(`dec.F${k}`, `lu.F${k}`);
  s.wire('din.out', 'ien.D'); s.wire('dec.LDI', 'ien.LE');
  s.wire('din.out', 'oen.D'); s.wire('dec.LDO', 'oen.LE');
  s.wire('rr.Q', 'lu.A'); s.wire(dMask, 'lu.B');
  s.wire('lu.Y', 'rr.D'); s.wire('dec.LDR', 'rr.LE');
  s.wire('lu.Y', 'out.D'); s.wire(we, 'out.LE');
  for (const [id, label, from, x, y] of lamps) {
    s.add({ id, kind: 'lamp', label, x, y });
    s.wire(from, `${id}.in`);
  }
  s.add({ id: 'note', kind: 'note', x: 40, y: 880, text: note() });
  const parsed = parseBoardFile({
    format: 'gatefold-board', version: 1, title: '1-bit processor', family: 'tube-drl-nor',
    parts: s.parts, wires: s.wires,
    modules: [flipFlopModule(), logicUnitModule(), decoderModule(), romModule()],
  });
  if (!parsed.ok) throw new Error(parsed.problems.map((p) => p.message).join('; '));
  return canonicalBoard(parsed.board);
}

export const EXAMPLE_FILE = new URL('../../examples/one-bit-processor.gatefold.json', import.meta.url);

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  writeFileSync(EXAMPLE_FILE, JSON.stringify(buildOneBitProcessor(), null, 2) + '\n');
}
