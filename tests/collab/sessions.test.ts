import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { api, connectClient, createBoard, signUp, type User } from './helpers';
import { RawPeer } from './raw-peer';

let server: TestServer;
let fastCheck: TestServer;

beforeAll(async () => {
  server = await startTestServer({ logErrors: false });
  // the session re-check runs on the ping tick: short here, 30 s by default
  fastCheck = await startTestServer({ collab: { pingIntervalMs: 150 }, logErrors: false });
});
afterAll(async () => {
  await Promise.all([server.close(), fastCheck.close()]);
});

/** Signs the user in once more: a second session of the same account. */
async function signInAgain(s: TestServer, user: User): Promise<User> {
  const res = await api(s, 'POST', '/api/auth/login', undefined, { email: user.email, password: 'correct horse battery' });
  expect(res.status).toBe(200);
  return { ...user, cookie: (res.headers.getSetCookie()[0] ?? '').split(';')[0] };
}

describe('sockets end with their session', () => {
  it('signing out over HTTP closes that session’s sockets at once (4401), not those of another session', async () => {
    const user = await signUp(server, 'Leaver');
    const other = await signInAgain(server, user);
    const boardId = await createBoard(server, user);
    const mine = await RawPeer.open(server, boardId, user.cookie);
    const theirs = await RawPeer.open(server, boardId, other.cookie);
    expect((await api(server, 'POST', '/api/auth/logout', user.cookie)).status).toBeLessThan(300);
    expect(await mine.closed).toEqual({ code: 4401, reason: 'session_ended' });
    expect(await theirs.roundTrip()).toBe('answered');
    theirs.close();
  });

  it('the password-reset event (every session of the user) closes all of them', async () => {
    const user = await signUp(server, 'Resetter');
    const second = await signInAgain(server, user);
    const bystander = await signUp(server, 'Bystander');
    const boardId = await createBoard(server, user);
    const bBoard = await createBoard(server, bystander);
    const a = await RawPeer.open(server, boardId, user.cookie);
    const b = await RawPeer.open(server, boardId, second.cookie);
    const c = await RawPeer.open(server, bBoard, bystander.cookie);
    // what the auth service emits after a password reset (the reset route is tested with the HTTP API)
    server.ctx.events.emit('sessions-ended', { userId: user.id });
    expect((await a.closed).code).toBe(4401);
    expect((await b.closed).code).toBe(4401);
    expect(await c.roundTrip()).toBe('answered');
    c.close();
  });

  it('a session that is gone from the store (expired, or deleted by a reset) closes its socket on the next check', async () => {
    const user = await signUp(fastCheck, 'Expiring');
    const boardId = await createBoard(fastCheck, user);
    const y = connectClient(fastCheck, boardId, user.cookie);
    await y.synced;
    const closed = new Promise<number>((resolve) => y.provider.once('connection-close', (ev: { code: number } | null) => resolve(ev?.code ?? -1)));
    const removed = await fastCheck.ctx.db('sessions').whereRaw("json_extract(sess, '$.userId') = ?", [user.id]).del();
    expect(removed).toBe(1);
    expect(await closed).toBe(4401);
    y.destroy();
  });
});
