import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { DEMO_BOARDS, DEMO_PASSWORD, DEMO_USERS } from '../../server/seed/demo';
import { api, connectClient, waitFor } from './helpers';
import { docToBoard } from '../../shared/board';

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer({ seedDemo: true });
});
afterAll(() => server.close());

async function signIn(email: string): Promise<string> {
  const res = await api(server, 'POST', '/api/auth/login', undefined, { email, password: DEMO_PASSWORD });
  expect(res.status).toBe(200);
  return (res.headers.getSetCookie()[0] ?? '').split(';')[0];
}

describe('demo boards', () => {
  it('each demo board holds its example file, over HTTP and over the live socket', async () => {
    for (const demo of DEMO_BOARDS) {
      const owner = DEMO_USERS.find((u) => u.key === demo.owner)!;
      const cookie = await signIn(owner.email);
      const list = (await (await api(server, 'GET', '/api/boards', cookie)).json()) as { boards: { id: number; title: string }[] };
      const board = list.boards.find((b) => b.title === demo.title)!;
      const exported = await (await api(server, 'GET', `/api/boards/${board.id}/export`, cookie)).text();
      const file = readFileSync(new URL(`../../examples/${demo.slug}.gatefold.json`, import.meta.url), 'utf8');
      expect(exported).toBe(file);
      const client = connectClient(server, board.id, cookie);
      await client.synced;
      await waitFor(() => client.doc.getMap('parts').size > 0, 'the document to arrive');
      expect(JSON.stringify(docToBoard(client.doc), null, 2) + '\n').toBe(file);
      client.destroy();
    }
  });
});
