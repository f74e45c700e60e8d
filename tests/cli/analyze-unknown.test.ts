/**
 * `analyze` of an output that is X in every row (an inverter fed back on itself: a one-gate ring, which
 * never settles — Rabaey et al., *Digital Integrated Circuits*, ring oscillator, from memory): the
 * output's function is unknown, so no SOP or POS is given (both would be "minimal" over a table of
 * don't-cares, "0" and "1" side by side).
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { runCli } from './run-cli';

const dir = mkdtempSync(join(tmpdir(), 'gatefold-cli-unknown-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const board = {
  format: 'gatefold-board', version: 1, title: 'Ring of one', family: 'ideal',
  parts: [
    { id: 'a', kind: 'switch', label: 'A', x: 0, y: 0 }, { id: 'b', kind: 'switch', label: 'B', x: 0, y: 80 },
    { id: 'g', kind: 'not', x: 120, y: 0 }, { id: 'h', kind: 'and', inputs: 2, x: 120, y: 80 },
    { id: 'y', kind: 'lamp', label: 'Y', x: 260, y: 0 }, { id: 'z', kind: 'lamp', label: 'Z', x: 260, y: 80 },
  ],
  wires: [
    { id: 'w1', from: 'g.out', to: 'g.in0' }, { id: 'w2', from: 'g.out', to: 'y.in' },
    { id: 'w3', from: 'a.out', to: 'h.in0' }, { id: 'w4', from: 'b.out', to: 'h.in1' }, { id: 'w5', from: 'h.out', to: 'z.in' },
  ],
};

describe('analyze: an output that is X in every row', () => {
  it('says the output is unknown instead of giving contradicting forms', async () => {
    const file = join(dir, 'ring.gatefold.json');
    writeFileSync(file, JSON.stringify(board));
    const r = await runCli(['analyze', file]);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.rows.map((row: { out: string }) => row.out[0])).toEqual(['X', 'X', 'X', 'X']);
    expect(out.outputsInfo.Y).toMatchObject({ unknown: true, sop: null, pos: null, sopAll: [], posAll: [] });
    expect(out.outputsInfo.Y.function).toBeUndefined();
    // the other output keeps its forms: AND (Wikipedia "Truth table", "Binary operations": 0001)
    expect(out.outputsInfo.Z).toMatchObject({ sop: 'A & B', pos: 'A & B', function: 'AND' });
    expect(out.outputsInfo.Z.unknown).toBeUndefined();
  });
});
