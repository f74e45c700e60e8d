/**
 * Undetectable (redundant) faults: a board with a consensus term — Y = A·B + A'·C + B·C, where B·C is
 * redundant by the consensus theorem (common practice, textbook) — beside a 20-input parity chain, so the
 * board has 23 inputs and the tool must use its PODEM search (no exhaustive check). Each fault it calls
 * undetectable is proved independently with logic-solver (a SAT solver on npm): "good XOR faulty" on
 * some lamp must be unsatisfiable. Every other fault must be detected by the vectors (plain evaluator).
 */
import Logic, { type Formula } from 'logic-solver';
import { describe, expect, it } from 'vitest';
import type { BoardFile } from '../../shared/board';
import { boardOf, testVectors } from '../../shared/bringup';
import { PlainBoard, parseFault, settingsOf, type PlainFault } from './plain-eval';

function consensusBoard(): BoardFile {
  const parts: Record<string, unknown>[] = [
    { id: 'a', kind: 'switch', label: 'A' }, { id: 'b', kind: 'switch', label: 'B' }, { id: 'c', kind: 'switch', label: 'C' },
    { id: 'na', kind: 'not' }, { id: 'g1', kind: 'and', inputs: 2 }, { id: 'g2', kind: 'and', inputs: 2 }, { id: 'g3', kind: 'and', inputs: 2 },
    { id: 'y', kind: 'or', inputs: 3 }, { id: 'ly', kind: 'lamp', label: 'Y' },
  ];
  const wires: [string, string][] = [
    ['a.out', 'g1.in0'], ['b.out', 'g1.in1'], ['a.out', 'na.in0'], ['na.out', 'g2.in0'], ['c.out', 'g2.in1'],
    ['b.out', 'g3.in0'], ['c.out', 'g3.in1'], ['g1.out', 'y.in0'], ['g2.out', 'y.in1'], ['g3.out', 'y.in2'], ['y.out', 'ly.in'],
  ];
  for (let i = 0; i < 20; i++) parts.push({ id: `e${i}`, kind: 'switch', label: `E${i}` });
  for (let i = 1; i < 20; i++) {
    parts.push({ id: `x${i}`, kind: 'xor', inputs: 2 });
    wires.push([i === 1 ? 'e0.out' : `x${i - 1}.out`, `x${i}.in0`], [`e${i}.out`, `x${i}.in1`]);
  }
  parts.push({ id: 'lp', kind: 'lamp', label: 'P' });
  wires.push(['x19.out', 'lp.in']);
  return boardOf({
    format: 'gatefold-board', version: 1, title: 'Consensus and parity', family: 'ideal',
    parts: parts.map((p, k) => ({ x: 40 * k, y: 0, ...p })), wires: wires.map(([from, to], k) => ({ id: `w${k}`, from, to })),
  });
}

/** The lamps of the board as logic-solver formulas over the switch labels, with an optional stuck pin. */
function lampFormulas(board: BoardFile, fault?: PlainFault): Formula[] {
  const driver = new Map<string, string>();
  for (const w of board.wires) driver.set(w.to, w.from); // every wire here runs from an output to an input
  const stuck = (ref: string) => (fault && `${fault.part}.${fault.pin}` === ref ? (fault.value ? Logic.TRUE : Logic.FALSE) : undefined);
  const parts = new Map(board.parts.map((p) => [p.id, p]));
  const inPin = (ref: string): Formula => stuck(ref) ?? outPin(driver.get(ref)!);
  const outPin = (ref: string): Formula => {
    const s = stuck(ref);
    if (s) return s;
    const [id] = ref.split('.');
    const p = parts.get(id)!;
    const ins = () => Array.from({ length: (p as { inputs: number }).inputs }, (_, i) => inPin(`${id}.in${i}`));
    switch (p.kind) {
      case 'switch': return p.label!;
      case 'not': return Logic.not(inPin(`${id}.in0`));
      case 'and': return Logic.and(...ins());
      case 'or': return Logic.or(...ins());
      case 'xor': return Logic.xor(...ins());
      default: throw new Error(p.kind);
    }
  };
  return board.parts.filter((p) => p.kind === 'lamp').map((p) => inPin(`${p.id}.in`));
}

describe('redundant faults', () => {
  const board = consensusBoard();
  const r = testVectors(board);

  it('names the consensus gate faults undetectable, each proved by SAT', () => {
    expect(r.undetectable.length).toBeGreaterThan(0);
    expect(r.undetectable).toContain('g3.out sa0');
    const good = lampFormulas(board);
    for (const name of r.undetectable) {
      const bad = lampFormulas(board, parseFault(name));
      const solver = new Logic.Solver();
      solver.require(Logic.or(...good.map((g, k) => Logic.xor(g, bad[k]))));
      expect(solver.solve(), `${name} should have no test`).toBeNull();
      expect(r.reasons.find((x) => x.fault === name)!.reason).toMatch(/PODEM|no path/);
    }
  });

  it('detects every other fault with its vectors (plain evaluator)', () => {
    const plain = new PlainBoard(board);
    const all = [...new Set(board.parts.flatMap((p) => ['out', 'outn', 'in', 'in0', 'in1', 'in2'].map((pin) => `${p.id}.${pin}`)))];
    const used = new Set(board.wires.flatMap((w) => [w.from, w.to]));
    const faults = all.filter((ref) => used.has(ref)).flatMap((ref) => [`${ref} sa0`, `${ref} sa1`]);
    expect(r.faults).toBe(faults.length);
    const good = r.vectors.map((v) => plain.run(settingsOf(v.in)).join(''));
    r.vectors.forEach((v, k) => expect(good[k]).toBe(v.out));
    for (const f of faults) {
      if (r.undetectable.includes(f)) continue;
      expect(r.vectors.some((v, k) => plain.run(settingsOf(v.in), parseFault(f)).join('') !== good[k]), f).toBe(true);
    }
    expect(r.detected + r.undetectable.length).toBe(r.faults);
  });
});
