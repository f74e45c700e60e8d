import type { BoardFile, Part, Wire } from '../../shared/board';

/** A gate in a test circuit: `ins` name a switch label (`A`, or `~A` for its complement pin) or another gate id. */
export interface GateSpec { id: string; kind: 'and' | 'or' | 'nand' | 'nor' | 'xor' | 'xnor' | 'not' | 'buffer'; ins: string[] }

/**
 * A board file of switches (labels = inputs), gates and lamps (label → the gate or input it shows),
 * laid out on a simple grid. Test-only helper.
 */
export function buildBoard(title: string, inputs: string[], gates: GateSpec[], lamps: Record<string, string>, extra: { parts?: Part[]; wires?: Wire[] } = {}): BoardFile {
  const parts: Part[] = [];
  const wires: Wire[] = [];
  inputs.forEach((label, i) => parts.push({ id: `sw_${label}`, kind: 'switch', label, x: 40, y: 40 + 80 * i, on: false }));
  const src = (ref: string) => {
    if (ref.startsWith('~')) return `sw_${ref.slice(1)}.outn`;
    return inputs.includes(ref) ? `sw_${ref}.out` : `${ref}.out`;
  };
  gates.forEach((g, i) => {
    const base = { id: g.id, x: 200 + 120 * (i % 6), y: 40 + 80 * Math.floor(i / 6) };
    if (g.kind === 'not' || g.kind === 'buffer') parts.push({ ...base, kind: g.kind });
    else parts.push({ ...base, kind: g.kind, inputs: g.ins.length });
    g.ins.forEach((ref, k) => wires.push({ id: `w_${g.id}_${k}`, from: src(ref), to: `${g.id}.in${k}` }));
  });
  Object.entries(lamps).forEach(([label, ref], i) => {
    parts.push({ id: `lamp_${label}`, kind: 'lamp', label, x: 1000, y: 40 + 80 * i });
    wires.push({ id: `w_lamp_${label}`, from: src(ref), to: `lamp_${label}.in` });
  });
  parts.push(...(extra.parts ?? []));
  wires.push(...(extra.wires ?? []));
  return { format: 'gatefold-board', version: 1, title, family: 'ideal', parts, wires };
}

/**
 * Each of the 16 two-input functions as a small gate circuit of A and B (gate ids prefixed), keyed by
 * its id; `out` is the gate whose output is the function.
 */
export function twoInputCircuits(prefix = ''): Record<string, { gates: GateSpec[]; out: string }> {
  const p = (s: string) => `${prefix}${s}`;
  const one = (kind: GateSpec['kind'], ins: string[]) => ({ gates: [{ id: p('g'), kind, ins }], out: p('g') });
  return {
    FALSE: one('and', ['A', '~A']),
    AND: one('and', ['A', 'B']),
    A_AND_NOT_B: one('and', ['A', '~B']),
    A: one('buffer', ['A']),
    NOT_A_AND_B: { gates: [{ id: p('n'), kind: 'not', ins: ['A'] }, { id: p('g'), kind: 'and', ins: [p('n'), 'B'] }], out: p('g') },
    B: one('buffer', ['B']),
    XOR: one('xor', ['A', 'B']),
    OR: one('or', ['A', 'B']),
    NOR: one('nor', ['A', 'B']),
    XNOR: one('xnor', ['A', 'B']),
    NOT_B: one('not', ['B']),
    A_OR_NOT_B: { gates: [{ id: p('n'), kind: 'not', ins: ['B'] }, { id: p('g'), kind: 'or', ins: ['A', p('n')] }], out: p('g') },
    NOT_A: one('not', ['A']),
    NOT_A_OR_B: { gates: [{ id: p('n'), kind: 'nand', ins: ['A', 'A'] }, { id: p('g'), kind: 'or', ins: [p('n'), 'B'] }], out: p('g') },
    NAND: one('nand', ['A', 'B']),
    TRUE: one('or', ['A', '~A']),
  };
}
