import type { Db } from './knex';

/** What a snapshot row holds besides its state blob (lists never read the blob or the thumbnail). */
export interface SnapshotRow {
  id: number;
  board_id: number;
  name: string;
  author_id: number | null;
  author_name: string | null;
  created_at: string;
  kind: string;
  part_count: number;
  wire_count: number;
  source_board_id: number | null;
  source_board_title: string | null;
  source_snapshot_id: number | null;
  source_snapshot_name: string | null;
}

export interface NewSnapshot {
  boardId: number;
  name: string;
  authorId: number | null;
  createdAt: string;
  kind: string;
  partCount: number;
  wireCount: number;
  state: Uint8Array;
  thumbnailSvg: string;
  source?: { boardId: number; boardTitle: string; snapshotId: number | null; snapshotName: string | null };
}

const COLUMNS = [
  's.id', 's.board_id', 's.name', 's.author_id', 'u.name as author_name', 's.created_at', 's.kind', 's.part_count', 's.wire_count',
  's.source_board_id', 's.source_board_title', 's.source_snapshot_id', 's.source_snapshot_name',
];

const view = (db: Db) => db('snapshots as s').leftJoin('users as u', 'u.id', 's.author_id').select(COLUMNS);

export async function insertSnapshot(db: Db, s: NewSnapshot): Promise<number> {
  const [row] = await db('snapshots')
    .insert({
      board_id: s.boardId, name: s.name, author_id: s.authorId, created_at: s.createdAt, kind: s.kind,
      part_count: s.partCount, wire_count: s.wireCount, state: Buffer.from(s.state), thumbnail_svg: s.thumbnailSvg,
      source_board_id: s.source?.boardId ?? null, source_board_title: s.source?.boardTitle ?? null,
      source_snapshot_id: s.source?.snapshotId ?? null, source_snapshot_name: s.source?.snapshotName ?? null,
    })
    .returning('id');
  return typeof row === 'object' ? (row as { id: number }).id : (row as number);
}

/** The board's snapshots, newest first. */
export async function listSnapshots(db: Db, boardId: number): Promise<SnapshotRow[]> {
  return view(db).where('s.board_id', boardId).orderBy([{ column: 's.created_at', order: 'desc' }, { column: 's.id', order: 'desc' }]);
}

/** One snapshot of the board (undefined when the id is another board's or missing). */
export async function getSnapshot(db: Db, boardId: number, id: number): Promise<SnapshotRow | undefined> {
  return view(db).where({ 's.board_id': boardId, 's.id': id }).first();
}

export async function getSnapshotState(db: Db, boardId: number, id: number): Promise<Uint8Array | undefined> {
  const row = await db('snapshots').where({ board_id: boardId, id }).first('state');
  return row ? new Uint8Array(row.state as Buffer) : undefined;
}

export async function getSnapshotThumbnail(db: Db, boardId: number, id: number): Promise<string | undefined> {
  const row = await db('snapshots').where({ board_id: boardId, id }).first('thumbnail_svg');
  return row ? (row.thumbnail_svg as string) : undefined;
}

export async function renameSnapshot(db: Db, boardId: number, id: number, name: string): Promise<boolean> {
  return (await db('snapshots').where({ board_id: boardId, id }).update({ name })) > 0;
}

export async function deleteSnapshots(db: Db, boardId: number, ids: number[]): Promise<number> {
  if (!ids.length) return 0;
  return db('snapshots').where('board_id', boardId).whereIn('id', ids).del();
}

/** The board's snapshots of one kind, as id and time (for retention). */
export async function listSnapshotTimes(db: Db, boardId: number, kind: string): Promise<{ id: number; created_at: string }[]> {
  return db('snapshots').where({ board_id: boardId, kind }).select('id', 'created_at').orderBy('created_at', 'desc');
}

/** Total stored bytes of the board's snapshot states (for the benchmark and the panel). */
export async function snapshotStateBytes(db: Db, id: number): Promise<number> {
  const row = await db('snapshots').where({ id }).first(db.raw('length(state) as n'));
  return Number((row as { n?: number } | undefined)?.n ?? 0);
}
