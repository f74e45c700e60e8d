/**
 * Bring-up on the server: test vectors and diagnosis of a board file (shared/bringup), and a board's
 * bring-up record — what builders saw on the bench, stored with who and when.
 */
import { BringupError, diagnose, testVectors, type DiagnoseResult, type Observation, type TestVectorsResult } from '../../shared/bringup';
import { handInputs, readOutputs } from '../../shared/bringup';
import { compileBoard } from '../../shared/sim';
import type { BoardFile } from '../../shared/board';
import type { BoardRole } from '../../shared/api';
import { clearObservations, deleteObservation, getObservation, insertObservation, listObservations, type ObservationRow } from '../db/bringup';
import { nowIso, type Db } from '../db/knex';
import { badRequest, forbidden, notFound } from '../lib/errors';
import type { AppEvents } from './events';
import { createPhotosService, type PhotosService } from './photos';

/** An observation as the API gives it. */
export interface ApiObservation {
  id: number;
  in: string;
  out: string;
  expected: string | null;
  step: number | null;
  user: { id: number; name: string } | null;
  createdAt: string;
}

export interface BringupService {
  vectors(board: BoardFile, outputs?: string[]): TestVectorsResult;
  diagnose(board: BoardFile, observed: Observation[], outputs?: string[]): DiagnoseResult;
  list(boardId: number): Promise<ApiObservation[]>;
  record(boardId: number, userId: number, o: { in: string; out: string; step?: number | null }): Promise<ApiObservation>;
  remove(boardId: number, id: number, userId: number, role: BoardRole): Promise<void>;
  clear(boardId: number): Promise<number>;
  /** The board's test vectors, its record and the diagnosis of the record (null while nothing is recorded). */
  summary(boardId: number): Promise<{ vectors: TestVectorsResult; observations: ApiObservation[]; diagnosis: DiagnoseResult | null }>;
}

function toApi(r: ObservationRow): ApiObservation {
  return {
    id: r.id, in: r.vector, out: r.observed, expected: r.expected, step: r.step,
    user: r.user_id === null ? null : { id: r.user_id, name: r.user_name ?? '' }, createdAt: r.created_at,
  };
}

/** BringupError → 400 with the field it names. */
function asBadRequest<T>(fn: () => T): T {
  try {
    return fn();
  } catch (err) {
    if (err instanceof BringupError) throw badRequest('invalid_board', err.message, { [err.field ?? 'board']: err.message });
    throw err;
  }
}

export function createBringupService(deps: { db: Db; readBoardFile(boardId: number): Promise<BoardFile> }): BringupService {
  const { db } = deps;
  const vectorsCache = new Map<number, { key: string; result: TestVectorsResult }>();
  const vectorsOf = async (boardId: number) => {
    const board = await deps.readBoardFile(boardId);
    const key = JSON.stringify({ p: board.parts.map(({ x: _x, y: _y, ...rest }) => rest), w: board.wires, f: board.family });
    const hit = vectorsCache.get(boardId);
    if (hit && hit.key === key) return { board, vectors: hit.result };
    const result = asBadRequest(() => testVectors(board));
    vectorsCache.set(boardId, { key, result });
    return { board, vectors: result };
  };
  const service: BringupService = {
    vectors: (board, outputs) => asBadRequest(() => testVectors(board, { outputs })),
    diagnose: (board, observed, outputs) => asBadRequest(() => diagnose(board, observed, { outputs })),
    list: async (boardId) => (await listObservations(db, boardId)).map(toApi),
    async record(boardId, userId, o) {
      const board = await deps.readBoardFile(boardId);
      const netlist = compileBoard(board);
      const nIn = handInputs(netlist).length;
      const nOut = readOutputs(netlist).length;
      if (!new RegExp(`^[01]{${nIn}}$`).test(o.in)) throw badRequest('invalid_input', `"in" must be ${nIn} characters 0 or 1 (one per switch)`, { in: `${nIn} characters 0 or 1` });
      if (!new RegExp(`^[01?]{${nOut}}$`).test(o.out)) throw badRequest('invalid_input', `"out" must be ${nOut} characters 0, 1 or ? (one per lamp)`, { out: `${nOut} characters 0, 1 or ?` });
      const { vectors } = await vectorsOf(boardId);
      const expected = vectors.sequential ? null : (vectors.vectors.find((v) => v.in === o.in)?.out ?? null);
      const id = await insertObservation(db, { boardId, vector: o.in, observed: o.out, expected, step: o.step ?? null, userId, createdAt: nowIso() });
      return toApi((await getObservation(db, boardId, id))!);
    },
    async remove(boardId, id, userId, role) {
      const row = await getObservation(db, boardId, id);
      if (!row) throw notFound('observation_not_found', 'No such observation on this board');
      if (row.user_id !== userId && role !== 'owner') throw forbidden('role_too_low', 'Only who entered an observation, or the owner, removes it');
      await deleteObservation(db, boardId, id);
    },
    clear: (boardId) => clearObservations(db, boardId),
    async summary(boardId) {
      const { board, vectors } = await vectorsOf(boardId);
      const observations = await service.list(boardId);
      const nIn = vectors.inputs.length;
      const nOut = vectors.outputs.length;
      // observations entered before an edit of the board may no longer fit it: they are listed, not used
      const usable = observations.filter((o) => o.in.length === nIn && o.out.length === nOut)
        .sort((a, b) => (a.step ?? 0) - (b.step ?? 0) || a.id - b.id);
      const diagnosis = usable.length
        ? asBadRequest(() => diagnose(board, usable.map((o) => ({ in: o.in, out: o.out })), { vectors: vectors.vectors.map((v) => v.in) }))
        : null;
      return { vectors, observations, diagnosis };
    },
  };
  return service;
}

/** The bring-up feature's services for the app: the record and the build photos. */
export function createBringupFeature(deps: { db: Db; uploadDir: string; events: AppEvents; readBoardFile(boardId: number): Promise<BoardFile> }): { bringup: BringupService; photos: PhotosService } {
  return { bringup: createBringupService(deps), photos: createPhotosService(deps) };
}
