/**
 * Real clients for the collaboration tests: accounts made through the HTTP API (fetch, real cookies),
 * y-websocket providers over real sockets to a listening server with a temp SQLite file.
 */
import WebSocket from 'ws';
import * as Y from 'yjs';
import { WebsocketProvider } from 'y-websocket';
import type { TestServer } from '../helpers/test-app';

export interface User {
  id: number;
  email: string;
  cookie: string;
}

/** JSON request to the server with the user's cookie and an allowed Origin. */
export async function api(server: TestServer, method: string, path: string, cookie?: string, body?: unknown): Promise<Response> {
  return fetch(server.url + path, {
    method,
    headers: {
      Origin: server.url,
      ...(cookie ? { Cookie: cookie } : {}),
      ...(body !== undefined ? { 'Content-Type': 'application/json' } : {}),
    },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
}

let counter = 0;
/** Signs up a fresh account and returns its session cookie. */
export async function signUp(server: TestServer, name: string): Promise<User> {
  const email = `${name.toLowerCase().replace(/[^a-z0-9]+/g, '-')}-${process.pid}-${++counter}@collab.example`;
  const res = await api(server, 'POST', '/api/auth/signup', undefined, { name, email, password: 'correct horse battery' });
  if (res.status !== 201) throw new Error(`signup answered ${res.status}: ${await res.text()}`);
  const cookie = (res.headers.getSetCookie()[0] ?? '').split(';')[0];
  if (!cookie) throw new Error('signup set no cookie');
  const { user } = (await res.json()) as { user: { id: number } };
  return { id: user.id, email, cookie };
}

/** Creates a board owned by `owner`; returns its id. */
export async function createBoard(server: TestServer, owner: User, title = 'Test board'): Promise<number> {
  const res = await api(server, 'POST', '/api/boards', owner.cookie, { title });
  if (res.status !== 201) throw new Error(`create board answered ${res.status}: ${await res.text()}`);
  return ((await res.json()) as { board: { id: number } }).board.id;
}

/** Adds an existing account to a board. */
export async function addMember(server: TestServer, owner: User, boardId: number, user: User, role: 'editor' | 'viewer'): Promise<void> {
  const res = await api(server, 'POST', `/api/boards/${boardId}/members`, owner.cookie, { email: user.email, role });
  if (res.status !== 201) throw new Error(`add member answered ${res.status}: ${await res.text()}`);
}

/** The export of a board, as text. */
export async function exportText(server: TestServer, user: User, boardId: number): Promise<string> {
  const res = await api(server, 'GET', `/api/boards/${boardId}/export`, user.cookie);
  if (res.status !== 200) throw new Error(`export answered ${res.status}: ${await res.text()}`);
  return res.text();
}

/** A `ws` client that sends a Cookie header (browsers send the cookie themselves). */
export function cookieSocket(cookie: string) {
  return class CookieWebSocket extends WebSocket {
    constructor(url: string | URL, protocols?: string | string[]) {
      super(url, protocols, { headers: { Cookie: cookie } });
    }
  };
}

export interface Client {
  doc: Y.Doc;
  provider: WebsocketProvider;
  /** Resolves once the first sync with the server is complete. */
  synced: Promise<void>;
  destroy(): void;
}

/** A y-websocket client on the board's room. */
export function connectClient(server: TestServer, boardId: number, cookie: string, params: Record<string, string> = {}): Client {
  const doc = new Y.Doc();
  const provider = new WebsocketProvider(server.url.replace(/^http/, 'ws') + '/collab', String(boardId), doc, {
    WebSocketPolyfill: cookieSocket(cookie) as never,
    disableBc: true,
    params,
  });
  const synced = new Promise<void>((resolve) => {
    if (provider.synced) resolve();
    provider.once('sync', () => resolve());
  });
  return {
    doc,
    provider,
    synced,
    destroy() {
      provider.destroy();
      doc.destroy();
    },
  };
}

/** Polls `check` until it returns true (or throws after `timeoutMs`). */
export async function waitFor(check: () => boolean | Promise<boolean>, what: string, timeoutMs = 5000): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > until) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 10));
  }
}

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/**
 * Opens a raw socket and reports how the upgrade ended: the HTTP status of a refusal, and how many
 * bytes of websocket data arrived (document bytes must never reach a refused client).
 */
export function rawUpgrade(server: TestServer, path: string, cookie?: string): Promise<{ status: number | null; bytes: number; opened: boolean }> {
  return new Promise((resolve) => {
    const ws = new WebSocket(server.url.replace(/^http/, 'ws') + path, { headers: cookie ? { Cookie: cookie } : {} });
    let bytes = 0;
    ws.on('message', (data: Buffer) => (bytes += data.length));
    ws.on('unexpected-response', (_req, res) => {
      res.resume();
      resolve({ status: res.statusCode ?? null, bytes, opened: false });
    });
    ws.on('open', () => setTimeout(() => (ws.close(), resolve({ status: 101, bytes, opened: true })), 200));
    ws.on('error', () => resolve({ status: null, bytes, opened: false }));
  });
}
