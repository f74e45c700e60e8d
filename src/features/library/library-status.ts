/** Where a board's module stands with the team library, for the drawer and the module bar. */
import type { ApiLibraryModule } from '../../../shared/api';
import type { Module } from '../../../shared/board';

export interface LibraryStanding {
  /** the library entry this module was published to or copied from, if the caller can read it */
  entry?: ApiLibraryModule;
  /** the version the board holds, for a copy (its recorded origin) */
  copyVersion?: number;
  /** a copy older than its entry: "update from library" applies */
  stale: boolean;
}

/** Whether `entry` was last published from this board's module `moduleId` (its content is that module's). */
export function publishedFrom(entry: Pick<ApiLibraryModule, 'sourceBoardId' | 'sourceModuleId'>, boardId: number, moduleId: string): boolean {
  return entry.sourceBoardId === boardId && entry.sourceModuleId === moduleId;
}

/**
 * Whether the board's copy of `entry` (the version its module's origin records) is older than the entry:
 * "update from library" applies. Never for the module the entry was last published from: publishing
 * records the new version as the module's origin, and a module published before that was recorded (or
 * whose recording failed) holds what the entry holds all the same.
 */
export function copyIsStale(entry: Pick<ApiLibraryModule, 'version' | 'sourceBoardId' | 'sourceModuleId'>, boardId: number, copy: { moduleId: string; version: number }): boolean {
  return entry.version > copy.version && !publishedFrom(entry, boardId, copy.moduleId);
}

/**
 * The entry of a module: the entry its origin names (a copy, or a module published from this board, which
 * the server marks with the entry's new version when it publishes it); without an origin the entry last
 * published from this board and module (published before origins were recorded).
 */
export function libraryStanding(entries: readonly ApiLibraryModule[] | undefined, boardId: number, module: Pick<Module, 'id' | 'origin'>): LibraryStanding {
  const list = entries ?? [];
  if (module.origin) {
    const { library, version } = module.origin;
    const entry = list.find((e) => String(e.id) === library);
    // the module this entry was last published from is the entry's source, not a copy of it
    if (entry && publishedFrom(entry, boardId, module.id)) return { entry, stale: false };
    return { entry, copyVersion: version, stale: entry !== undefined && copyIsStale(entry, boardId, { moduleId: module.id, version }) };
  }
  const entry = list.find((e) => publishedFrom(e, boardId, module.id));
  return { entry, stale: false };
}

/** A short line for a module's standing: "not in the library", "library v2", "copy v1 · library v2". */
export function standingText(s: LibraryStanding): string {
  if (s.copyVersion !== undefined) return s.entry ? `copy v${s.copyVersion} · library v${s.entry.version}` : `copy v${s.copyVersion}`;
  return s.entry ? `library v${s.entry.version}` : 'not in the library';
}
