import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyzeBoardFile } from '../../shared/analysis';
import { loadConfig } from '../../server/config';
import { createTestApp, type Agent, type TestApp } from '../helpers/test-app';

/** `n` switches I0…I(n-1); lamp Y = I0 AND I1, lamp Z = I2 (the other inputs do not matter). */
function wideBoard(n: number) {
  const parts: object[] = Array.from({ length: n }, (_, i) => ({ id: `s${i}`, kind: 'switch', label: `I${i}`, x: 0, y: 40 * i, on: false }));
  parts.push({ id: 'g', kind: 'and', inputs: 2, x: 200, y: 0 }, { id: 'y', kind: 'lamp', label: 'Y', x: 300, y: 0 }, { id: 'z', kind: 'lamp', label: 'Z', x: 300, y: 80 });
  const wires = [
    { id: 'w1', from: 's0.out', to: 'g.in0' }, { id: 'w2', from: 's1.out', to: 'g.in1' },
    { id: 'w3', from: 'g.out', to: 'y.in' }, { id: 'w4', from: 's2.out', to: 'z.in' },
  ];
  return { format: 'gatefold-board', version: 1, title: `${n} inputs`, family: 'ideal', parts, wires };
}

describe('large analyses run in a worker and stream their rows', () => {
  let t: TestApp;
  let agent: Agent;
  beforeAll(async () => {
    t = await createTestApp({ analyze: { perMinute: 1000, inlineMaxInputs: 6, timeLimitMs: 20_000, workers: 2 } });
    agent = await t.signUp('Ruth Calder', 'calder@room14.example');
  });
  afterAll(() => t.close());

  it('answers the same document as the in-process pipeline, streamed (chunked) above 6 inputs', async () => {
    expect(t.ctx.config.analyze.inlineMaxInputs).toBe(loadConfig({ SESSION_SECRET: 'a-long-enough-secret' }).analyze.inlineMaxInputs);
    const small = await agent.post('/api/analyze').send(wideBoard(6));
    expect(small.status).toBe(200);
    expect(small.headers['content-length']).toBeDefined();
    expect(small.body).toEqual(analyzeBoardFile(wideBoard(6)));
    const seven = await agent.post('/api/analyze').send(wideBoard(7));
    expect(seven.headers['transfer-encoding']).toBe('chunked');
    expect(seven.body).toEqual(analyzeBoardFile(wideBoard(7)));

    const big = await agent.post('/api/analyze').send(wideBoard(14));
    expect(big.status).toBe(200);
    expect(big.headers['transfer-encoding']).toBe('chunked');
    expect(big.headers['content-length']).toBeUndefined();
    expect(big.body.rows).toHaveLength(2 ** 14);
    // the reference: the shared pipeline run in this process (Y = I0 & I1, Z = I2 — common practice, no source)
    expect(big.body).toEqual(analyzeBoardFile(wideBoard(14)));
    expect(big.body.outputsInfo.Y.sop).toBe('I0 & I1');
    expect(big.body.rows[2 ** 14 - 1]).toEqual({ in: '1'.repeat(14), out: '11' });
  });

  it('answers 400 for bad choices before any worker starts, and bad don\'t-cares from the worker', async () => {
    const unknown = await agent.post('/api/analyze?inputs=Q').send(wideBoard(14));
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.fields).toEqual({ inputs: 'Q' });
    const dc = await agent.post('/api/analyze').send({ board: wideBoard(14), dontCares: [2 ** 14] });
    expect(dc.status).toBe(400);
    expect(dc.body.error).toMatchObject({ code: 'invalid_input', fields: { dontCares: String(2 ** 14) } });
  });
});

describe('analysis limits', () => {
  it('stops a worker past the time limit with 413 analysis_too_large', async () => {
    const t = await createTestApp({ analyze: { perMinute: 1000, inlineMaxInputs: 6, timeLimitMs: 100, workers: 2 } });
    try {
      const agent = await t.signUp('Sam Ortiz', 'sam@room14.example');
      const res = await agent.post('/api/analyze').send(wideBoard(20));
      expect(res.status).toBe(413);
      expect(res.body.error.code).toBe('analysis_too_large');
      // the server goes on answering
      expect((await agent.post('/api/analyze').send(wideBoard(3))).status).toBe(200);
    } finally {
      await t.close();
    }
  });

  it('answers 503 analysis_busy when every worker is taken', async () => {
    const t = await createTestApp({ analyze: { perMinute: 1000, inlineMaxInputs: 6, timeLimitMs: 20_000, workers: 1 } });
    try {
      const agent = await t.signUp('Priya Nair', 'priya@room14.example');
      const codes = (await Promise.all([agent.post('/api/analyze').send(wideBoard(14)), agent.post('/api/analyze').send(wideBoard(14))])).map((r) => r.status);
      expect(codes.sort()).toEqual([200, 503]);
    } finally {
      await t.close();
    }
  });
});

describe('member additions (invitations) per account', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ rateLimit: { ...loadConfig({ SESSION_SECRET: 'a-long-enough-secret' }).rateLimit, windowMs: 60_000, login: 1000, loginPerAddress: 1000, signup: 1000, resetRequest: 1000, invitations: 3 } });
  });
  afterAll(() => t.close());

  it('answers 429 past the limit for that account only; refused additions do not count', async () => {
    const owner = await t.signUp('Theo Vance', 'theo@larkspur.example');
    const board = (await owner.post('/api/boards').send({ title: 'Half adder' })).body.board;
    expect((await owner.post(`/api/boards/${board.id}/members`).send({ email: 'not-an-address', role: 'editor' })).status).toBe(400);
    const codes: number[] = [];
    for (let i = 0; i < 4; i++) codes.push((await owner.post(`/api/boards/${board.id}/members`).send({ email: `student${i}@room14.example`, role: 'viewer' })).status);
    expect(codes).toEqual([201, 201, 201, 429]);
    const other = await t.signUp('Ruth Calder', 'calder@room14.example');
    const hers = (await other.post('/api/boards').send({ title: 'Counter' })).body.board;
    expect((await other.post(`/api/boards/${hers.id}/members`).send({ email: 'sam@room14.example', role: 'viewer' })).status).toBe(201);
  });

  it('defaults to 20 an hour', async () => {
    const rl = loadConfig({ SESSION_SECRET: 'a-long-enough-secret' }).rateLimit;
    expect([rl.invitations, rl.invitationsWindowMs]).toEqual([20, 60 * 60 * 1000]);
  });
});
