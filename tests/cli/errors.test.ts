/**
 * Bad input to the command line (CONTRACTS §2): exit code 2, one line `error: …` on stderr naming the
 * offending id, nothing on stdout, never a stack trace.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { runCli } from './run-cli';

const dir = mkdtempSync(join(tmpdir(), 'gatefold-cli-err-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const base = () => ({
  format: 'gatefold-board', version: 1, title: 't', family: 'ideal',
  parts: [{ id: 'a', kind: 'switch', label: 'A' }, { id: 'g', kind: 'not' }, { id: 'y', kind: 'lamp', label: 'Y' }],
  wires: [{ id: 'w1', from: 'a.out', to: 'g.in0' }, { id: 'w2', from: 'g.out', to: 'y.in' }],
});

function write(name: string, content: unknown): string {
  const path = join(dir, name);
  writeFileSync(path, typeof content === 'string' ? content : JSON.stringify(content));
  return path;
}

const good = write('good.json', base());
const unknownKind = base(); unknownKind.parts[1] = { id: 'g', kind: 'triode' } as never;
const unknownPin = base(); unknownPin.wires[0].to = 'g.grid';
const dupLabel = base(); dupLabel.parts[2].label = 'A'; dupLabel.parts[2].kind = 'switch';
const missing = base(); missing.wires[1].to = 'nowhere.in';

const cases: [string, string[], RegExp][] = [
  ['unreadable file', ['simulate', join(dir, 'absent.json')], /absent\.json/],
  ['bad JSON', ['simulate', write('bad.json', '{"format": ')], /not valid JSON/],
  ['unknown kind', ['simulate', write('kind.json', unknownKind)], /\bg\b.*unknown kind "triode"/],
  ['unknown pin', ['simulate', write('pin.json', unknownPin)], /w1.*no pin "grid"/],
  ['duplicate label', ['simulate', write('dup.json', dupLabel)], /\by\b.*label "A" is already on a\b/],
  ['wire to a missing part', ['simulate', write('missing.json', missing)], /w2.*missing part "nowhere"/],
  ['unknown --set label', ['simulate', good, '--set', 'B=1'], /unknown input label "B"/],
  ['bad --set value', ['simulate', good, '--set', 'A=2'], /A=2/],
  ['unknown --clock label', ['simulate', good, '--clock', 'CLK', '--cycles', '2'], /unknown input label "CLK"/],
  ['bad --cycles', ['simulate', good, '--clock', 'A', '--cycles', 'many'], /--cycles: "many" must be a whole number ≥ 1/],
  ['negative --cycles', ['simulate', good, '--clock', 'A', '--cycles', '-1'], /--cycles: "-1" must be a whole number ≥ 1/],
  ['zero --cycles', ['simulate', good, '--clock', 'A', '--cycles', '0'], /--cycles: "0" must be a whole number ≥ 1/],
  ['unknown flag', ['simulate', good, '--fast'], /--fast/],
  ['bad --power-on', ['simulate', good, '--power-on', 'low'], /--power-on: "low" is not resolve or x/],
  ['--power-on without a value', ['simulate', good, '--power-on'], /--power-on/],
  ['unknown command', ['frobnicate', good], /unknown command "frobnicate"/],
  ['no file', ['export-verilog'], /missing FILE/],
  ['unwritable --vcd', ['simulate', good, '--vcd', join(dir, 'no-such-dir', 'out.vcd')], /cannot write .*out\.vcd/],
  ['export of a bad file', ['export-verilog', write('kind2.json', unknownKind)], /unknown kind "triode"/],
];

describe('command-line errors', () => {
  it.each(cases)('%s: exit 2, one line on stderr, nothing on stdout', async (_name, args, pattern) => {
    const r = await runCli(args);
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    const lines = r.stderr.split('\n').filter(Boolean);
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(/^error: /);
    expect(lines[0]).toMatch(pattern);
    expect(r.stderr).not.toMatch(/\n\s+at /);
  });
});
