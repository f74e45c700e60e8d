/**
 * Modules in the Yjs document: the board file ⇄ document conversion round-trips them byte for byte, the
 * strict document check accepts them (and names a malformed one), the named edits make a module from a
 * selection and edit its inside with per-user undo, and over the real room server two editors see an
 * edit inside a module change every instance.
 */
import * as Y from 'yjs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  addPart, canonicalBoard, checkDoc, connect, docToBoard, boardToDoc, makeModule, moduleDoc, modulesMap, parseBoardFile,
  placeInstance, quarantineDoc, setPartField,
} from '../../shared/board';
import { analyzeBoard } from '../../shared/analysis';
import { compileBoard, Simulator } from '../../shared/sim';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { connectClient, createBoard, addMember, signUp, waitFor, type Client, type User } from '../collab/helpers';
import { fullAdderFlat, fullAdderOfModules } from './boards';

const ME = { local: 'me' };
const OTHER = { local: 'other' };

function docOf(board = fullAdderOfModules()): Y.Doc {
  const doc = new Y.Doc();
  boardToDoc(board, doc);
  return doc;
}

describe('modules in the document', () => {
  it('round-trips a board with modules byte for byte', () => {
    const board = canonicalBoard(fullAdderOfModules());
    const text = JSON.stringify(board, null, 2);
    const doc = docOf(board);
    expect(JSON.stringify(docToBoard(doc), null, 2)).toBe(text);
    expect(Object.keys(docToBoard(doc).modules![0])).toEqual(['id', 'title', 'parts', 'wires']);
    // a flat board's export has no modules key at all
    expect('modules' in docToBoard(docOf(fullAdderFlat()))).toBe(false);
  });

  it('passes the strict document check, and a malformed module does not', () => {
    const doc = docOf();
    expect(checkDoc(doc)).toEqual([]);
    const half = modulesMap(doc).get('half')!;
    doc.transact(() => { (half.get('parts') as Y.Map<Y.Map<unknown>>).get('g1')!.set('inputs', 1000); });
    const problems = checkDoc(doc);
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatchObject({ kind: 'shape', where: 'root', key: 'modules' });
    expect(problems[0].message).toMatch(/module "half": part "g1": inputs/);
    // reported, never thrown; the rest of the board is still a board
    expect(() => quarantineDoc(doc, ME)).not.toThrow();
  });

  it('makes a module from a selection with the same table, and an edit inside changes every instance', () => {
    const doc = docOf(fullAdderFlat());
    const before = analyzeBoard(docToBoard(doc)).rows;
    const made = makeModule(doc, ['x1', 'a1'], ME, { title: 'Half adder' });
    const board = docToBoard(doc);
    expect(parseBoardFile(board).ok).toBe(true);
    expect(board.modules!.map((m) => m.id)).toEqual([made.moduleId]);
    expect(board.parts.some((p) => p.id === 'x1')).toBe(false);
    expect(analyzeBoard(board).rows).toEqual(before);
    // ports named from the labels on the crossing nets: A and B come from the switches
    const ports = board.modules![0].parts.filter((p) => p.kind === 'port').map((p) => p.label);
    expect(ports).toEqual(expect.arrayContaining(['A', 'B']));

    // a second instance, then an edit inside: both instances follow
    placeInstance(doc, made.moduleId, 600, 400, ME);
    const inside = moduleDoc(doc, made.moduleId);
    setPartField(inside, 'a1', 'inputs', 3, OTHER);
    const after = docToBoard(doc);
    const flat = compileBoard(after).parts.filter((p) => p.id.endsWith('/a1'));
    expect(flat.map((p) => p.inputs.length)).toEqual([3, 3]);
  });

  it('undoes an edit inside a module for the user who made it only', () => {
    const doc = docOf();
    const undo = new Y.UndoManager([doc.getMap('parts'), doc.getMap('wires'), doc.getMap('meta'), modulesMap(doc)], { trackedOrigins: new Set([ME]), captureTimeout: 0 });
    const inside = moduleDoc(doc, 'half');
    const id = addPart(inside, { id: '', kind: 'not', x: 100, y: 200 }, ME);
    addPart(inside, { id: '', kind: 'buffer', x: 100, y: 260 }, OTHER);
    expect(docToBoard(doc).modules![0].parts.map((p) => p.kind)).toContain('not');
    undo.undo();
    const kinds = docToBoard(doc).modules![0].parts.map((p) => p.kind);
    expect(kinds).not.toContain('not');
    expect(kinds).toContain('buffer');
    expect(id).toMatch(/^g/);
  });

  it('simulates an instance whose module was edited to invert its sum', () => {
    const doc = docOf();
    const inside = moduleDoc(doc, 'half');
    // S of each half adder now goes through an inverter: S' = NOT(A xor B)
    doc.transact(() => {
      const wires = inside.getMap<Y.Map<unknown>>('wires');
      wires.delete('w5');
    }, ME);
    const inv = addPart(inside, { id: 'inv', kind: 'not', x: 280, y: 60 }, ME);
    expect(connect(inside, 'g1.out', `${inv}.in0`, ME).ok).toBe(true);
    expect(connect(inside, `${inv}.out`, 's.in', ME).ok).toBe(true);
    const sim = new Simulator(compileBoard(docToBoard(doc)));
    sim.settle();
    // A = B = CIN = 0: u1.S = NOT(0) = 1, u2.S = NOT(1 xor 0) = 0 (worked by hand)
    expect(sim.outputValues().S).toBe('0');
  });
});

describe('modules over the room server', () => {
  let server: TestServer;
  let owner: User;
  let editor: User;
  const clients: Client[] = [];
  beforeAll(async () => {
    server = await startTestServer();
    owner = await signUp(server, 'Owner Modules');
    editor = await signUp(server, 'Editor Modules');
  });
  afterAll(async () => {
    clients.forEach((c) => c.destroy());
    await server.close();
  });

  it('accepts module edits from an editor and shows them to the other', async () => {
    const boardId = await createBoard(server, owner, 'Modules');
    await addMember(server, owner, boardId, editor, 'editor');
    const a = connectClient(server, boardId, owner.cookie);
    const b = connectClient(server, boardId, editor.cookie);
    clients.push(a, b);
    await Promise.all([a.synced, b.synced]);
    boardToDoc(fullAdderFlat(), a.doc, ME);
    await waitFor(() => docToBoard(b.doc).parts.length === docToBoard(a.doc).parts.length, 'the board on the second screen');
    const made = makeModule(a.doc, ['x1', 'a1'], ME, { title: 'Half adder' });
    await waitFor(() => (docToBoard(b.doc).modules ?? []).length === 1, 'the module on the second screen');
    setPartField(moduleDoc(b.doc, made.moduleId), 'x1', 'inputs', 3, OTHER);
    const inputsOfX1 = (doc: Y.Doc) => (docToBoard(doc).modules?.[0].parts.find((p) => p.id === 'x1') as { inputs?: number } | undefined)?.inputs;
    await waitFor(() => inputsOfX1(a.doc) === 3, 'the edit inside on the first screen');
    // the server kept both: a third screen that joins now gets the module
    const c = connectClient(server, boardId, owner.cookie);
    clients.push(c);
    await c.synced;
    await waitFor(() => inputsOfX1(c.doc) === 3, 'the module on a late screen');
    expect(parseBoardFile(docToBoard(c.doc)).ok).toBe(true);
  });
});
