import { describe, expect, it } from 'vitest';
import type { ApiLibraryModule } from '../../../shared/api';
import { copyIsStale, libraryStanding, standingText } from './library-status';

const entry = (id: number, version: number, sourceBoardId: number | null, sourceModuleId: string | null): ApiLibraryModule => ({
  id, ownerId: 1, ownerName: 'Mara Quinn', title: `Entry ${id}`, version, sourceBoardId, sourceModuleId,
  createdAt: '2026-12-02T10:00:00.000Z', updatedAt: '2026-12-02T10:00:00.000Z', mine: true,
});

describe('libraryStanding', () => {
  const entries = [entry(3, 2, 7, 'half'), entry(4, 1, 9, 'nor_ff')];

  it('finds the entry a module was published to from this board', () => {
    const s = libraryStanding(entries, 7, { id: 'half' });
    expect(s).toEqual({ entry: entries[0], stale: false });
    expect(standingText(s)).toBe('library v2');
    // the same module id on another board was never published from there
    expect(standingText(libraryStanding(entries, 8, { id: 'half' }))).toBe('not in the library');
  });

  it('finds the entry of a copy by its origin, and says when the library has a newer version', () => {
    const s = libraryStanding(entries, 12, { id: 'half_2', origin: { library: '3', version: 1 } });
    expect(s.entry).toBe(entries[0]);
    expect(s.stale).toBe(true);
    expect(standingText(s)).toBe('copy v1 · library v2');
    expect(libraryStanding(entries, 12, { id: 'ff', origin: { library: '4', version: 1 } }).stale).toBe(false);
    // an entry the user can no longer read (deleted): the copy still says what it holds
    expect(standingText(libraryStanding(entries, 12, { id: 'x', origin: { library: '99', version: 5 } }))).toBe('copy v5');
  });

  it('a module the entry was last published from is its source, not a copy: it records the new version and is never stale', () => {
    // published from board 7 as v2: the server recorded {library: "3", version: 2} on the module
    const s = libraryStanding(entries, 7, { id: 'half', origin: { library: '3', version: 2 } });
    expect(s).toEqual({ entry: entries[0], stale: false });
    expect(standingText(s)).toBe('library v2');
    // a copy that was edited and published again before origins were recorded still says v1: not stale either
    expect(libraryStanding(entries, 7, { id: 'half', origin: { library: '3', version: 1 } }).stale).toBe(false);
    expect(copyIsStale(entries[0], 7, { moduleId: 'half', version: 1 })).toBe(false);
  });

  it('once the entry is published from another board, the board it was published from before holds an older copy', () => {
    // entry 3 v2 now comes from board 7; board 5 published v1 and recorded it
    const s = libraryStanding(entries, 5, { id: 'half', origin: { library: '3', version: 1 } });
    expect(s).toEqual({ entry: entries[0], copyVersion: 1, stale: true });
    expect(standingText(s)).toBe('copy v1 · library v2');
    expect(copyIsStale(entries[0], 5, { moduleId: 'half', version: 1 })).toBe(true);
    expect(copyIsStale(entries[0], 5, { moduleId: 'half', version: 2 })).toBe(false);
  });
});
