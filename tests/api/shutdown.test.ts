import { describe, expect, it } from 'vitest';
import WebSocket from 'ws';
import { startTestServer } from '../helpers/test-app';

describe('startServer close()', () => {
  it('closes promptly with a board socket open: features first, then HTTP, mail catcher and database', async () => {
    const s = await startTestServer({ seedDemo: true });
    const login = await fetch(`${s.url}/api/auth/login`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: s.url },
      body: JSON.stringify({ email: 'theo@larkspur.example', password: 'gatefold-demo' }),
    });
    const cookie = login.headers.get('set-cookie')!.split(';')[0];
    const boardId = (await (await fetch(`${s.url}/api/boards`, { headers: { cookie } })).json()).boards[0].id;
    const ws = new WebSocket(`${s.url.replace('http', 'ws')}/collab/${boardId}`, { headers: { cookie } });
    await new Promise((resolve, reject) => {
      ws.once('open', resolve);
      ws.once('error', reject);
    });
    const socketClosed = new Promise<void>((resolve) => ws.once('close', () => resolve()));
    // keep an idle keep-alive HTTP connection open too
    await fetch(`${s.url}/api/health`);

    const t0 = Date.now();
    await s.close();
    await socketClosed;
    // Well under the 3 s force-close fallback: nothing was left hanging.
    expect(Date.now() - t0).toBeLessThan(1500);
    await expect(fetch(`${s.url}/api/health`)).rejects.toThrow();
    // the database is closed
    await expect(s.ctx.db('users').count()).rejects.toThrow();
  });
});
