import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addPart, appendSimLog, canonicalBoard, connect, disconnect, inputValuesOf, parseBoardFile, relabelPart, setPartField, type BoardFile } from '../../shared/board';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { addMember, connectClient, createBoard, signUp, waitFor, type Client, type User } from '../collab/helpers';
import { openScreen, type Screen } from './screen';

const ME = { local: 'test' };
let server: TestServer;
let a: User;
let b: User;
let v: User;
const clients: Client[] = [];
const screens: Screen[] = [];

beforeAll(async () => {
  server = await startTestServer({ logErrors: false });
  [a, b, v] = await Promise.all(['Editor A', 'Editor B', 'Viewer'].map((n) => signUp(server, n)));
});
afterAll(async () => {
  screens.forEach((s) => s.close());
  clients.forEach((c) => c.destroy());
  await server.close();
});

function example(name: string): BoardFile {
  const parsed = parseBoardFile(JSON.parse(readFileSync(`examples/${name}.gatefold.json`, 'utf8')));
  if (!parsed.ok) throw new Error(parsed.problems[0].message);
  return canonicalBoard(parsed.board);
}

async function room(file: BoardFile): Promise<number> {
  const boardId = await createBoard(server, a, file.title);
  await server.ctx.boardRegistry.writeBoardFile(boardId, file, a.id);
  await addMember(server, a, boardId, b, 'editor');
  await addMember(server, a, boardId, v, 'viewer');
  return boardId;
}

async function join(boardId: number, user: User): Promise<{ client: Client; screen: Screen }> {
  const client = connectClient(server, boardId, user.cookie);
  clients.push(client);
  await client.synced;
  const screen = openScreen(client.doc, ME);
  screens.push(screen);
  return { client, screen };
}

const step = (c: Client) => appendSimLog(c.doc, [{ kind: 'step' }], ME, () => inputValuesOf(c.doc));
const Q = ['q3.in', 'q2.in', 'q1.in', 'q0.in'];

/** Waits until every screen shows `cycles` and the same stored state; returns that state. */
async function agree(all: Screen[], cycles: number, pins: string[]): Promise<string> {
  await waitFor(() => all.every((s) => s.cycles() === cycles), `every screen at cycle ${cycles}`);
  const seen = all.map((s) => s.levels(pins));
  expect(new Set(seen).size).toBe(1);
  return seen[0];
}

describe('one simulation for the room', () => {
  it('editor A steps the 4-bit counter 5 times: every screen, and one joining later, shows cycle 5 and the same count', async () => {
    const boardId = await room(example('ripple-counter-4bit'));
    const [A, B, V] = [await join(boardId, a), await join(boardId, b), await join(boardId, v)];
    const all = [A.screen, B.screen, V.screen];
    expect(await agree(all, 0, Q)).toBe('0000');
    for (let i = 0; i < 5; i++) step(A.client);
    // after k clock cycles Q3..Q0 reads k mod 16 (common practice, no source)
    expect(await agree(all, 5, Q)).toBe('0101');
    // the flip-flops' own stored bits agree too
    expect(await agree(all, 5, ['ff3.q', 'ff2.q', 'ff1.q', 'ff0.q'])).toBe('0101');

    const L = await join(boardId, v);
    all.push(L.screen);
    expect(await agree(all, 5, Q)).toBe('0101');

    // a lamp relabel and an unrelated new part with its wire keep the state on every screen
    relabelPart(B.client.doc, 'q0', 'BIT0', ME);
    addPart(B.client.doc, { id: 'x1', kind: 'not', x: 600, y: 40 }, ME);
    addPart(B.client.doc, { id: 'lx', kind: 'lamp', label: 'LX', x: 700, y: 40 }, ME);
    connect(B.client.doc, 'x1.out', 'lx.in', ME);
    await waitFor(() => all.every((s) => s.engine.live.netlist?.partById('lx') !== undefined && s.engine.live.netlist?.partById('q0')?.name === 'BIT0'), 'the edits on every screen');
    expect(await agree(all, 5, Q)).toBe('0101');
    expect(all.map((s) => s.state()?.room?.changes)).toEqual(all.map(() => []));

    // two more steps from editor B: 7
    step(B.client);
    step(B.client);
    expect(await agree(all, 7, Q)).toBe('0111');
  });

  it('an edit that changes a flip-flop’s logic says which element changed and why; screens still agree', async () => {
    const boardId = await room(example('ripple-counter-4bit'));
    const [A, B] = [await join(boardId, a), await join(boardId, b)];
    for (let i = 0; i < 5; i++) step(A.client);
    expect(await agree([A.screen, B.screen], 5, Q)).toBe('0101');
    disconnect(A.client.doc, ['w7'], ME); // ff1.qn no longer clocks ff2
    await waitFor(() => (A.screen.state()?.room?.changes.length ?? 0) > 0, 'the change report');
    const changes = A.screen.state()!.room!.changes;
    expect(changes.map((c) => c.partId)).toContain('ff2');
    expect(changes.find((c) => c.partId === 'ff2')!.reason).toMatch(/flip-flop ff2: its own wiring or settings changed/);
    const late = await join(boardId, v);
    await agree([A.screen, B.screen, late.screen], 5, Q);
  });

  it('input changes by an editor are part of the run: D set between steps replays the same on a late screen', async () => {
    const file: BoardFile = {
      format: 'gatefold-board', version: 1, title: 'D flip-flop, Room 14', family: 'ideal',
      parts: [
        { id: 'd', kind: 'switch', label: 'D', x: 0, y: 0, on: false }, { id: 'clk', kind: 'clock', label: 'CLK', x: 0, y: 80 },
        { id: 'ff', kind: 'dff', x: 120, y: 40 }, { id: 'q', kind: 'lamp', label: 'Q', x: 240, y: 40 },
      ],
      wires: [{ id: 'w1', from: 'd.out', to: 'ff.d' }, { id: 'w2', from: 'clk.out', to: 'ff.clk' }, { id: 'w3', from: 'ff.q', to: 'q.in' }],
    };
    const boardId = await room(file);
    const [A, V] = [await join(boardId, a), await join(boardId, v)];
    const setD = (on: boolean) => {
      // what the bench does: the document's value and the record's entry in one go
      const was = inputValuesOf(A.client.doc).d;
      setPartField(A.client.doc, 'd', 'on', on, ME);
      appendSimLog(A.client.doc, [{ kind: 'input', part: 'd', value: on, was }], ME, () => ({ ...inputValuesOf(A.client.doc), d: was }));
    };
    setD(true);
    step(A.client); // Q = 1
    setD(false); // D low again, no clock edge: Q holds 1 (rising-edge D flip-flop, common practice, no source)
    expect(await agree([A.screen, V.screen], 1, ['q.in', 'd.out'])).toBe('10');
    const late = await join(boardId, b);
    // the document now says D = 0 from the start; only the record knows D was 1 at the edge
    expect(await agree([A.screen, V.screen, late.screen], 1, ['q.in', 'd.out'])).toBe('10');
    step(A.client);
    expect(await agree([A.screen, V.screen, late.screen], 2, ['q.in'])).toBe('0');
  });

  it('a viewer’s own steps are a private try-out; back to live replays the room’s run', async () => {
    const boardId = await room(example('ripple-counter-4bit'));
    const [A, V] = [await join(boardId, a), await join(boardId, v)];
    for (let i = 0; i < 3; i++) step(A.client);
    expect(await agree([A.screen, V.screen], 3, Q)).toBe('0011');
    V.screen.follow(false);
    V.screen.engine.handle({ type: 'clock', action: 'step' });
    expect(V.screen.levels(Q)).toBe('0100');
    expect(A.screen.levels(Q)).toBe('0011');
    step(A.client); // the room moves on meanwhile
    await waitFor(() => A.screen.cycles() === 4, 'A at cycle 4');
    V.screen.follow(true);
    expect(await agree([A.screen, V.screen], 4, Q)).toBe('0100');
  });

  it('a running clock is driven by the screen that started it; every screen counts the same cycles after a pause', async () => {
    const boardId = await room(example('ripple-counter-4bit'));
    const [A, B] = [await join(boardId, a), await join(boardId, b)];
    appendSimLog(A.client.doc, [{ kind: 'run', rate: 40, by: A.client.doc.clientID }], ME, () => inputValuesOf(A.client.doc));
    await waitFor(() => A.screen.cycles() >= 8, 'the clock to run a while');
    appendSimLog(B.client.doc, [{ kind: 'pause' }], ME, () => inputValuesOf(B.client.doc));
    await waitFor(() => !A.screen.engine.live.clock.running, 'the driver to stop');
    await new Promise((r) => setTimeout(r, 300));
    const n = A.screen.cycles();
    const count = await agree([A.screen, B.screen], n, Q);
    expect(parseInt(count, 2)).toBe(n % 16);
  });
});
