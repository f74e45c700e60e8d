import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';

const halfAdder = JSON.parse(readFileSync(new URL('../fixtures/half-adder.gatefold.json', import.meta.url), 'utf8'));

describe('POST /api/analyze', () => {
  let app: TestApp;
  beforeAll(async () => { app = await createTestApp({ jsonLimit: '20kb' }); });
  afterAll(async () => { await app.close(); });

  // Expected values: CONTRACTS §2 half-adder example (S = A XOR B, C = A AND B — common practice, no source).
  it('answers the analyze JSON of the contract for a signed-in user', async () => {
    const agent = await app.signUp('Ada Larkspur', 'ada@larkspur.test');
    const res = await agent.post('/api/analyze').send(halfAdder);
    expect(res.status).toBe(200);
    expect(res.body.rows).toEqual([{ in: '00', out: '00' }, { in: '01', out: '10' }, { in: '10', out: '10' }, { in: '11', out: '01' }]);
    expect(res.body.outputsInfo.S).toMatchObject({ sop: 'A & ~B | ~A & B', pos: '(A | B) & (~A | ~B)', function: 'XOR' });
    expect(res.body.sequential).toBe(false);
  });

  it('takes inputs, select and dontCares from the query string or the body', async () => {
    const agent = await app.signUp('Ben Room', 'ben@room14.test');
    const q = await agent.post('/api/analyze?inputs=B,A&select=B').send(halfAdder);
    expect(q.status).toBe(200);
    expect(q.body.inputs).toEqual(['B', 'A']);
    expect(q.body.functionMap.map((e: { select: string; functions: { S: { sop: string } } }) => [e.select, e.functions.S.sop])).toEqual([['0', 'A'], ['1', '~A']]);
    const b = await agent.post('/api/analyze').send({ board: halfAdder, dontCares: { S: [3] } });
    expect(b.status).toBe(200);
    // row 11 of S free: A | B is the smaller cover (common practice, no source)
    expect(b.body.outputsInfo.S.sop).toBe('A | B');
  });

  it('answers 400 naming the offending ids for a bad board', async () => {
    const agent = await app.signUp('Cy Larkspur', 'cy@larkspur.test');
    const bad = { ...halfAdder, wires: [...halfAdder.wires, { id: 'w9', from: 'g1.out', to: 'ghost.in' }] };
    const res = await agent.post('/api/analyze').send(bad);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain('w9');
    const many = { ...halfAdder, parts: [...halfAdder.parts, ...Array.from({ length: 21 }, (_, i) => ({ id: `k${i}`, kind: 'switch', label: `K${i}`, x: 0, y: 0 }))] };
    const tooMany = await agent.post('/api/analyze').send(many);
    expect(tooMany.status).toBe(400);
    expect(tooMany.body.error.message).toMatch(/limited to 20 inputs/);
    const unknown = await agent.post('/api/analyze?select=Q').send(halfAdder);
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.fields).toEqual({ select: 'Q' });
  });

  // The one don't-care rule (shared/analysis/dont-cares.ts), as the command line and the panel apply it.
  it('answers 400 naming a bad don\'t-care in fields, from the body or the query string', async () => {
    const agent = await app.signUp('Gus Room', 'gus@room14.test');
    const cases: [string, unknown, string, Record<string, string>][] = [
      ['', { S: [4] }, 'don\'t-care row 4 is not a row of the table (0 … 3)', { dontCares: '4' }],
      ['', [1.5], 'don\'t-care row 1.5 is not a row of the table (0 … 3)', { dontCares: '1.5' }],
      ['', { Q: [0] }, 'don\'t-cares given for "Q", which is not an analysed output', { dontCares: 'Q' }],
      ['?dontCares=1,x', undefined, 'don\'t-care row "x" is not a row number', { dontCares: 'x' }],
      ['?dontCares=9', undefined, 'don\'t-care row 9 is not a row of the table (0 … 3)', { dontCares: '9' }],
    ];
    for (const [query, dontCares, message, fields] of cases) {
      const res = await agent.post(`/api/analyze${query}`).send(dontCares === undefined ? halfAdder : { board: halfAdder, dontCares });
      expect(res.status, message).toBe(400);
      expect(res.body.error).toEqual({ code: 'invalid_input', message, fields });
    }
    const ok = await agent.post('/api/analyze?dontCares=3').send(halfAdder);
    expect(ok.status).toBe(200);
    expect(ok.body.outputsInfo.C.sop).toBe('0');
  });

  it('answers 429 past 60 analyses a minute for one account', async () => {
    const agent = await app.signUp('Eve Larkspur', 'eve@larkspur.test');
    const tiny = { format: 'gatefold-board', version: 1, parts: [{ id: 'a', kind: 'switch', label: 'A', x: 0, y: 0 }], wires: [] };
    const codes: number[] = [];
    for (let i = 0; i < 61; i++) codes.push((await agent.post('/api/analyze').send(tiny)).status);
    expect(codes.slice(0, 60).every((c) => c === 200)).toBe(true);
    expect(codes[60]).toBe(429);
    // another account is not held back
    const other = await app.signUp('Fay Room', 'fay@room14.test');
    expect((await other.post('/api/analyze').send(tiny)).status).toBe(200);
  });

  it('answers 401 to an anonymous caller and 413 to a body over the limit', async () => {
    expect((await app.request().post('/api/analyze').send(halfAdder)).status).toBe(401);
    const agent = await app.signUp('Di Room', 'di@room14.test');
    const big = { ...halfAdder, parts: [...halfAdder.parts, { id: 'n1', kind: 'note', text: 'x'.repeat(3000), x: 0, y: 0 }], title: 'y'.repeat(150) };
    const padded = { ...big, wires: [...big.wires, ...Array.from({ length: 400 }, (_, i) => ({ id: `pad${i}`, from: 'a.out', to: 's.in' }))] };
    const res = await agent.post('/api/analyze').send(padded);
    expect(res.status).toBe(413);
  });
});
