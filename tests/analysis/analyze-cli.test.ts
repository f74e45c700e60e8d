import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { analyzeBoard } from '../../shared/analysis';
import { randomCircuit } from '../helpers/random-circuit';

const root = new URL('../../', import.meta.url).pathname;
const fixture = join(root, 'tests/fixtures/half-adder.gatefold.json');
const dir = mkdtempSync(join(tmpdir(), 'gatefold-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function cli(...args: string[]) {
  // as `npm run -s cli` runs it: the bundle built ahead of time (rebuilt first when older than its sources)
  const r = spawnSync(process.execPath, [join(root, 'scripts/cli.mjs'), ...args], { encoding: 'utf8', cwd: root, maxBuffer: 1 << 30 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

describe('cli analyze', () => {
  // Expected output: the CONTRACTS §2 half-adder example, verbatim (S = A XOR B, C = A AND B — common practice).
  it('gives exactly the contract rows and outputsInfo for the half adder', () => {
    const r = cli('analyze', fixture);
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.inputs).toEqual(['A', 'B']);
    expect(out.outputs).toEqual(['S', 'C']);
    expect(out.sequential).toBe(false);
    expect(out.rows).toEqual([{ in: '00', out: '00' }, { in: '01', out: '10' }, { in: '10', out: '10' }, { in: '11', out: '01' }]);
    const contractFields = (o: Record<string, unknown>) => ({ sop: o.sop, pos: o.pos, function: o.function });
    expect(contractFields(out.outputsInfo.S)).toEqual({ sop: 'A & ~B | ~A & B', pos: '(A | B) & (~A | ~B)', function: 'XOR' });
    expect(contractFields(out.outputsInfo.C)).toEqual({ sop: 'A & B', pos: 'A & B', function: 'AND' });
    // our extensions beside the contract fields
    expect(out.outputsInfo.S).toMatchObject({ sopAll: ['A & ~B | ~A & B'], exact: true, sequential: false });
    expect(out.functionMap).toEqual([]);
  });

  it('builds the function map for --select and honours --inputs', () => {
    const r = cli('analyze', fixture, '--inputs', 'B,A', '--select', 'B');
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.rows.map((x: { in: string; out: string }) => x.out)).toEqual(['00', '10', '10', '01']);
    expect(out.functionMap).toEqual([
      { select: '0', data: ['A'], functions: { S: { sop: 'A', pos: 'A' }, C: { sop: '0', pos: '0' } } },
      { select: '1', data: ['A'], functions: { S: { sop: '~A', pos: '~A' }, C: { sop: 'A', pos: 'A' } } },
    ]);
  });

  it('exits 2 with one line on bad input', () => {
    const bad = join(dir, 'bad.gatefold.json');
    writeFileSync(bad, JSON.stringify({ format: 'gatefold-board', version: 1, parts: [{ id: 'g', kind: 'nand4', x: 0, y: 0 }], wires: [] }));
    for (const args of [[bad], [join(dir, 'missing.json')], [fixture, '--select', 'Q'], [fixture, '--inputs', 'A,Z'], [fixture, '--bogus']]) {
      const r = cli('analyze', ...args);
      expect(r.code, args.join(' ')).toBe(2);
      expect(r.stdout).toBe('');
      expect(r.stderr.trim().split('\n')).toHaveLength(1);
      expect(r.stderr).toMatch(/^error: /);
    }
    expect(cli('analyze', bad).stderr).toMatch(/"g"|g:/);
  }, 90_000);

  // The one don't-care rule (shared/analysis/dont-cares.ts), as the API and the panel apply it.
  it('takes --dont-cares rows and exits 2 with one line naming a bad one', () => {
    const ok = cli('analyze', fixture, '--dont-cares', '3');
    expect(ok.code).toBe(0);
    // row 11 free for both outputs: S = A | B, C = 0 (common practice, no source)
    expect(JSON.parse(ok.stdout).outputsInfo.S.sop).toBe('A | B');
    expect(JSON.parse(ok.stdout).outputsInfo.C.sop).toBe('0');
    for (const [rows, message] of [
      ['4', 'error: don\'t-care row 4 is not a row of the table (0 … 3)'],
      ['1,x', 'error: don\'t-care row "x" is not a row number'],
      ['-1', 'error: don\'t-care row "-1" is not a row number'],
    ]) {
      const r = cli('analyze', fixture, `--dont-cares=${rows}`);
      expect(r.code, rows).toBe(2);
      expect(r.stdout).toBe('');
      expect(r.stderr).toBe(`${message}\n`);
    }
  }, 60_000);

  it('exits 2 for more than 20 inputs', () => {
    const parts = Array.from({ length: 21 }, (_, i) => ({ id: `s${i}`, kind: 'switch', label: `I${i}`, x: 0, y: 0 }));
    const file = join(dir, 'wide.gatefold.json');
    writeFileSync(file, JSON.stringify({ format: 'gatefold-board', version: 1, parts, wires: [] }));
    const r = cli('analyze', file);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/limited to 20 inputs/);
  });

  // Above 4,096 rows the JSON is written compact and in pieces; the bytes are those of JSON.stringify of
  // the same analysis in this process (the shared pipeline, not the command line).
  it('writes a large table as the same bytes as JSON.stringify, streamed', () => {
    const board = randomCircuit({ seed: 5, inputs: 13, gates: 120, outputs: 3 });
    const file = join(dir, 'wide13.gatefold.json');
    writeFileSync(file, JSON.stringify(board));
    const r = cli('analyze', file);
    expect(r.code).toBe(0);
    expect(r.stderr).toBe('');
    const expected = JSON.stringify(analyzeBoard(board)) + '\n';
    expect(r.stdout.length).toBe(expected.length);
    expect(r.stdout === expected).toBe(true);
    expect(JSON.parse(r.stdout).rows).toHaveLength(8192);
  }, 60_000);
});
