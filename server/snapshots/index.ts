/**
 * The snapshots feature on the server: the service (service.ts), automatic snapshots fed by the board
 * registry's activity (auto.ts), retention (retention.ts). `mountSnapshots(ctx)` wires it into the app
 * and returns its router.
 */
import type { Router } from 'express';
import type { AppContext } from '../app';
import { snapshotsRouter } from '../http/routes/snapshots';
import { AutoSnapshots, DEFAULT_AUTO_OPTIONS, type AutoSnapshotOptions } from './auto';
import { createSnapshotsService } from './service';
import { wrapDemoContent } from './demo-history';

export { createSnapshotsService, boardOfState, type SnapshotsService } from './service';
export { snapshotsToThin, DEFAULT_RETENTION } from './retention';
export { DEFAULT_AUTO_OPTIONS, type AutoSnapshotOptions } from './auto';

/**
 * Creates the snapshots service for the app, starts automatic snapshots (settings: `config.snapshots`,
 * e.g. `{ settleMs, minUpdates }` from a test) and returns the router of the snapshot and copy routes.
 */
export function mountSnapshots(ctx: AppContext): Router {
  const options: AutoSnapshotOptions = { ...DEFAULT_AUTO_OPTIONS, ...(ctx.config as { snapshots?: Partial<AutoSnapshotOptions> }).snapshots };
  // the scheduler calls the service only later (on a timer or a room unloading), so it may come first
  const auto = new AutoSnapshots(options, async (boardId) => {
    if (await ctx.boardRegistry.store.exists(boardId)) await service.take(boardId, { kind: 'automatic', authorId: null });
  });
  const service = createSnapshotsService({
    db: ctx.db, registry: ctx.boardRegistry, boards: ctx.services.boards, onTaken: (boardId) => auto.taken(boardId),
  });
  const stop = ctx.boardRegistry.onActivity(auto.onActivity);
  ctx.onClose.push(async () => {
    stop();
    await auto.close();
  });
  wrapDemoContent(ctx, service);
  return snapshotsRouter(ctx.services, service);
}
