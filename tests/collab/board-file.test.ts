import { readFileSync, readdirSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type Agent, type TestApp } from '../helpers/test-app';
import { parseBoardFile } from '../../shared/board';

const EXAMPLES = new URL('../../examples/', import.meta.url);
const example = (name: string) => readFileSync(new URL(name, EXAMPLES), 'utf8');

let app: TestApp;
let owner: Agent;
let stranger: Agent;
beforeAll(async () => {
  app = await createTestApp();
  owner = await app.signUp('Owner', 'owner@files.example');
  stranger = await app.signUp('Stranger', 'stranger@files.example');
});
afterAll(() => app.close());

const importText = (agent: Agent, text: string | Buffer, name = 'board.gatefold.json') =>
  agent.post('/api/boards/import').attach('file', Buffer.isBuffer(text) ? text : Buffer.from(text), name);

describe('board file import and export', () => {
  it.each(readdirSync(EXAMPLES).filter((f) => f.endsWith('.gatefold.json')))('round-trips %s byte for byte', async (name) => {
    const text = example(name);
    const res = await importText(owner, text, name);
    expect(res.status).toBe(201);
    expect(res.body.board).toMatchObject({ title: JSON.parse(text).title, family: JSON.parse(text).family, role: 'owner' });
    const out = await owner.get(`/api/boards/${res.body.board.id}/export`);
    expect(out.status).toBe(200);
    expect(out.headers['content-type']).toMatch(/application\/json/);
    expect(out.headers['content-disposition']).toMatch(/^attachment; filename="[a-z0-9-]+\.gatefold\.json"$/);
    expect(out.text).toBe(text);
  });

  it('names the file after the board title', async () => {
    const res = await importText(owner, example('ripple-counter-4bit.gatefold.json'));
    const out = await owner.get(`/api/boards/${res.body.board.id}/export`);
    expect(out.headers['content-disposition']).toBe('attachment; filename="4-bit-ripple-counter.gatefold.json"');
  });

  it('answers 400 invalid_board naming the bad ids', async () => {
    const bad = JSON.parse(example('half-adder.gatefold.json'));
    bad.parts[2].kind = 'flux-capacitor';
    bad.wires[4].to = 'nowhere.in';
    bad.wires.push({ id: 'w99', from: 'a.out', to: 'g2.in7' });
    const res = await importText(owner, JSON.stringify(bad));
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_board');
    expect(Object.keys(res.body.error.fields)).toContain('g1');
    expect(res.body.error.fields.g1).toMatch(/unknown kind "flux-capacitor"/);
    // the semantic check runs once the shape is right
    bad.parts[2].kind = 'xor';
    const res2 = await importText(owner, JSON.stringify(bad));
    expect(res2.status).toBe(400);
    expect(res2.body.error.fields.w5).toMatch(/missing part "nowhere"/);
    expect(res2.body.error.fields.w99).toMatch(/no pin "in7"/);
  });

  it('answers 400 for a file that is not JSON and for a missing file', async () => {
    const res = await importText(owner, 'this is not { json');
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'invalid_board', fields: { file: expect.any(String) } });
    const none = await owner.post('/api/boards/import').field('other', 'x');
    expect(none.status).toBe(400);
    expect(none.body.error.fields.file).toBeDefined();
  });

  it('answers 413 for a file over 2 MB', async () => {
    const res = await importText(owner, Buffer.alloc(2 * 1024 * 1024 + 1, 0x20));
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('too_large');
  });

  it('needs a session to import and membership to export', async () => {
    const anon = await importText(app.request(), example('half-adder.gatefold.json'));
    expect(anon.status).toBe(401);
    const mine = await importText(owner, example('half-adder.gatefold.json'));
    expect((await stranger.get(`/api/boards/${mine.body.board.id}/export`)).status).toBe(403);
    expect((await app.request().get(`/api/boards/${mine.body.board.id}/export`)).status).toBe(401);
  });

  it('exports an empty board as a valid file', async () => {
    const created = await owner.post('/api/boards').send({ title: 'Blank' });
    const out = await owner.get(`/api/boards/${created.body.board.id}/export`);
    expect(parseBoardFile(JSON.parse(out.text))).toMatchObject({ ok: true });
    expect(JSON.parse(out.text)).toMatchObject({ title: 'Blank', family: 'ideal', parts: [], wires: [] });
  });
});
