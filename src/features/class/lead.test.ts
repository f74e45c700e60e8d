import { describe, expect, it } from 'vitest';
import { editorsFollowing, readLeader } from './lead';

const lead = (x: number) => ({ viewport: { x, y: 0, zoom: 1 } });

describe('lead / follow awareness', () => {
  it('reads the leader with the lowest client id, never this client, and skips malformed leads', () => {
    const states = new Map<number, unknown>([
      [1, { audience: { viewers: 3 } }],
      [7, { user: { name: 'Ms Okafor' }, lead: lead(10), selection: [] }],
      [5, { user: { name: 'Dev' }, lead: { viewport: { x: 'no' } } }],
      [9, { user: { name: 'Sam' }, lead: lead(20) }],
      [4, { user: { name: 'Me' }, lead: lead(30) }],
    ]);
    const l = readLeader(states, 4);
    expect(l?.clientId).toBe(7);
    expect(l?.name).toBe('Ms Okafor');
    expect(l?.lead.viewport.x).toBe(10);
    expect(readLeader(new Map([[4, { lead: lead(1) }]]), 4)).toBeNull();
  });

  it('counts the editors following a leader', () => {
    const states = new Map<number, unknown>([
      [7, { lead: lead(0) }], [8, { follow: 7 }], [9, { follow: 7 }], [10, { follow: null }], [11, { follow: 3 }],
    ]);
    expect(editorsFollowing(states, 7)).toBe(2);
    expect(editorsFollowing(states, 3)).toBe(1);
  });
});
