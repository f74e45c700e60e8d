import type { BoardFile } from '../../../shared/board';
import { circuitKey } from '../../lib/circuit-key';
import type { DiagnoseResult, Observation, TestVectorsResult } from '../../../shared/bringup';

/**
 * One bring-up job for the worker: the board's test vectors, then the diagnosis of the shared record
 * (`observed`, in the record's order; the worker keeps those that fit the vectors' inputs and outputs).
 */
export interface BringupJob {
  type: 'run';
  id: number;
  board: BoardFile;
  observed: Observation[];
}

export type ToWorker =
  | BringupJob
  /** drop job `id`: before it starts, or between its vectors and its diagnosis */
  | { type: 'cancel'; id: number };

/** What a job is doing: working out the test vectors (a fault simulation of the board), or ranking suspects. */
export type BringupStage = 'vectors' | 'diagnosis';

export type FromWorker =
  /** a stage that takes a while has begun (a cached stage posts its result without this) */
  | { type: 'working'; id: number; stage: BringupStage }
  /** the vectors of the job's board; `error` when the board cannot have any (a BringupError's message) */
  | { type: 'vectors'; id: number; key: string; result: TestVectorsResult | null; error: string | null }
  /** the job's last message: the diagnosis of its record, null when nothing in it fits the vectors */
  | { type: 'diagnosis'; id: number; result: DiagnoseResult | null }
  /** the job was dropped: a newer one came first, or it was cancelled */
  | { type: 'cancelled'; id: number }
  /** an unexpected failure (a bug, not a board problem) */
  | { type: 'error'; id: number; message: string };

/** What decides a board's test vectors and diagnosis (positions do not; module contents do). */
export const bringupKey = circuitKey;
