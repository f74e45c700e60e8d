/**
 * The command line built ahead of time (scripts/build-cli.mjs): one bundle per command, each named in the
 * registry (server/cli/commands/index.ts) and in its own file; the `analyze` bundle leaves out zod and
 * yjs (a valid board is checked by the quick shape check, an invalid one through dist-cli/board-check.cjs,
 * which still words zod's message).
 */
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { COMMANDS } from '../../server/cli/commands';
import { runCli } from './run-cli';

const root = join(import.meta.dirname, '..', '..');
const dir = mkdtempSync(join(tmpdir(), 'gatefold-cli-bundles-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('command bundles', () => {
  it('registers every command file under its file name, as its default export', async () => {
    const files = readdirSync(join(root, 'server/cli/commands'))
      .filter((f) => f.endsWith('.ts') && !f.endsWith('.test.ts') && f !== 'index.ts' && f !== 'types.ts')
      .map((f) => f.slice(0, -3));
    expect(Object.keys(COMMANDS).sort()).toEqual(files.sort());
    for (const load of Object.values(COMMANDS)) {
      const command = await load();
      expect(typeof command.run).toBe('function');
      expect(command.usage).toMatch(/^[a-z-]+ /);
    }
  });

  it('builds one bundle per command; analyze holds neither zod nor yjs and still words zod errors', async () => {
    const ok = await runCli(['analyze', join(root, 'examples/half-adder.gatefold.json')]);
    expect(ok.code).toBe(0);
    const record = JSON.parse(readFileSync(join(root, 'dist-cli/build.json'), 'utf8')) as { commands: Record<string, string> };
    expect(Object.keys(record.commands).sort()).toEqual(Object.keys(COMMANDS).sort());
    const analyze = readFileSync(join(root, 'dist-cli', record.commands.analyze), 'utf8');
    expect(analyze).not.toContain('$ZodType'); // zod's class names survive minifying
    expect(analyze).not.toContain('__ $YJS$ __'); // yjs's import guard
    expect(readFileSync(join(root, 'dist-cli/board-check.cjs'), 'utf8')).toContain('$ZodType');

    const file = join(dir, 'bad-inputs.json');
    const board = JSON.parse(readFileSync(join(root, 'examples/half-adder.gatefold.json'), 'utf8')) as { parts: Record<string, unknown>[] };
    const gate = board.parts.find((p) => p.kind === 'and')!;
    gate.inputs = 9;
    writeFileSync(file, JSON.stringify(board));
    const bad = await runCli(['analyze', file]);
    expect(bad.code).toBe(2);
    expect(bad.stdout).toBe('');
    expect(bad.stderr.trim().split('\n')).toHaveLength(1);
    expect(bad.stderr).toMatch(new RegExp(`^error: .*${String(gate.id)}: Too big: expected number to be <=8`));
  });
});
