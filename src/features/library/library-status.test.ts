import { describe, expect, it } from 'vitest';
import type { ApiLibraryModule } from '../../../shared/api';
import { libraryStanding, standingText } from './library-status';

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
});
