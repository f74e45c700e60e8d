/**
 * Builds the tube group's demo 1-bit processor (examples/one-bit-processor.gatefold.json) from NOR gates
 * only, in modules: a NOR D flip-flop with load enable (six instances), an instruction decoder, a logic
 * unit of 16 operations and a 4-step program ROM. No gate output drives more than four loads (the fan-out
 * of the tube family 'tube-drl-nor'; an inverter's two tied inputs count as two): the decoder predecodes,
 * the ROM decodes the step once, and two driver gates at the top take the load off flip-flop outputs.
 * Run `npx tsx tests/helpers/one-bit-processor.ts` to write the example file again.
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

/**
 * NOR D flip-flop with load enable: a D mux, a master NOR latch open while CLK is 0, a slave open while
 * CLK is 1 (rising edge). The mux is D' = (NOT LE + D)(LE + Q), two levels of NOR straight from D, so D is
 * one load (no inverter on it) and the outputs keep room to drive others: inside, Q feeds QN's latch gate
 * and the mux (two loads), QN feeds Q's latch gate (one), of the tube family's four.
 */
function flipFlopModule() {
  const s = new Sheet();
  // Q and QN first: the power-on resolution (decision 002) settles a held latch with its first gate low, so Q = 0.
  s.add({ id: 'g_q', kind: 'nor', inputs: 2, x: 1280, y: 80 });
  s.add({ id: 'g_qn', kind: 'nor', inputs: 2, x: 1280, y: 220 });
  const d = s.port('p_d', 'in', 'D', 0, 20);
  const le = s.port('p_le', 'in', 'LE', 0, 140);
  const clk = s.port('p_clk', 'in', 'CLK', 0, 380);
  const nle = s.nor('g_nle', 160, 200, [le]);
  const a = s.nor('g_a', 320, 20, [d, nle]); // NOT (D OR NOT LE)
  const b = s.nor('g_b', 320, 140, [le, 'g_q.out']); // NOT (LE OR Q)
  const dm = s.nor('g_dm', 480, 80, [a, b]); // D' = LE ? D : Q
  const ndm = s.nor('g_ndm', 640, 20, [dm]);
  const sm = s.nor('g_sm', 800, 20, [ndm, clk]); // set master: D' AND NOT CLK
  const rm = s.nor('g_rm', 800, 260, [dm, clk]); // reset master
  const qm = s.nor('g_qm', 960, 80, [rm, 'g_qnm.out']);
  s.nor('g_qnm', 960, 200, [sm, qm]);
  const nclk = s.nor('g_nclk', 480, 360, [clk]);
  const ss = s.nor('g_ss', 1120, 180, ['g_qnm.out', nclk]); // set slave: Qm AND CLK
  const rs = s.nor('g_rs', 1120, 60, [qm, nclk]);
  s.wire(rs, 'g_q.in0');
  s.wire('g_qn.out', 'g_q.in1');
  s.wire(ss, 'g_qn.in0');
  s.wire('g_q.out', 'g_qn.in1');
  s.wire('g_q.out', s.port('p_q', 'out', 'Q', 1440, 90));
  s.wire('g_qn.out', s.port('p_qn', 'out', 'QN', 1440, 230));
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

/** The control lines of the decoder and the instructions that set each. */
const CONTROLS: Array<[string, (n: number) => boolean]> = [
  ...[0, 1, 2, 3].map((k): [string, (n: number) => boolean] => [`F${k}`, (n) => INSTRUCTIONS[n].f[3 - k] === '1']),
  ['LDR', (n) => Boolean(INSTRUCTIONS[n].ldr)],
  ['LDI', (n) => Boolean(INSTRUCTIONS[n].ldi)],
  ['LDO', (n) => Boolean(INSTRUCTIONS[n].ldo)],
  ['WR', (n) => Boolean(INSTRUCTIONS[n].wr)],
];

/**
 * Instruction decoder, built so that no gate drives more than four loads (the tube family's fan-out):
 * - the two halves of the opcode are predecoded apart: H a is 1 when I3 I2 = a, L b when I1 I0 = b, each a
 *   NOR of the two literals that are 0 there; the fourth line of each half is the NOR of the other three
 *   (one of the four is always 1), which spares the true literals a load;
 * - inverters give NOT H a, NOT L b; opcode line n = a·4 + b is the NOR of NOT H a and NOT L b, each inverted
 *   line feeding at most four opcode lines;
 * - each control line is the NOR of the opcode lines where it is 0 (a one-hot NOR gives the OR of the
 *   others), or, with more than eight such lines, the NOR of the lines where it is 1 and an inverter; a line
 *   set by one opcode is that opcode line itself. WR (opcodes 111x) is the NOR of NOT I3, NOT I2, NOT I1, and
 *   LDR (0 for 11xx) the NOR of the IEN and OEN lines and WR. Opcode lines no control line reads are not built.
 */
function decoderModule() {
  const s = new Sheet();
  // ports I3 first, as the ROM gives them
  const i = [3, 2, 1, 0].map((k) => s.port(`p_i${k}`, 'in', `I${k}`, 0, 40 + 100 * (3 - k))).reverse();
  const ni = i.map((ik, k) => s.nor(`g_ni${k}`, 160, 60 + 100 * (3 - k), [ik]));
  const lits = (hi: number, lo: number, v: number) => [(v >> 1) & 1 ? ni[hi] : i[hi], v & 1 ? ni[lo] : i[lo]];
  // predecode: half h (0 high: I3 I2, 1 low: I1 I0), value v
  const halves = [[3, 2, 'h'], [1, 0, 'l']] as const;
  const pre = halves.map(([hi, lo, name], h) => {
    const y0 = 40 + 360 * h;
    const lines: string[] = [];
    for (const v of [1, 2, 3]) lines[v] = s.nor(`g_${name}${v}`, 320, y0 + 80 * (v - 1), lits(hi, lo, v));
    lines[0] = s.nor(`g_${name}0`, 480, y0, [lines[1], lines[2], lines[3]]);
    return lines;
  });
  const npre = halves.map(([, , name], h) => [0, 1, 2, 3].map((v) =>
    s.nor(`g_n${name}${v}`, 640, 40 + 360 * h + 80 * v, [pre[h][v]])));
  const zerosOf = (on: (n: number) => boolean) => Array.from({ length: 16 }, (_, n) => n).filter((n) => !on(n));
  const onesOf = (on: (n: number) => boolean) => Array.from({ length: 16 }, (_, n) => n).filter((n) => on(n));
  // which opcode lines each control line reads
  const plan = CONTROLS.map(([label, on]) => {
    if (label === 'WR' || label === 'LDR') return { label, lines: label === 'LDR' ? [12, 13] : [], form: label };
    const ones = onesOf(on);
    if (ones.length === 1) return { label, lines: ones, form: 'line' };
    const zeros = zerosOf(on);
    return zeros.length <= 8 ? { label, lines: zeros, form: 'zeros' } : { label, lines: ones, form: 'ones' };
  });
  const used = new Set(plan.flatMap((p) => p.lines));
  const line: string[] = [];
  let row = 0;
  for (let n = 0; n < 16; n++) {
    if (!used.has(n)) continue;
    line[n] = s.nor(`g_op${n}`, 800, 40 + 80 * row++, [npre[0][n >> 2], npre[1][n & 3]]);
  }
  let y = 40;
  const order = ['F0', 'F1', 'F2', 'F3', 'LDR', 'LDI', 'LDO', 'WR'];
  for (const p of [...plan].sort((a, b) => order.indexOf(a.label) - order.indexOf(b.label))) {
    const id = p.label.toLowerCase();
    let out: string;
    if (p.form === 'line') {
      out = line[p.lines[0]];
      s.wire(out, s.port(`p_${id}`, 'out', p.label, 1280, y));
      y += 80;
      continue;
    }
    const inputs = p.form === 'WR' ? [ni[3], ni[2], ni[1]] : p.form === 'LDR' ? [...p.lines.map((n) => line[n]), 'g_wr.out'] : p.lines.map((n) => line[n]);
    const h = (inputs.length + 1) * 20;
    out = p.form === 'ones'
      ? s.nor(`g_${id}`, 1120, y + h / 2 - 30, [s.nor(`g_n${id}`, 960, y, inputs)])
      : s.nor(`g_${id}`, 960, y, inputs);
    s.wire(out, s.port(`p_${id}`, 'out', p.label, 1280, y + h / 2 - 20));
    y += h + 40;
  }
  return { id: 'decoder', title: 'Instruction decoder', parts: s.parts, wires: s.wires };
}

/**
 * Program ROM, 4 steps × 4 bits, one constant per bit. The step lines S0…S3 come from the 2-bit Johnson
 * count (00, 01, 11, 10): three as the NOR of the two literals that are 0 in that step, S1 as the NOR of the
 * other three; inverters give NOT S, each feeding the four zero terms of its step. Zero term (step s, bit k)
 * = S s AND NOT bit = NOR(NOT S s, constant); bit k is the NOR of its four zero terms.
 */
function romModule() {
  const s = new Sheet();
  const q1 = s.port('p_q1', 'in', 'Q1', 0, 20);
  const qn1 = s.port('p_qn1', 'in', 'QN1', 0, 100);
  const q0 = s.port('p_q0', 'in', 'Q0', 0, 180);
  const qn0 = s.port('p_qn0', 'in', 'QN0', 0, 260);
  const st: string[] = [];
  st[0] = s.nor('g_s0', 160, 0, [q1, q0]);
  st[3] = s.nor('g_s3', 160, 80, [qn1, q0]);
  st[2] = s.nor('g_s2', 160, 200, [qn1, qn0]);
  st[1] = s.nor('g_s1', 320, 300, [st[0], st[2], st[3]]);
  // the inverters stepped to the right, so that their wires down to the zero terms run apart
  const nst = [0, 1, 2, 3].map((k) => s.nor(`g_ns${k}`, 480 + 40 * k, [0, 300, 200, 80][k], [st[k]]));
  const words = PROGRAM.map((name) => INSTRUCTIONS.find((ins) => ins.name === name)!.op);
  for (let k = 3; k >= 0; k--) {
    const y0 = 400 * (3 - k);
    // zero term (step s, bit k): 1 in step s when the stored bit is 0; the bit is the NOR of the zero terms
    const zeroTerms = [0, 1, 2, 3].map((sn) => {
      const c = s.add({ id: `c_s${sn}_b${k}`, kind: 'const', value: (words[sn] >> k) & 1, x: 840, y: y0 + 100 * sn + 40 });
      return s.nor(`g_z${sn}_b${k}`, 960, y0 + 100 * sn, [nst[sn], `${c}.out`]);
    });
    s.wire(s.nor(`g_b${k}`, 1120, y0 + 140, zeroTerms), s.port(`p_i${k}`, 'out', `I${k}`, 1280, y0 + 160));
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
  s.add({ id: 'din', kind: 'switch', label: 'DIN', x: 80, y: 520, on: false });
  s.add({ id: 'clk', kind: 'clock', label: 'CLK', x: 40, y: 40 });
  s.add({ id: 'one', kind: 'const', value: 1, x: 40, y: 180 });
  // program counter: two flip-flops, always loading (LE = 1), counting 00 → 01 → 11 → 10
  s.add({ id: 'pc0', kind: 'module', module: 'nor_dff', x: 200, y: 40 });
  s.add({ id: 'pc1', kind: 'module', module: 'nor_dff', x: 200, y: 200 });
  // STEP0's driver: pc0's Q already feeds its own latch, its mux and pc1, so the ROM and the lamp take QN inverted
  const step0 = s.nor('g_step0', 400, 80, ['pc0.QN']);
  s.add({ id: 'rom', kind: 'module', module: 'rom', x: 560, y: 200 });
  s.add({ id: 'dec', kind: 'module', module: 'decoder', x: 1080, y: 200 });
  s.add({ id: 'ien', kind: 'module', module: 'nor_dff', x: 1300, y: 440 });
  s.add({ id: 'oen', kind: 'module', module: 'nor_dff', x: 1340, y: 600 });
  // RR's driver for the logic unit (A is four loads there); rr's own Q keeps its latch, its mux and the lamp
  const rrDrive = s.nor('g_rr', 1300, 140, ['rr.QN']);
  const nwr = s.nor('g_nwr', 1460, 380, ['dec.WR']);
  const dMask = s.nor('g_d', 1500, 540, ['din.outn', 'ien.QN']); // D = DIN AND IEN
  s.add({ id: 'lu', kind: 'module', module: 'logic_unit', x: 1680, y: 160 });
  const we = s.nor('g_we', 1680, 620, [nwr, 'oen.QN']); // WR AND OEN
  s.add({ id: 'rr', kind: 'module', module: 'nor_dff', x: 1900, y: 300 });
  s.add({ id: 'out', kind: 'module', module: 'nor_dff', x: 1900, y: 520 });
  const lamps: Array<[string, string, string, number, number]> = [
    ['l_s0', 'STEP0', step0, 560, 80], ['l_s1', 'STEP1', 'pc1.Q', 400, 340],
    // the instruction lamps stepped up and to the left, so that no lamp's wire crosses another lamp
    ['l_i3', 'I3', 'rom.I3', 760, 20], ['l_i2', 'I2', 'rom.I2', 840, 80], ['l_i1', 'I1', 'rom.I1', 920, 140], ['l_i0', 'I0', 'rom.I0', 1000, 180],
    ['l_ien', 'IEN', 'ien.Q', 1500, 460], ['l_oen', 'OEN', 'oen.Q', 1540, 700],
    ['l_rr', 'RR', 'rr.Q', 2120, 320], ['l_we', 'WRITE', we, 1900, 680], ['l_out', 'OUT', 'out.Q', 2120, 540],
  ];
  // wires
  for (const ff of ['pc0', 'pc1', 'ien', 'oen', 'rr', 'out']) s.wire('clk.out', `${ff}.CLK`);
  s.wire('one.out', 'pc0.LE'); s.wire('one.out', 'pc1.LE');
  s.wire('pc1.QN', 'pc0.D'); s.wire('pc0.Q', 'pc1.D');
  s.wire('pc1.Q', 'rom.Q1'); s.wire('pc1.QN', 'rom.QN1'); s.wire(step0, 'rom.Q0'); s.wire('pc0.QN', 'rom.QN0');
  for (const k of [0, 1, 2, 3]) s.wire(`rom.I${k}`, `dec.I${k}`);
  for (const k of [0, 1, 2, 3]) s.wire(`dec.F${k}`, `lu.F${k}`);
  s.wire('din.out', 'ien.D'); s.wire('dec.LDI', 'ien.LE');
  s.wire('din.out', 'oen.D'); s.wire('dec.LDO', 'oen.LE');
  s.wire(rrDrive, 'lu.A'); s.wire(dMask, 'lu.B');
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
