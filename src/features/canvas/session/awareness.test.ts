import { afterEach, describe, expect, it, vi } from 'vitest';
import * as Y from 'yjs';
import { Awareness } from 'y-protocols/awareness';
import { AWAY_AFTER_MS, readPeers, throttle } from './awareness';

describe('readPeers', () => {
  it('reads other clients\u2019 cursors, selections and drags from real awareness states, skipping itself and malformed states', () => {
    const mine = new Awareness(new Y.Doc());
    mine.setLocalState({ user: { id: '1', name: 'Mara Quinn', color: '#4cc9f0' }, cursor: { x: 1, y: 2 }, selection: ['g1'] });
    const states = new Map<number, unknown>(mine.getStates());
    states.set(mine.clientID + 1, { user: { id: '2', name: 'Ines Okafor', color: '#80ed99' }, cursor: { x: 40, y: 60 }, selection: ['g2', 'a'], dragging: [{ id: 'g2', x: 100, y: 120 }] });
    states.set(mine.clientID + 2, { user: 'not a user' });
    const view = readPeers(states, mine.clientID);
    expect(view.peers).toHaveLength(1);
    expect(view.peers[0]).toMatchObject({ user: { name: 'Ines Okafor' }, cursor: { x: 40, y: 60 } });
    expect([...view.selection]).toEqual([['g2', '#80ed99'], ['a', '#80ed99']]);
    expect(view.dragging.get('g2')).toEqual({ x: 100, y: 120 });
    expect(view.selection.has('g1')).toBe(false);
    mine.destroy();
  });
});

describe('throttle', () => {
  afterEach(() => vi.useRealTimers());

  it('calls at once, then at most once per period with the latest arguments', () => {
    vi.useFakeTimers();
    const calls: number[] = [];
    const t = throttle((n: number) => calls.push(n), 50);
    t(1);
    t(2);
    t(3);
    expect(calls).toEqual([1]);
    vi.advanceTimersByTime(60);
    expect(calls).toEqual([1, 3]);
    t(4);
    t.flush();
    expect(calls).toEqual([1, 3, 4]);
  });

  it('marks a peer whose state was not renewed for 20 s as away', () => {
    const user = (id: string) => ({ user: { id, name: id, color: '#4cc9f0' }, cursor: null, selection: [] });
    const states = new Map<number, unknown>([[1, user('me')], [2, user('fresh')], [3, user('gone')]]);
    const now = 100_000;
    const meta = new Map([[2, { lastUpdated: now - 1000 }], [3, { lastUpdated: now - AWAY_AFTER_MS - 1 }]]);
    const view = readPeers(states, 1, { meta, now });
    expect(view.peers.map((p) => [p.user.id, p.away])).toEqual([['fresh', false], ['gone', true]]);
  });
});
