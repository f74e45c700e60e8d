/**
 * The demo boards' short histories (server/seed/demo.ts names the stages): after a demo board gets its
 * content, its earlier stages are written one by one and each is kept as a named snapshot by the owner;
 * the board ends as the full example.
 */
import type { BoardFile } from '../../shared/board';
import { splitPinRef } from '../../shared/board';
import type { AppContext } from '../app';
import { DEMO_HISTORY, type DemoBoardSlug } from '../seed/demo';
import type { SnapshotsService } from './service';

/** The board with only `ids` among its parts (and the wires between them). */
function stage(board: BoardFile, ids: string[] | undefined): BoardFile {
  if (!ids) return board;
  const keep = new Set(ids);
  const parts = board.parts.filter((p) => keep.has(p.id));
  const wires = board.wires.filter((w) => keep.has(splitPinRef(w.from)?.part ?? '') && keep.has(splitPinRef(w.to)?.part ?? ''));
  return { ...board, parts, wires };
}

/** Makes the demo seed's board-content hook also leave each demo board's history. */
export function wrapDemoContent(ctx: AppContext, snapshots: SnapshotsService): void {
  const content = ctx.boardContent;
  if (!content) return;
  ctx.boardContent = {
    async seed(boardId, slug, ownerId) {
      await content.seed(boardId, slug, ownerId);
      const stages = DEMO_HISTORY[slug as DemoBoardSlug];
      if (!stages?.length) return;
      const full = await ctx.boardRegistry.readBoardFile(boardId);
      for (const s of stages) {
        await ctx.boardRegistry.writeBoardFile(boardId, stage(full, s.parts), ownerId);
        await snapshots.take(boardId, { kind: 'named', name: s.name, authorId: ownerId });
      }
      if (stages[stages.length - 1].parts) await ctx.boardRegistry.writeBoardFile(boardId, full, ownerId);
    },
  };
}
