/**
 * The bring-up of the open board: test vectors of the live board (worked out with shared/bringup in a
 * Web Worker, so they follow every edit without holding up the page), the shared record of what the
 * bench showed (from the server), the diagnosis of that record, and which parts to highlight on the
 * canvas (the chosen suspect, else the best one).
 *
 * Nothing is worked out until it is asked for: once the panel has been on screen (`want`), or once the
 * page is idle when the record holds observations (their suspect is outlined on the canvas).
 */
import { useQuery } from '@tanstack/react-query';
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import type { BoardFile } from '../../../shared/board';
import type { DiagnoseResult, Observation, TestVectorsResult } from '../../../shared/bringup';
import type { BoardRole } from '../../../shared/api';
import { useIdle } from '../../lib/use-idle';
import { observationsQuery } from './api';
import { bringupKey, type BringupStage, type FromWorker, type ToWorker } from './protocol';

/** Wait after an edit before a new job, so that a burst of edits runs one fault simulation. */
export const BRINGUP_DEBOUNCE_MS = 100;

interface Vectors { key: string; result: TestVectorsResult | null; error: string | null }

export function useBringup(boardId: number, role: BoardRole, board: BoardFile) {
  const [seen, setSeen] = useState(false);
  const observations = useQuery(observationsQuery(boardId));
  const idle = useIdle();
  const wanted = seen || (idle && (observations.data?.length ?? 0) > 0);
  // what decides the vectors; positions do not (a drag starts no job)
  const key = useMemo(() => (wanted ? bringupKey(board) : ''), [wanted, board]);
  const observed = useMemo<Observation[]>(() => (observations.data ?? [])
    .slice().sort((a, b) => (a.step ?? 0) - (b.step ?? 0) || a.id - b.id)
    .map((o) => ({ in: o.in, out: o.out })), [observations.data]);
  const jobs = useBringupWorker(key, board, observed);
  const vectorsOf = jobs.vectors;
  const result = vectorsOf?.result ?? null;
  const diagnosis = jobs.diagnosis;

  const [chosen, setChosen] = useState<string | null>(null);
  const [show, setShow] = useState(true);
  const wrong = diagnosis !== null && diagnosis.faultFree.explains < diagnosis.faultFree.of;
  const suspect = diagnosis?.candidates.find((c) => c.fault === chosen) ?? (wrong ? diagnosis?.candidates[0] : undefined);
  const highlight = useMemo<ReadonlySet<string> | undefined>(() => (show && suspect ? new Set(suspect.parts) : undefined), [show, suspect]);
  const want = useCallback(() => setSeen(true), []);
  // the vectors shown are of an earlier version of the board until the job for this one answers
  const stale = key !== '' && vectorsOf?.key !== key;
  const working: BringupStage | null = jobs.failure ? null : stale ? 'vectors' : jobs.stage;
  return {
    boardId, role, board, vectors: result, error: vectorsOf?.error ?? jobs.failure, observations, diagnosis, wrong, suspect,
    chosen, setChosen, show, setShow, highlight,
    /** the panel calls this once it is on screen: the vectors are worked out from then on */
    want,
    /** what the worker is doing for the board as it is now (null: the figures shown are its own) */
    working,
    /** the vectors shown belong to an earlier version of the board */
    stale,
  };
}

export type Bringup = ReturnType<typeof useBringup>;

/**
 * The worker's side of the page: one job per change of the board's logic or of the record (the first at
 * once, later ones after a short wait), only the newest job's answers kept. The worker is started at the
 * first job. A job still working out the vectors of an earlier board when a newer board comes is stopped
 * with its worker (a fault simulation cannot be interrupted midway); other stale jobs are dropped by the
 * worker itself.
 */
function useBringupWorker(key: string, board: BoardFile, observed: Observation[]) {
  const worker = useRef<Worker | null>(null);
  const latest = useRef(0);
  /** the newest job sent: its id, its board's key, and whether it is working out vectors */
  const sent = useRef<{ id: number; key: string; computing: boolean } | null>(null);
  const [vectors, setVectors] = useState<Vectors | null>(null);
  const [diagnosis, setDiagnosis] = useState<DiagnoseResult | null>(null);
  const [stage, setStage] = useState<BringupStage | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const boardRef = useRef(board);
  boardRef.current = board;

  const start = useCallback(() => {
    const w = new Worker(new URL('./bringup-worker.ts', import.meta.url), { type: 'module' });
    w.onmessage = (e: MessageEvent<FromWorker>) => {
      const msg = e.data;
      if (msg.id !== latest.current) return; // a replaced job's late message
      switch (msg.type) {
        case 'working':
          if (sent.current) sent.current.computing = msg.stage === 'vectors';
          setStage(msg.stage);
          break;
        case 'vectors':
          if (sent.current) sent.current.computing = false;
          setVectors({ key: msg.key, result: msg.result, error: msg.error });
          setFailure(null);
          setStage(null);
          break;
        case 'diagnosis':
          setDiagnosis(msg.result);
          setStage(null);
          break;
        case 'cancelled':
          setStage(null);
          break;
        case 'error':
          setFailure(msg.message);
          setStage(null);
          break;
        default: {
          const never: never = msg;
          throw new Error(`unknown worker message ${JSON.stringify(never)}`);
        }
      }
    };
    w.onerror = (e) => { setFailure(e.message || 'the bring-up worker failed'); setStage(null); };
    worker.current = w;
    return w;
  }, []);

  useEffect(() => () => { worker.current?.terminate(); worker.current = null; }, []);

  const hasVectors = vectors !== null;
  useEffect(() => {
    if (key === '') return;
    const t = setTimeout(() => {
      const busy = sent.current;
      // a fault simulation of an earlier board still running: stop it rather than wait for it
      if (busy?.computing && busy.key !== key) {
        worker.current?.terminate();
        worker.current = null;
      }
      const w = worker.current ?? start();
      const id = ++latest.current;
      sent.current = { id, key, computing: false };
      const msg: ToWorker = { type: 'run', id, board: boardRef.current, observed };
      w.postMessage(msg);
    }, hasVectors ? BRINGUP_DEBOUNCE_MS : 0);
    return () => clearTimeout(t);
    // a new job for a new logic or a new record (`hasVectors` only sets the wait, `board` is read when sent)
  }, [key, observed, start]);

  return { vectors, diagnosis, stage, failure };
}
