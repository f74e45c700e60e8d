import { z } from 'zod';
import type { Module, ModuleOrigin } from '../board';

/** `POST /api/library`: publish module `moduleId` of board `boardId` to the board owner's library. */
export const PublishLibraryModuleSchema = z.object({
  boardId: z.coerce
    .number({ error: 'Give the board id' })
    .int('The board id must be a whole number')
    .positive('The board id must be a positive number'),
  moduleId: z.string({ error: 'Give the module id' }).min(1, 'Give the module id').max(64, 'A module id has at most 64 characters'),
});
export type PublishLibraryModuleBody = z.infer<typeof PublishLibraryModuleSchema>;

/** A team-library entry as listed (no content). The library is its owner's, read by the members of the owner's boards. */
export interface ApiLibraryModule {
  id: number;
  ownerId: number;
  ownerName: string;
  title: string;
  version: number;
  /** the board and module it was last published from (null once that board is deleted) */
  sourceBoardId: number | null;
  sourceModuleId: string | null;
  createdAt: string;
  updatedAt: string;
  /** whether the caller may delete it (the library's owner) */
  mine: boolean;
}

/**
 * A library entry with its content in the board file's module shape: `modules[0]` is the entry's module,
 * followed by the modules it uses. `origin` is what the copy records (`addModules(doc, modules, origin, origin)`).
 */
export interface ApiLibraryContent extends ApiLibraryModule {
  moduleId: string;
  modules: Module[];
  origin: ModuleOrigin;
}

/** The `library` of an origin for entry `id` (origins name entries by their id as text). */
export const libraryOriginId = (id: number): string => String(id);
