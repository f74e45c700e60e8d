/**
 * `test-vectors` and `diagnose` on the command line (CONTRACTS §2 shapes; bad input → exit 2, one line).
 * c17's netlist is the one in CHECKS.md (ISCAS-85, Brglez and Fujiwara 1985); its lamps are checked
 * against the plain evaluator.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from '../cli/run-cli';
import { PlainBoard, settingsOf } from './plain-eval';
import { boardOf } from '../../shared/bringup';
import { readFileSync } from 'node:fs';

const c17 = 'tests/fixtures/iscas85-c17.gatefold.json';

describe('bring-up command line', () => {
  it('test-vectors prints the contract JSON for c17', async () => {
    const r = await runCli(['test-vectors', c17]);
    expect(r.code, r.stderr).toBe(0);
    const json = JSON.parse(r.stdout);
    expect(Object.keys(json)).toEqual(expect.arrayContaining(['faults', 'detected', 'undetectable', 'vectors', 'minimal']));
    expect(json.detected).toBe(json.faults);
    expect(json.undetectable).toEqual([]);
    const plain = new PlainBoard(boardOf(JSON.parse(readFileSync(c17, 'utf8'))));
    for (const v of json.vectors) expect(plain.run(settingsOf(v.in)).join('')).toBe(v.out);
  });

  it('diagnose ranks a stuck NAND output first when its lamp reads wrong', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'gf-diag-'));
    const plain = new PlainBoard(boardOf(JSON.parse(readFileSync(c17, 'utf8'))));
    // g22 (22 = NAND(10, 16)) stuck at 0: lamp N22 always reads 0
    const observed = ['00000', '10101', '01010', '11111', '00111'].map((v) => ({ in: v, out: plain.run(settingsOf(v), { part: 'g22', pin: 'out', value: 0 }).join('') }));
    const obs = join(dir, 'obs.json');
    writeFileSync(obs, JSON.stringify(observed));
    const r = await runCli(['diagnose', c17, '--observed', obs]);
    expect(r.code, r.stderr).toBe(0);
    const json = JSON.parse(r.stdout);
    const first = json.candidates[0];
    expect([first.fault, ...first.equivalent]).toContain('g22.out sa0');
    expect(first).toMatchObject({ explains: 5, of: 5 });
    expect(json.next.in).toMatch(/^[01]{5}$/);
  });

  it('answers bad input with exit 2 and one line', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'gf-diag-'));
    const bad = join(dir, 'bad.json');
    writeFileSync(bad, '[{"in": "01", "out": "1"}]');
    for (const args of [['test-vectors', join(dir, 'missing.json')], ['test-vectors', c17, '--outputs', 'NOPE'], ['diagnose', c17], ['diagnose', c17, '--observed', bad]]) {
      const r = await runCli(args);
      expect(r.code, args.join(' ')).toBe(2);
      expect(r.stdout).toBe('');
      expect(r.stderr.trim().split('\n')).toHaveLength(1);
      expect(r.stderr).toMatch(/^error: /);
    }
  });
});
