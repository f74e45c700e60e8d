/**
 * Bring-up over HTTP on a real SQLite file and a real upload folder: test vectors and diagnosis of a
 * board file, a board's bring-up record (editors record, viewers read), and build photos — content
 * checked, EXIF stripped, thumbnails, members only, nothing written on a refused upload, files gone with
 * the board. Images are made with sharp here; the checks read them back with sharp (common practice).
 */
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BoardFile } from '../../shared/board';
import { createTestApp, type Agent, type TestApp } from '../helpers/test-app';

const example = (name: string) => JSON.parse(readFileSync(new URL(`../../examples/${name}`, import.meta.url), 'utf8')) as BoardFile;

let t: TestApp;
const agents: Record<'owner' | 'editor' | 'viewer' | 'stranger', Agent> = {} as never;
const ids: Record<string, number> = {};
let boardId = 0;

async function photoJpeg(): Promise<Buffer> {
  return sharp({ create: { width: 640, height: 480, channels: 3, background: { r: 200, g: 120, b: 40 } } })
    .jpeg().withExif({ IFD0: { Copyright: 'Larkspur Street Makerspace', Artist: 'Theo Vance' } }).toBuffer();
}

const photoDir = () => join(t.ctx.config.uploadDir, 'photos', `board-${boardId}`);
const filesNow = () => (existsSync(photoDir()) ? readdirSync(photoDir()).sort() : []);
const rowsNow = async () => Number((await t.ctx.db('board_photos').count({ n: '*' }))[0].n);

beforeAll(async () => {
  t = await createTestApp();
  for (const [key, name, email] of [['owner', 'Theo Vance', 'theo@larkspur.example'], ['editor', 'Ines Okafor', 'ines@larkspur.example'],
    ['viewer', 'Ruth Calder', 'calder@room14.example'], ['stranger', 'Sam Ortiz', 'sam@room14.example']] as const) {
    agents[key] = await t.signUp(name, email);
    ids[key] = (await agents[key].get('/api/auth/me')).body.user.id;
  }
  const board = await t.ctx.services.boards.create(ids.owner, { title: 'Mux logic unit', family: 'ideal' });
  boardId = board.id;
  await t.ctx.boardRegistry.writeBoardFile(boardId, example('mux-logic-unit.gatefold.json'), ids.owner);
  await t.ctx.services.members.addDirect(boardId, ids.editor, 'editor');
  await t.ctx.services.members.addDirect(boardId, ids.viewer, 'viewer');
});
afterAll(() => t.close());

describe('POST /api/test-vectors and /api/diagnose', () => {
  it('answers the contract JSON for a board file', async () => {
    const res = await agents.viewer.post('/api/test-vectors').send(example('half-adder.gatefold.json'));
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ faults: 20, detected: 20, undetectable: [], minimal: true });
    const d = await agents.viewer.post('/api/diagnose').send({ board: example('half-adder.gatefold.json'), observed: [{ in: '11', out: '00' }] });
    expect(d.status).toBe(200);
    expect(d.body.candidates[0]).toMatchObject({ explains: 1, of: 1 });
  });

  it('refuses a bad board or observation with 400 and fields, and strangers with 401', async () => {
    const bad = await agents.viewer.post('/api/test-vectors').send({ format: 'gatefold-board', version: 1, parts: [{ id: 'g', kind: 'warp' }], wires: [] });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toBeTruthy();
    const obs = await agents.viewer.post('/api/diagnose').send({ board: example('half-adder.gatefold.json'), observed: [{ in: '1', out: '00' }] });
    expect(obs.status).toBe(400);
    expect(Object.keys(obs.body.error.fields)[0]).toMatch(/^observed/);
    expect((await t.request().post('/api/test-vectors').send(example('half-adder.gatefold.json'))).status).toBe(401);
  });
});

describe('the bring-up record', () => {
  it('lets editors record, viewers read, and diagnoses the record', async () => {
    const rec = await agents.editor.post(`/api/boards/${boardId}/bringup/observations`).send({ in: '0000', out: '1' });
    expect(rec.status).toBe(201);
    expect(rec.body.observation).toMatchObject({ in: '0000', out: '1', expected: null, user: { id: ids.editor, name: 'Ines Okafor' } });
    expect((await agents.viewer.post(`/api/boards/${boardId}/bringup/observations`).send({ in: '0000', out: '1' })).status).toBe(403);
    expect((await agents.stranger.get(`/api/boards/${boardId}/bringup/observations`)).status).toBe(403);
    const bad = await agents.editor.post(`/api/boards/${boardId}/bringup/observations`).send({ in: '00', out: '1' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.in).toBeTruthy();
    const list = await agents.viewer.get(`/api/boards/${boardId}/bringup/observations`);
    expect(list.body.observations).toHaveLength(1);
    const summary = await agents.viewer.get(`/api/boards/${boardId}/bringup`);
    expect(summary.status).toBe(200);
    expect(summary.body.vectors.faults).toBeGreaterThan(0);
    // A=B=0, select 00 → AND → Y should be 0; a lit lamp points at the AND path or the select
    expect(summary.body.diagnosis.faultFree).toEqual({ explains: 0, of: 1 });
    expect(summary.body.diagnosis.candidates[0].explains).toBe(1);
  });
});

describe('build photos', () => {
  let first: { id: number; url: string; thumbUrl: string };

  it('takes a JPEG from an editor, strips its EXIF and makes a thumbnail', async () => {
    const img = await photoJpeg();
    expect((await sharp(img).metadata()).exif).toBeTruthy();
    const res = await agents.editor.post(`/api/boards/${boardId}/photos`).field('partId', 'mux').field('caption', 'first tube rack').attach('file', img, 'rack.jpg');
    expect(res.status).toBe(201);
    first = res.body.photo;
    expect(res.body.photo).toMatchObject({ partId: 'mux', name: 'rack.jpg', mime: 'image/jpeg', width: 640, height: 480, uploader: { id: ids.editor } });
    const file = await agents.viewer.get(first.url).buffer(true).parse((r, cb) => { const chunks: Buffer[] = []; r.on('data', (c: Buffer) => chunks.push(c)); r.on('end', () => cb(null, Buffer.concat(chunks))); });
    expect(file.status).toBe(200);
    expect(file.headers['content-type']).toBe('image/jpeg');
    const meta = await sharp(file.body as Buffer).metadata();
    expect(meta.exif).toBeUndefined();
    const thumb = await agents.viewer.get(first.thumbUrl).buffer(true).parse((r, cb) => { const chunks: Buffer[] = []; r.on('data', (c: Buffer) => chunks.push(c)); r.on('end', () => cb(null, Buffer.concat(chunks))); });
    const tm = await sharp(thumb.body as Buffer).metadata();
    expect(tm.format).toBe('webp');
    expect(Math.max(tm.width!, tm.height!)).toBeLessThanOrEqual(320);
    expect((await agents.viewer.get(`/api/boards/${boardId}/photos`)).body.photos).toHaveLength(1);
    expect((await agents.stranger.get(first.url)).status).toBe(403);
  });

  it('refuses a non-image, an oversized file, a traversal name, a viewer and a non-member, writing nothing', async () => {
    const files = filesNow();
    const rows = await rowsNow();
    const img = await photoJpeg();
    const big = Buffer.alloc(8 * 1024 * 1024 + 10, 1);
    big.set([0xff, 0xd8, 0xff], 0);
    const cases: [Agent, (a: Agent) => ReturnType<Agent['post']>, number][] = [
      [agents.editor, (a) => a.post(`/api/boards/${boardId}/photos`).attach('file', Buffer.from('not a photo, just text'), 'notes.jpg'), 400],
      [agents.editor, (a) => a.post(`/api/boards/${boardId}/photos`).attach('file', big, 'huge.jpg'), 413],
      [agents.editor, (a) => a.post(`/api/boards/${boardId}/photos`).attach('file', img, { filepath: '../../escape.jpg', contentType: 'image/jpeg' } as never), 400],
      [agents.editor, (a) => a.post(`/api/boards/${boardId}/photos`).field('partId', 'nope').attach('file', img, 'rack.jpg'), 400],
      [agents.viewer, (a) => a.post(`/api/boards/${boardId}/photos`).attach('file', img, 'rack.jpg'), 403],
      [agents.stranger, (a) => a.post(`/api/boards/${boardId}/photos`).attach('file', img, 'rack.jpg'), 403],
    ];
    for (const [agent, send, status] of cases) {
      const res = await send(agent);
      expect(res.status, JSON.stringify(res.body)).toBe(status);
      expect(res.body.error).toMatchObject({ code: expect.any(String), message: expect.any(String) });
    }
    expect(filesNow()).toEqual(files);
    expect(await rowsNow()).toBe(rows);
  });

  it('lets only the uploader or the owner delete, and deleting the board removes its files', async () => {
    const img = await photoJpeg();
    const second = (await agents.owner.post(`/api/boards/${boardId}/photos`).attach('file', img, 'bench.jpg')).body.photo;
    expect((await agents.editor.delete(`/api/boards/${boardId}/photos/${second.id}`)).status).toBe(403);
    expect((await agents.editor.delete(`/api/boards/${boardId}/photos/${first.id}`)).status).toBe(204);
    expect(filesNow()).toHaveLength(2);
    expect((await agents.owner.delete(`/api/boards/${boardId}`)).status).toBe(204);
    for (let k = 0; k < 50 && existsSync(photoDir()); k++) await new Promise((r) => setTimeout(r, 20));
    expect(existsSync(photoDir())).toBe(false);
    expect(await rowsNow()).toBe(0);
  });
});
