/**
 * Bad hierarchies are clear errors naming the ids: a cycle of modules (the chain), an instance of a
 * missing module, two ports with one label, a wire to a pin an instance does not have — in
 * parseBoardFile, on the command line (exit 2, one line) and over HTTP (400 with fields).
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseBoardFile } from '../../shared/board';
import { runCli } from '../cli/run-cli';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { HALF_ADDER_MODULE, fullAdderOfModules } from './boards';

type Raw = ReturnType<typeof fullAdderOfModules> & { modules: typeof HALF_ADDER_MODULE[] };

function variant(change: (b: Raw) => void): Raw {
  const b = structuredClone(fullAdderOfModules()) as Raw;
  change(b);
  return b;
}

const CASES: { name: string; board: Raw; message: RegExp; ids: string[] }[] = [
  {
    name: 'a cycle of modules',
    board: variant((b) => {
      b.modules.push({ id: 'outer', title: 'Outer', parts: [{ id: 'x', kind: 'module', module: 'inner', x: 0, y: 0 }], wires: [] } as never);
      b.modules.push({ id: 'inner', title: 'Inner', parts: [{ id: 'y', kind: 'module', module: 'outer', x: 0, y: 0 }], wires: [] } as never);
    }),
    message: /module "outer" contains itself: outer → inner → outer/,
    ids: ['outer'],
  },
  {
    name: 'a missing module',
    board: variant((b) => { (b.parts[4] as { module: string }).module = 'ghost'; }),
    message: /instance u2 uses missing module "ghost"/,
    ids: ['u2'],
  },
  {
    name: 'a port label clash',
    board: variant((b) => { b.modules[0].parts[5].label = 'S'; }),
    message: /module "half": ports s and c are both labelled "S"/,
    ids: ['c'],
  },
  {
    name: 'an instance pin that does not exist',
    board: variant((b) => { b.wires[3].to = 'u2.D'; }),
    message: /w4: part "u2" \(instance of module "half"\) has no pin "D"/,
    ids: ['w4'],
  },
];

describe('bad hierarchies', () => {
  for (const c of CASES) {
    it(`parseBoardFile names the ids of ${c.name}`, () => {
      const parsed = parseBoardFile(c.board);
      expect(parsed.ok).toBe(false);
      if (parsed.ok) return;
      expect(parsed.problems.map((p) => p.message).join('\n')).toMatch(c.message);
      expect(parsed.problems.map((p) => p.id)).toEqual(expect.arrayContaining(c.ids));
    });
  }

  describe('command line', () => {
    const dir = mkdtempSync(join(tmpdir(), 'gatefold-modules-cli-'));
    afterAll(() => rmSync(dir, { recursive: true, force: true }));
    it('exits 2 with one line naming the ids', async () => {
      for (const [i, c] of CASES.entries()) {
        const file = join(dir, `bad${i}.gatefold.json`);
        writeFileSync(file, JSON.stringify(c.board));
        const res = await runCli(['analyze', file]);
        expect(res.code).toBe(2);
        expect(res.stdout).toBe('');
        expect(res.stderr.trim().split('\n')).toHaveLength(1);
        expect(res.stderr).toMatch(c.message);
      }
    });
  });

  describe('HTTP', () => {
    let app: TestApp;
    beforeAll(async () => { app = await createTestApp(); });
    afterAll(async () => { await app.close(); });
    it('answers 400 with the ids in fields', async () => {
      const agent = await app.signUp('Ada Larkspur', 'ada.modules@larkspur.test');
      for (const c of CASES) {
        const res = await agent.post('/api/analyze').send(c.board);
        expect(res.status).toBe(400);
        expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(c.ids));
        expect(res.body.error.message).toMatch(c.message);
      }
      const good = await agent.post('/api/analyze').send(fullAdderOfModules());
      expect(good.status).toBe(200);
      expect(good.body.outputs).toEqual(['S', 'COUT']);
    });
  });
});
