import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseBoardFile } from '../../../shared/board';
import type { FromWorker, ToWorker } from './protocol';

const raw = JSON.parse(readFileSync(new URL('../../../tests/fixtures/half-adder.gatefold.json', import.meta.url), 'utf8'));
const parsed = parseBoardFile(raw);
if (!parsed.ok) throw new Error('fixture');
const board = parsed.board;

/**
 * The worker module itself, loaded into a plain global scope that records what it posts (Node has no
 * Web Worker; the module only needs `onmessage` and `postMessage`).
 */
const posted: FromWorker[] = [];
const scope = { onmessage: null as ((e: { data: ToWorker }) => void) | null, postMessage: (msg: FromWorker) => { posted.push(msg); } };
const hadSelf = 'self' in globalThis;
beforeAll(async () => {
  Object.assign(globalThis, { self: scope });
  await import('./analysis-worker');
});
afterAll(() => { if (!hadSelf) delete (globalThis as { self?: unknown }).self; });

async function ask(id: number, request: Extract<ToWorker, { type: 'analyze' }>['request']): Promise<FromWorker> {
  scope.onmessage!({ data: { type: 'analyze', id, request } });
  await expect.poll(() => posted.some((m) => m.id === id && m.type !== 'progress'), { timeout: 10_000 }).toBe(true);
  return posted.find((m) => m.id === id && m.type !== 'progress')!;
}

describe('analysis worker', () => {
  it('posts the result of a good request', async () => {
    const msg = await ask(1, { board, select: [], dontCares: { S: [3] } });
    expect(msg.type).toBe('result');
    if (msg.type === 'result') expect(msg.result.forms.S.sop).toBe('A | B');
  });

  it('posts a bad don\'t-care as an error message for the panel, not a cancel', async () => {
    const msg = await ask(2, { board, select: [], dontCares: { C: [7] } });
    expect(msg).toEqual({ type: 'error', id: 2, message: 'don\'t-care row 7 is not a row of the table (0 … 3)', cancelled: false });
  });
});
