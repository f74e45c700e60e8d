/**
 * Test vectors on the ISCAS-85 benchmark circuits (Brglez and Fujiwara, "A neutral netlist of 10
 * combinational benchmark circuits", ISCAS 1985), converted to board files in tests/fixtures (see its
 * README). Every vector set is checked by the plain pin-by-pin evaluator of plain-eval.ts.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { boardOf, testVectors } from '../../shared/bringup';
import { PlainBoard, parseFault, settingsOf } from './plain-eval';

const load = (name: string) => boardOf(JSON.parse(readFileSync(new URL(`../fixtures/${name}`, import.meta.url), 'utf8')));

/** Every single stuck-at fault of the plain evaluator's own list: each pin of each part, sa0 and sa1. */
function pinFaults(board: ReturnType<typeof load>): string[] {
  const used = new Set(board.wires.flatMap((w) => [w.from, w.to]));
  const out: string[] = [];
  for (const p of board.parts) {
    const pins: string[] = p.kind === 'switch' ? ['out', 'outn'] : p.kind === 'lamp' ? ['in'] : p.kind === 'note' ? []
      : p.kind === 'not' || p.kind === 'buffer' ? ['in0', 'out'] : [...Array.from({ length: (p as { inputs: number }).inputs }, (_, i) => `in${i}`), 'out'];
    // an output pin wired to nothing is no line of the build
    for (const pin of pins) if (used.has(`${p.id}.${pin}`) || !['out', 'outn'].includes(pin)) out.push(`${p.id}.${pin} sa0`, `${p.id}.${pin} sa1`);
  }
  return out;
}

describe('ISCAS-85 c17', () => {
  const board = load('iscas85-c17.gatefold.json');
  const plain = new PlainBoard(board);
  const all = Array.from({ length: 32 }, (_, r) => r.toString(2).padStart(5, '0'));
  const faults = pinFaults(board);
  const detects = (vec: string, f: string) => plain.run(settingsOf(vec), parseFault(f)).join('') !== plain.run(settingsOf(vec)).join('');

  it('finds every single stuck-at fault detectable, as brute force over all 32 vectors shows', () => {
    // CHECKS.md: "Every single stuck-at fault of c17 is detectable (check by brute force over its 32 input vectors)"
    for (const f of faults) expect(all.some((v) => detects(v, f)), f).toBe(true);
    const r = testVectors(board);
    expect(r.faults).toBe(faults.length);
    expect(r.detected).toBe(faults.length);
    expect(r.undetectable).toEqual([]);
  });

  it('collapses to the 22 faults of the usual equivalence collapsing', () => {
    // c17's equivalence-collapsed fault count is 22 (from memory; the same count the distributed
    // .bench headers call "simplistically reduced equivalent fault set size")
    expect(testVectors(board).collapsed).toBe(22);
  });

  it('gives vectors with the right lamps that detect every fault, and says minimal only when no smaller set exists', () => {
    const r = testVectors(board);
    for (const v of r.vectors) expect(plain.run(settingsOf(v.in)).join('')).toBe(v.out);
    for (const f of faults) expect(r.vectors.some((v) => detects(v.in, f)), f).toBe(true);
    expect(r.minimal).toBe(true);
    // brute force: no set of one fewer vector (from all 32) detects every fault
    const k = r.vectors.length - 1;
    const detSets = all.map((v) => new Set(faults.filter((f) => detects(v, f))));
    const covers = (pick: number[]) => faults.every((f) => pick.some((i) => detSets[i].has(f)));
    const choose = (from: number, pick: number[]): boolean => {
      if (pick.length === k) return covers(pick);
      for (let i = from; i < 32; i++) if (choose(i + 1, [...pick, i])) return true;
      return false;
    };
    expect(choose(0, [])).toBe(false);
  });
});

describe('ISCAS-85 c880', () => {
  const board = load('iscas85-c880.gatefold.json');
  const r = testVectors(board);

  it('collapses to the 942 faults named in the distributed netlist', () => {
    // c880.bench header: "simplistically reduced equivalent fault set size = 942"
    expect(r.collapsed).toBe(942);
  });

  it('detects every fault (c880 has no redundant faults), and the plain evaluator agrees for each vector', () => {
    // no redundant faults in c880: from memory (CHECKS.md), and every fault is shown detected below
    const plain = new PlainBoard(board);
    const faults = pinFaults(board);
    expect(r.faults).toBe(faults.length);
    expect(r.undetectable).toEqual([]);
    expect(r.undecided).toEqual([]);
    expect(r.detected).toBe(faults.length);
    const good = r.vectors.map((v) => plain.run(settingsOf(v.in)).join(''));
    r.vectors.forEach((v, k) => expect(good[k]).toBe(v.out));
    for (const f of faults) {
      const fault = parseFault(f);
      expect(r.vectors.some((v, k) => plain.run(settingsOf(v.in), fault).join('') !== good[k]), f).toBe(true);
    }
    // the search could not prove minimality on 60 inputs, and says so
    expect(r.minimal).toBe(false);
  }, 240_000);
});
