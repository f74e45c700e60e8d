import { readFileSync } from 'node:fs';
import { parseBoardFile } from '../../shared/board';
import type { BoardFile } from '../../shared/board';
import type { BoardRegistry } from './registry';

/** Reads `examples/<slug>.gatefold.json` (the demo boards' content), checked like an import. */
export function readExampleBoard(slug: string): BoardFile {
  if (!/^[a-z0-9-]+$/.test(slug)) throw new Error(`bad example name "${slug}"`);
  const raw: unknown = JSON.parse(readFileSync(new URL(`../../examples/${slug}.gatefold.json`, import.meta.url), 'utf8'));
  const parsed = parseBoardFile(raw);
  if (!parsed.ok) throw new Error(`examples/${slug}.gatefold.json: ${parsed.problems.map((p) => p.message).join('; ')}`);
  return parsed.board;
}

/** The `ctx.boardContent` hook of the demo seed: each demo board gets its example file. */
export function exampleBoardContent(registry: BoardRegistry): { seed(boardId: number, slug: string, ownerId: number): Promise<void> } {
  return {
    async seed(boardId, slug, ownerId) {
      await registry.writeBoardFile(boardId, readExampleBoard(slug), ownerId);
    },
  };
}
