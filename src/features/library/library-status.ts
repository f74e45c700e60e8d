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

/**
 * The entry of a module: for a copy the entry its origin names; otherwise the entry last published from
 * this board and module (the server raises that entry's version when it is published again).
 */
export function libraryStanding(entries: readonly ApiLibraryModule[] | undefined, boardId: number, module: Pick<Module, 'id' | 'origin'>): LibraryStanding {
  const list = entries ?? [];
  if (module.origin) {
    const { library, version } = module.origin;
    const entry = list.find((e) => String(e.id) === library);
    return { entry, copyVersion: version, stale: entry !== undefined && entry.version > version };
  }
  const entry = list.find((e) => e.sourceBoardId === boardId && e.sourceModuleId === module.id);
  return { entry, stale: false };
}

/** A short line for a module's standing: "not in the library", "library v2", "copy v1 · library v2". */
export function standingText(s: LibraryStanding): string {
  if (s.copyVersion !== undefined) return s.entry ? `copy v${s.copyVersion} · library v${s.entry.version}` : `copy v${s.copyVersion}`;
  return s.entry ? `library v${s.entry.version}` : 'not in the library';
}
