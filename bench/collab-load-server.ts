/**
 * The server side of the collab load benchmark, run in its own process so that its memory (RSS) is
 * its own: `tsx bench/collab-load-server.ts gatefold|reference`. Prints one JSON line when listening
 * ({url, ...}) and serves until killed.
 * - gatefold: the real app (startTestServer: temp SQLite file, sessions, rooms), with an owner, an
 *   editor and a viewer account and one board; prints their cookies and the board id.
 * - reference: the protocol's bare reference server (@y/websocket-server `setupWSConnection`): no
 *   accounts, no storage, no checks — every message to everyone.
 */
import http from 'node:http';
import { WebSocketServer } from 'ws';
import { setupWSConnection } from '@y/websocket-server/utils';
import { startTestServer } from '../tests/helpers/test-app';
import { addMember, createBoard, signUp } from '../tests/collab/helpers';

const which = process.argv[2];
if (which === 'gatefold') {
  const server = await startTestServer({ logErrors: false });
  const owner = await signUp(server, 'Bench Owner');
  const editor = await signUp(server, 'Bench Editor');
  const viewer = await signUp(server, 'Bench Viewer');
  const boardId = await createBoard(server, owner, 'Load bench');
  await addMember(server, owner, boardId, editor, 'editor');
  await addMember(server, owner, boardId, viewer, 'viewer');
  console.log(JSON.stringify({ url: server.url.replace(/^http/, 'ws') + '/collab', room: String(boardId), editorCookie: editor.cookie, viewerCookie: viewer.cookie }));
  process.on('SIGTERM', () => void server.close().finally(() => process.exit(0)));
} else if (which === 'reference') {
  const wss = new WebSocketServer({ noServer: true });
  const server = http.createServer((_req, res) => res.end('okay'));
  server.on('upgrade', (req, socket, head) => wss.handleUpgrade(req, socket, head, (ws) => setupWSConnection(ws, req)));
  server.listen(0, '127.0.0.1', () => {
    const { port } = server.address() as { port: number };
    console.log(JSON.stringify({ url: `ws://127.0.0.1:${port}`, room: 'load-bench', editorCookie: '', viewerCookie: '' }));
  });
  process.on('SIGTERM', () => process.exit(0));
} else {
  console.error('usage: collab-load-server.ts gatefold|reference');
  process.exit(2);
}
