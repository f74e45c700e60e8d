import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { addPart, partsMap } from '../../shared/board';
import { backingServicesMissing } from '../helpers/backing-services';
import { addMember, api, connectClient, createBoard, signUp, waitFor, type Client, type User } from '../collab/helpers';
import { at, startCluster, startRelay, type Cluster } from './cluster';

/**
 * Three Gatefold processes on one PostgreSQL and one Redis (docs/deploy.md, decision note 006): the
 * board is shared live across servers, viewers stay read-only, events that close sockets reach every
 * server, sessions and rate limits are shared, and a crashed server loses no edit.
 */
const missing = backingServicesMissing();
if (missing) console.warn(`skipping the several-servers tests: ${missing}`);

const ME = { local: 'multi' };
let cluster: Cluster;
const clients: Client[] = [];

function client(server: { url: string }, boardId: number, user: User): Client {
  const c = connectClient(at(server), boardId, user.cookie);
  clients.push(c);
  return c;
}

/** Every part id in the board as PostgreSQL holds it (all its rows merged). */
async function storedPartIds(boardId: number): Promise<string[]> {
  const rows = (await cluster.db('board_updates').where({ board_id: boardId }).orderBy('seq').select('data')) as { data: Buffer }[];
  const doc = new Y.Doc();
  for (const r of rows) Y.applyUpdate(doc, new Uint8Array(r.data));
  const ids = [...partsMap(doc).keys()].sort();
  doc.destroy();
  return ids;
}

const ids = (c: Client) => [...partsMap(c.doc).keys()].sort();
const note = (n: number) => ({ id: '', kind: 'not' as const, x: 20 * n, y: 40 });

describe.skipIf(Boolean(missing))('three servers on one PostgreSQL and one Redis', () => {
  beforeAll(async () => {
    cluster = await startCluster(3, { RATE_LIMIT_LOGIN: '5' });
  }, 180_000);
  afterAll(async () => {
    for (const c of clients) c.destroy();
    await cluster?.close();
  }, 60_000);

  it('reports the database and Redis as ready, and shares sessions and sign-in limits', async () => {
    const [s1, s2, s3] = cluster.servers;
    const ready = await (await fetch(`${s1.url}/api/ready`)).json();
    expect(ready).toMatchObject({ ok: true, draining: false, database: { ok: true, dialect: 'postgres' }, redis: { ok: true } });
    const user = await signUp(at(s1), 'Wren');
    expect((await api(at(s2), 'GET', '/api/auth/me', user.cookie)).status).toBe(200);
    // five failed sign-ins spread over three servers use up the one per-account limit
    const wrong = { email: user.email, password: 'not the password' };
    const statuses = [];
    for (const s of [s1, s2, s3, s1, s2, s3]) statuses.push((await api(at(s), 'POST', '/api/auth/login', undefined, wrong)).status);
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429]);
  });

  it('lets clients on different servers co-edit one board; they converge and each update is stored once', async () => {
    const [s1, s2, s3] = cluster.servers;
    const owner = await signUp(at(s1), 'Ada');
    const others = [await signUp(at(s2), 'Bo'), await signUp(at(s3), 'Cy')];
    const boardId = await createBoard(at(s1), owner, 'Shared across servers');
    for (const u of others) await addMember(at(s1), owner, boardId, u, 'editor');
    const cs = [client(s1, boardId, owner), client(s2, boardId, others[0]), client(s3, boardId, others[1])];
    await Promise.all(cs.map((c) => c.synced));
    for (let i = 0; i < 10; i++) cs.forEach((c, k) => addPart(c.doc, note(k * 100 + i), ME));
    await waitFor(() => cs.every((c) => ids(c).length === 30), 'all 30 parts on every server', 20_000);
    expect(ids(cs[1])).toEqual(ids(cs[0]));
    expect(ids(cs[2])).toEqual(ids(cs[0]));
    await waitFor(async () => (await storedPartIds(boardId)).length === 30, 'all 30 parts stored', 20_000);
    expect(await storedPartIds(boardId)).toEqual(ids(cs[0]));
    // no server stored an update another server had published (identical rows would show it)
    const rows = (await cluster.db('board_updates').where({ board_id: boardId }).select('data')) as { data: Buffer }[];
    expect(new Set(rows.map((r) => r.data.toString('base64'))).size).toBe(rows.length);
  });

  it('never applies a viewer’s edit: a viewer on server 2 changes nothing on server 1 or in the database', async () => {
    const [s1, s2] = cluster.servers;
    const owner = await signUp(at(s1), 'Dee');
    const viewer = await signUp(at(s2), 'Eli');
    const boardId = await createBoard(at(s1), owner, 'Watched');
    await addMember(at(s1), owner, boardId, viewer, 'viewer');
    const o = client(s1, boardId, owner);
    const v = client(s2, boardId, viewer);
    await Promise.all([o.synced, v.synced]);
    const sneaky = addPart(v.doc, note(7), ME);
    // a later edit of the owner that went through server 2 and back marks the time
    const mark = addPart(o.doc, note(8), ME);
    await waitFor(() => ids(v).includes(mark), 'the owner’s edit on the viewer’s screen', 10_000);
    await new Promise((r) => setTimeout(r, 500));
    expect(ids(o)).toEqual([mark]);
    await waitFor(async () => (await storedPartIds(boardId)).includes(mark), 'the owner’s edit stored', 10_000);
    expect(await storedPartIds(boardId)).not.toContain(sneaky);
  });

  it('a restore and a member removal made on server 1 reach the sockets on server 3', async () => {
    const [s1, , s3] = cluster.servers;
    const owner = await signUp(at(s1), 'Fay');
    const member = await signUp(at(s3), 'Gus');
    const boardId = await createBoard(at(s1), owner, 'Restored elsewhere');
    await addMember(at(s1), owner, boardId, member, 'editor');
    const c = client(s3, boardId, member);
    await c.synced;
    const kept = addPart(c.doc, note(1), ME);
    await waitFor(async () => (await storedPartIds(boardId)).includes(kept), 'the first part stored', 10_000);
    const snap = await api(at(s1), 'POST', `/api/boards/${boardId}/snapshots`, owner.cookie, { name: 'One inverter' });
    expect(snap.status).toBe(201);
    const sid = ((await snap.json()) as { snapshot: { id: number } }).snapshot.id;
    const later = addPart(c.doc, note(2), ME);
    await waitFor(async () => (await storedPartIds(boardId)).includes(later), 'the second part stored', 10_000);
    expect((await api(at(s1), 'POST', `/api/boards/${boardId}/snapshots/${sid}/restore`, owner.cookie)).status).toBe(200);
    await waitFor(() => ids(c).length === 1 && ids(c)[0] === kept, 'the restore on server 3', 10_000);

    let closeCode = 0;
    c.provider.on('connection-close', (e: CloseEvent | null) => (closeCode ||= e?.code ?? 0));
    expect((await api(at(s1), 'DELETE', `/api/boards/${boardId}/members/${member.id}`, owner.cookie)).status).toBe(204);
    await waitFor(() => closeCode !== 0, 'the removed member’s socket on server 3 closed', 10_000);
    expect(closeCode).toBe(4403);
  });

  it('SIGKILL of a server mid-edit: its clients reconnect to another and every edit is in the board and in PostgreSQL', async () => {
    const [s1, s2, s3] = cluster.servers;
    const owner = await signUp(at(s1), 'Hal');
    const boardId = await createBoard(at(s1), owner, 'Survives a crash');
    // the proxy sends new connections to server 2 while it lives, then to server 1
    const relay = await startRelay(() => [s2.port, s1.port]);
    try {
      const editors = [client(relay, boardId, owner), client(relay, boardId, owner)];
      const watcher = client(s3, boardId, owner);
      await Promise.all([...editors, watcher].map((c) => c.synced));
      const made: string[] = [];
      let n = 0;
      const edit = () => editors.forEach((c) => made.push(addPart(c.doc, note(++n), ME)));
      for (let i = 0; i < 20; i++) {
        edit();
        await new Promise((r) => setTimeout(r, 15));
      }
      await s2.kill(); // mid-edit: some of these are applied and broadcast but not yet stored, some not even sent
      for (let i = 0; i < 10; i++) {
        edit();
        await new Promise((r) => setTimeout(r, 15));
      }
      await waitFor(() => editors.every((c) => c.provider.wsconnected && c.provider.synced), 'the clients reconnected through the proxy', 20_000);
      for (let i = 0; i < 5; i++) edit();
      const all = [...made].sort();
      await waitFor(() => [...editors, watcher].every((c) => ids(c).length === all.length), 'every edit on every screen', 20_000);
      expect(ids(watcher)).toEqual(all);
      await waitFor(async () => (await storedPartIds(boardId)).length === all.length, 'every edit in PostgreSQL', 20_000);
      expect(await storedPartIds(boardId)).toEqual(all);
    } finally {
      await relay.close();
    }
  });

  it('SIGKILL of a server whose database writes are stuck: the server that applied its edits stores them', async () => {
    const [s1, , s3] = cluster.servers;
    const owner = await signUp(at(s3), 'Jo');
    const boardId = await createBoard(at(s3), owner, 'Taken over');
    const watcher = client(s3, boardId, owner);
    const doomed = connectClient(at(s1), boardId, owner.cookie);
    await Promise.all([watcher.synced, doomed.synced]);
    // hold the board row's lock: server 1 applies, broadcasts and publishes, but cannot store
    const trx = await cluster.db.transaction();
    await trx('boards').where({ id: boardId }).forUpdate().first('id');
    const made = [1, 2, 3, 4, 5].map((n) => addPart(doomed.doc, note(n), ME));
    await waitFor(() => made.every((id) => ids(watcher).includes(id)), 'server 3 applied server 1’s edits', 10_000);
    await s1.kill();
    doomed.destroy(); // its client is gone too: nobody will send these edits again
    await trx.rollback();
    await waitFor(async () => made.every((id) => ids(watcher).includes(id)) && (await storedPartIds(boardId)).length === 5, 'server 3 stored them', 20_000);
    expect(await storedPartIds(boardId)).toEqual([...made].sort());
    expect(s3.output()).toMatch(/stored \d+ update\(s\) another server applied but never confirmed/);
  });

  it('SIGTERM drains: sockets are told to reconnect elsewhere (1012) and the server exits cleanly', async () => {
    const s3 = cluster.servers[2];
    const owner = await signUp(at(s3), 'Ida');
    const boardId = await createBoard(at(s3), owner, 'Drained');
    const c = client(s3, boardId, owner);
    await c.synced;
    const part = addPart(c.doc, note(3), ME);
    let closeCode = 0;
    c.provider.on('connection-close', (e: CloseEvent | null) => (closeCode ||= e?.code ?? 0));
    await new Promise((r) => setTimeout(r, 200));
    expect(await s3.stop()).toBe(0);
    expect(closeCode).toBe(1012);
    c.provider.disconnect();
    expect(await storedPartIds(boardId)).toContain(part);
  });
});
