import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { addPart, connect, deleteSelection, movePart, relabelPart, rotateParts } from '../../shared/board';
import { docToBoard, partsMap } from '../../shared/board';
import { parseBoardFile } from '../../shared/board';
import { addMember, connectClient, createBoard, exportText, signUp, waitFor, type User } from './helpers';

const ME = { local: 'prop' };
let server: TestServer;
let users: User[];

beforeAll(async () => {
  server = await startTestServer();
  users = await Promise.all(['P0', 'P1', 'P2'].map((n) => signUp(server, n)));
});
afterAll(() => server.close());

type Op = { who: number; kind: 'add' | 'move' | 'del' | 'wire' | 'rot' | 'label'; n: number };
const opArb: fc.Arbitrary<Op> = fc.record({
  who: fc.integer({ min: 0, max: 2 }),
  kind: fc.constantFrom('add', 'move', 'del', 'wire', 'rot', 'label'),
  n: fc.integer({ min: 0, max: 40 }),
});

describe('three live clients through the server', () => {
  it('property: random concurrent edits converge to one valid board, and that is what is stored', async () => {
    await fc.assert(fc.asyncProperty(fc.array(opArb, { minLength: 5, maxLength: 40 }), async (ops) => {
      const boardId = await createBoard(server, users[0]);
      for (const u of users.slice(1)) await addMember(server, users[0], boardId, u, 'editor');
      const clients = users.map((u) => connectClient(server, boardId, u.cookie));
      try {
        await Promise.all(clients.map((c) => c.synced));
        for (const op of ops) {
          const doc = clients[op.who].doc;
          const ids = [...partsMap(doc).keys()].sort();
          const id = ids.length ? ids[op.n % ids.length] : undefined;
          switch (op.kind) {
            case 'add': addPart(doc, op.n % 2 ? { id: '', kind: 'switch', label: 'S', x: op.n * 20, y: 0, on: false } : { id: '', kind: 'not', x: op.n * 20, y: 40 }, ME); break;
            case 'move': if (id) movePart(doc, [{ id, x: op.n * 20, y: op.n * 20 }], ME); break;
            case 'del': if (id) deleteSelection(doc, [id], [], ME); break;
            case 'wire': if (ids.length > 1) connect(doc, `${id}.out`, `${ids[(op.n + 1) % ids.length]}.in0`, ME); break;
            case 'rot': if (id) rotateParts(doc, [id], ME); break;
            case 'label': if (id) try { relabelPart(doc, id, `L${op.n % 3}`, ME); } catch { /* refused locally: a used label */ } break;
          }
          if (op.n % 4 === 0) await new Promise((r) => setTimeout(r, 1)); // sometimes let messages cross
        }
        const text = (i: number) => JSON.stringify(docToBoard(clients[i].doc));
        await waitFor(() => text(0) === text(1) && text(1) === text(2), 'the three clients to agree', 8000);
        // the server's repairs have landed too: the agreed board is a valid file
        await waitFor(() => parseBoardFile(JSON.parse(text(0))).ok, 'a valid board', 8000);
        await waitFor(() => text(0) === text(1) && text(1) === text(2), 'agreement after repairs', 8000);
        await server.ctx.boardRegistry.flushAll();
        expect(JSON.parse(await exportText(server, users[0], boardId))).toEqual(JSON.parse(text(0)));
      } finally {
        clients.forEach((c) => c.destroy());
      }
    }), { numRuns: 8 });
  });
});
