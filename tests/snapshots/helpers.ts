/** Snapshot calls over real HTTP for the snapshot tests (accounts and clients come from tests/collab/helpers). */
import type { ApiSnapshot } from '../../shared/api';
import type { BoardFile } from '../../shared/board';
import type { TestServer } from '../helpers/test-app';
import { api, type User } from '../collab/helpers';

export async function takeSnapshot(server: TestServer, user: User, boardId: number, name: string): Promise<ApiSnapshot> {
  const res = await api(server, 'POST', `/api/boards/${boardId}/snapshots`, user.cookie, { name });
  if (res.status !== 201) throw new Error(`take answered ${res.status}: ${await res.text()}`);
  return ((await res.json()) as { snapshot: ApiSnapshot }).snapshot;
}

export async function snapshotBoard(server: TestServer, user: User, boardId: number, id: number): Promise<BoardFile> {
  const res = await api(server, 'GET', `/api/boards/${boardId}/snapshots/${id}`, user.cookie);
  if (res.status !== 200) throw new Error(`preview answered ${res.status}: ${await res.text()}`);
  return ((await res.json()) as { board: BoardFile }).board;
}

export async function listSnapshots(server: TestServer, user: User, boardId: number): Promise<ApiSnapshot[]> {
  const res = await api(server, 'GET', `/api/boards/${boardId}/snapshots`, user.cookie);
  if (res.status !== 200) throw new Error(`list answered ${res.status}: ${await res.text()}`);
  return ((await res.json()) as { snapshots: ApiSnapshot[] }).snapshots;
}

export async function restore(server: TestServer, user: User, boardId: number, id: number): Promise<{ restored: ApiSnapshot; beforeRestore: ApiSnapshot }> {
  const res = await api(server, 'POST', `/api/boards/${boardId}/snapshots/${id}/restore`, user.cookie);
  if (res.status !== 200) throw new Error(`restore answered ${res.status}: ${await res.text()}`);
  return (await res.json()) as { restored: ApiSnapshot; beforeRestore: ApiSnapshot };
}

/** Two board files as one canonical string (for equality while polling). */
export const same = (a: BoardFile, b: BoardFile) => JSON.stringify(a) === JSON.stringify(b);
