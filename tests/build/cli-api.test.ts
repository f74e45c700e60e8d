/** `convert` and `build-sheet` on the real command line, and POST /api/build-sheet and /api/convert. */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyzeBoard } from '../../shared/analysis';
import { parseBoardFile } from '../../shared/board';
import { runCli } from '../cli/run-cli';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { EXAMPLE_PATH, tubeLogicUnit } from './boards';

const example = EXAMPLE_PATH.pathname;
let dir: string;
beforeAll(() => { dir = mkdtempSync(join(tmpdir(), 'gatefold-build-')); });
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('cli: convert and build-sheet', () => {
  it('convert --to nand prints a board file with the same table', async () => {
    const r = await runCli(['convert', example, '--to', 'nand']);
    expect(r.code).toBe(0);
    const parsed = parseBoardFile(JSON.parse(r.stdout));
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    expect(parsed.board.parts.filter((p) => p.kind !== 'switch' && p.kind !== 'lamp' && p.kind !== 'note').every((p) => p.kind === 'nand')).toBe(true);
    const cols = (b: typeof parsed.board) => analyzeBoard(b, { inputs: ['A', 'B'], outputs: ['N', 'D', 'X'] }).rows;
    expect(cols(parsed.board)).toEqual(cols(tubeLogicUnit().board));
  });

  it('build-sheet prints the JSON with levelCheck for the tube family and takes --set', async () => {
    const r = await runCli(['build-sheet', example, '--family', 'tube-drl-nor', '--set', 'R2=100k']);
    expect(r.code).toBe(0);
    const sheet = JSON.parse(r.stdout);
    expect(sheet.devices.tubes).toBe(8);
    // CHECKS.md divider with 100 kΩ to −12 V: (0·100 − 12·22)/122 V (Ohm's law)
    expect(sheet.levelCheck.low.grid).toBeCloseTo(-12 * 22 / 122, 3);
    expect(sheet.parts.find((p: { name: string }) => p.name === 'resistor 100 kΩ').quantity).toBe(8);
  });

  it('exits 2 with one line for an unknown family, an impossible resistor, nothing to convert, a bad target', async () => {
    const empty = join(dir, 'empty.gatefold.json');
    writeFileSync(empty, JSON.stringify({ format: 'gatefold-board', version: 1, title: 'empty', family: 'ideal', parts: [{ id: 'a', kind: 'switch', label: 'A', x: 0, y: 0 }], wires: [] }));
    const cases: [string[], RegExp][] = [
      [['build-sheet', example, '--family', 'steam'], /unknown family "steam"/],
      [['build-sheet', example, '--family', 'tube-drl-nor', '--set', 'R1=-4k7'], /impossible resistor value R1=-4k7/],
      [['build-sheet', example, '--set', 'R1=zero'], /impossible resistor value R1=zero/],
      [['convert', empty, '--to', 'nor'], /nothing to convert/],
      [['convert', example, '--to', 'xor'], /--to xor/],
      [['convert', example], /missing --to/],
    ];
    for (const [args, message] of cases) {
      const r = await runCli(args);
      expect(r.code, args.join(' ')).toBe(2);
      expect(r.stdout).toBe('');
      expect(r.stderr.trim().split('\n')).toHaveLength(1);
      expect(r.stderr).toMatch(/^error: /);
      expect(r.stderr).toMatch(message);
    }
  });
});

describe('POST /api/build-sheet and /api/convert', () => {
  let app: TestApp;
  beforeAll(async () => { app = await createTestApp(); });
  afterAll(async () => { await app.close(); });

  it('answers the build sheet and the converted board', async () => {
    const agent = await app.signUp('Mara Quinn', 'mara@larkspur.test');
    const { board } = tubeLogicUnit();
    const sheet = await agent.post('/api/build-sheet').send({ board, family: 'tube-drl-nor' });
    expect(sheet.status).toBe(200);
    expect(sheet.body.heater.amps).toBeCloseTo(8 * 0.3, 9); // 6AU6 0.3 A (tube data tables)
    expect(sheet.body.levelCheck.low.grid).toBeCloseTo(-4.8, 3);
    const converted = await agent.post('/api/convert').send({ board, to: 'nor' });
    expect(converted.status).toBe(200);
    expect(converted.body.gates).toBe(8);
    expect(parseBoardFile(converted.body.board).ok).toBe(true);
  });

  it('answers 400 with fields for bad input, 401 without a session', async () => {
    const agent = await app.signUp('Theo Vance', 'theo@larkspur.test');
    const { board } = tubeLogicUnit();
    const family = await agent.post('/api/build-sheet').send({ board, family: 'steam' });
    expect([family.status, family.body.error.fields]).toEqual([400, { family: 'steam' }]);
    const resistor = await agent.post('/api/build-sheet').send({ board, family: 'tube-drl-nor', set: { R1: '-1k' } });
    expect([resistor.status, resistor.body.error.fields]).toEqual([400, { R1: '-1k' }]);
    const target = await agent.post('/api/convert').send({ board, to: 'xor' });
    expect(target.status).toBe(400);
    expect(Object.keys(target.body.error.fields)).toEqual(['to']);
    const broken = await agent.post('/api/convert').send({ board: { ...board, wires: [...board.wires, { id: 'w99', from: 'g_nor.out', to: 'ghost.in' }] }, to: 'nor' });
    expect(broken.status).toBe(400);
    expect(Object.keys(broken.body.error.fields)).toContain('w99');
    const nothing = await agent.post('/api/convert').send({ board: { ...board, parts: board.parts.filter((p) => p.kind === 'switch'), wires: [] }, to: 'nor' });
    expect([nothing.status, nothing.body.error.message]).toEqual([400, expect.stringMatching(/nothing to convert/)]);
    const anonymous = await app.request().post('/api/build-sheet').send({ board });
    expect(anonymous.status).toBe(401);
  });
});
