import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseBoardFile, type BoardFile } from '../../../shared/board';
import { diagnose, testVectors } from '../../../shared/bringup';
import { BringupJobs } from './bringup-jobs';
import type { FromWorker, ToWorker } from './protocol';
import { DOOR_LAMP } from '../../../tests/collab/door-lamp';

// The worker only moves shared/bringup off the page's thread: its answers must be exactly what
// testVectors and diagnose give when called directly (their own tests check them against outside sources).
function example(name: string): BoardFile {
  const parsed = parseBoardFile(JSON.parse(readFileSync(new URL(`../../../examples/${name}`, import.meta.url), 'utf8')));
  if (!parsed.ok) throw new Error(name);
  return parsed.board;
}
const mux = example('mux-logic-unit.gatefold.json');
const adder = example('half-adder.gatefold.json');
const moved = (b: BoardFile): BoardFile => ({ ...b, parts: b.parts.map((p) => ({ ...p, x: p.x + 40, y: p.y - 20 })) });

/** The job runner with a hand-driven queue in place of the worker's timer: `turn()` runs one deferred step. */
function manual() {
  const posted: FromWorker[] = [];
  const queue: (() => void)[] = [];
  const jobs = new BringupJobs((m) => posted.push(m), (fn) => queue.push(fn));
  const turn = () => { const fn = queue.shift(); if (!fn) throw new Error('nothing to run'); fn(); };
  const drain = () => { while (queue.length) turn(); };
  const run = (id: number, board: BoardFile, observed: { in: string; out: string }[] = []) => jobs.handle({ type: 'run', id, board, observed });
  const of = (id: number) => posted.filter((m) => m.id === id).map((m) => m.type);
  return { jobs, posted, turn, drain, run, of, queue };
}

describe('bring-up worker (message handler loaded as in a worker)', () => {
  // the module itself, in a plain global scope that records what it posts (Node has no Web Worker)
  const posted: FromWorker[] = [];
  const scope = { onmessage: null as ((e: { data: ToWorker }) => void) | null, postMessage: (msg: FromWorker) => { posted.push(msg); } };
  const hadSelf = 'self' in globalThis;
  beforeAll(async () => {
    Object.assign(globalThis, { self: scope });
    await import('./bringup-worker');
  });
  afterAll(() => { if (!hadSelf) delete (globalThis as { self?: unknown }).self; });

  it('posts the vectors testVectors gives, then the end of the job', async () => {
    scope.onmessage!({ data: { type: 'run', id: 1, board: mux, observed: [] } });
    await expect.poll(() => posted.some((m) => m.id === 1 && m.type === 'diagnosis'), { timeout: 20_000 }).toBe(true);
    expect(posted.map((m) => m.type)).toEqual(['working', 'vectors', 'diagnosis']);
    const vectors = posted.find((m) => m.type === 'vectors');
    expect(vectors?.type === 'vectors' && vectors.result).toEqual(testVectors(mux));
    expect(vectors?.type === 'vectors' && vectors.result?.detected).toBe(46); // what the browser test reads
    expect(posted.at(-1)).toEqual({ type: 'diagnosis', id: 1, result: null });
  });
});

describe('BringupJobs', () => {
  it('keeps the vectors for the board\'s logic: a moved board answers at once, without working', () => {
    const m = manual();
    m.run(1, adder);
    m.drain();
    m.run(2, moved(adder));
    m.drain();
    expect(m.of(1)).toEqual(['working', 'vectors', 'diagnosis']);
    expect(m.of(2)).toEqual(['vectors', 'diagnosis']);
    const [a, b] = m.posted.filter((p) => p.type === 'vectors');
    expect(b).toEqual({ ...a, id: 2 });
  });

  it('diagnoses the record as diagnose() does, record after record, with the diagnosis prepared once', () => {
    const m = manual();
    const tv = testVectors(mux);
    const wrong = (k: number) => ({ in: tv.vectors[k].in, out: tv.vectors[k].out.replace(/^./, (c) => (c === '1' ? '0' : '1')) });
    const records = [[wrong(0)], [wrong(0), { ...tv.vectors[1] }], [{ ...tv.vectors[2] }, wrong(3)]];
    records.forEach((observed, k) => {
      m.run(k + 1, moved(mux), observed);
      m.drain();
      const msg = m.posted.find((p) => p.id === k + 1 && p.type === 'diagnosis');
      const direct = diagnose(mux, observed, { vectors: tv.vectors.map((v) => v.in) });
      expect(msg).toEqual({ type: 'diagnosis', id: k + 1, result: direct });
    });
    expect(m.of(1)).toEqual(['working', 'vectors', 'working', 'diagnosis']);
    expect(m.of(3)).toEqual(['vectors', 'working', 'diagnosis']);
  });

  it('leaves out observations that do not fit the vectors (another number of switches or lamps)', () => {
    const m = manual();
    m.run(1, adder, [{ in: '1', out: '00' }, { in: '11', out: '0' }]);
    m.drain();
    expect(m.posted.at(-1)).toEqual({ type: 'diagnosis', id: 1, result: null });
  });

  it('runs only the newest of the jobs that came while it was busy; the others are told they were dropped', () => {
    const m = manual();
    m.run(1, adder);
    m.run(2, mux);
    m.run(3, adder);
    m.drain();
    expect(m.of(1)).toEqual(['cancelled']);
    expect(m.of(2)).toEqual(['cancelled']);
    expect(m.of(3)).toEqual(['working', 'vectors', 'diagnosis']);
  });

  it('drops a job between its vectors and its diagnosis when a newer one comes, and on cancel', () => {
    const m = manual();
    const tv = testVectors(adder);
    const observed = [{ in: tv.vectors[0].in, out: '11' }];
    m.run(1, adder, observed);
    m.turn(); // vectors of job 1
    expect(m.of(1)).toEqual(['working', 'vectors']);
    m.run(2, adder, observed);
    m.drain();
    expect(m.of(1)).toEqual(['working', 'vectors', 'cancelled']);
    expect(m.of(2)).toEqual(['vectors', 'working', 'diagnosis']);

    m.run(3, adder, observed);
    m.turn();
    m.jobs.handle({ type: 'cancel', id: 3 });
    m.drain();
    expect(m.of(3)).toEqual(['vectors', 'cancelled']);
    m.run(4, mux);
    m.jobs.handle({ type: 'cancel', id: 4 });
    m.drain();
    expect(m.of(4)).toEqual(['cancelled']);
  });

  it('answers a board that cannot have vectors with the message testVectors throws', () => {
    const m = manual();
    const dark: BoardFile = { ...adder, parts: adder.parts.filter((p) => p.kind !== 'lamp'), wires: [] };
    let message = '';
    try { testVectors(dark); } catch (err) { message = (err as Error).message; }
    expect(message).not.toBe('');
    m.run(1, dark, [{ in: '11', out: '10' }]);
    m.drain();
    expect(m.posted.filter((p) => p.id === 1)).toEqual([
      { type: 'working', id: 1, stage: 'vectors' },
      { type: 'vectors', id: 1, key: expect.any(String), result: null, error: message },
      { type: 'diagnosis', id: 1, result: null },
    ]);
  });

  it('works again after an edit inside a module, not after a part moved inside one', () => {
    const m = manual();
    // a lamp through an inverter module: OPEN lights while KEY is off (the collaboration tests' board)
    const door = DOOR_LAMP;
    const inv = door.modules![0];
    const movedInside: BoardFile = { ...door, modules: [{ ...inv, parts: inv.parts.map((p) => ({ ...p, x: p.x + 20 })) }] };
    const straight: BoardFile = { ...door, modules: [{ ...inv, parts: inv.parts.filter((p) => p.id !== 'g1'), wires: [{ id: 'w1', from: 'pa.out', to: 'py.in' }] }] };
    [door, movedInside, straight].forEach((b, k) => { m.run(k + 1, b); m.drain(); });
    expect(m.of(1)[0]).toBe('working');
    expect(m.of(2)[0]).toBe('vectors');
    expect(m.of(3)[0]).toBe('working');
    const v = (id: number) => m.posted.find((p) => p.id === id && p.type === 'vectors');
    expect(v(3)).toEqual({ type: 'vectors', id: 3, key: expect.any(String), result: testVectors(straight), error: null });
    expect(v(1)).not.toEqual({ ...v(3), id: 1 });
  });
});
