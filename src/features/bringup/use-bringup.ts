/**
 * The bring-up of the open board: test vectors of the live board (computed here with shared/bringup, so
 * they follow every edit), the shared record of what the bench showed (from the server), the diagnosis
 * of that record, and which parts to highlight on the canvas (the chosen suspect, else the best one).
 */
import { useQuery } from '@tanstack/react-query';
import { useDeferredValue, useMemo, useState } from 'react';
import type { BoardFile } from '../../../shared/board';
import { BringupError, diagnose, testVectors, type DiagnoseResult, type TestVectorsResult } from '../../../shared/bringup';
import type { BoardRole } from '../../../shared/api';
import { observationsQuery } from './api';

/** What changes the logic of a board (positions do not). */
function logicKey(board: BoardFile): string {
  return JSON.stringify([board.family, board.parts.map(({ x: _x, y: _y, label, ...p }) => ({ ...p, label })), board.wires.map((w) => [w.from, w.to])]);
}

export function useBringup(boardId: number, role: BoardRole, board: BoardFile) {
  // recomputed when the logic changes, not on every move; deferred (a render after the canvas's, with
  // no vectors on the first) so that a large board is drawn before its vectors are worked out
  const key = useDeferredValue(logicKey(board), '');
  const tv = useMemo((): { result: TestVectorsResult | null; error: string | null } => {
    if (key === '') return { result: null, error: null };
    try {
      return { result: testVectors(board), error: null };
    } catch (err) {
      if (err instanceof BringupError) return { result: null, error: err.message };
      throw err;
    }
  }, [key]);
  const observations = useQuery(observationsQuery(boardId));
  const result = tv.result;
  const usable = useMemo(() => (result && observations.data
    ? observations.data.filter((o) => o.in.length === result.inputs.length && o.out.length === result.outputs.length).sort((a, b) => (a.step ?? 0) - (b.step ?? 0) || a.id - b.id)
    : []), [observations.data, result]);
  // same logic key as the vectors
  const diagnosis = useMemo((): DiagnoseResult | null => {
    if (!result || !usable.length) return null;
    try {
      return diagnose(board, usable.map((o) => ({ in: o.in, out: o.out })), { vectors: result.vectors.map((v) => v.in) });
    } catch (err) {
      if (err instanceof BringupError) return null;
      throw err;
    }
  }, [key, usable, result]);
  const [chosen, setChosen] = useState<string | null>(null);
  const [show, setShow] = useState(true);
  const wrong = diagnosis !== null && diagnosis.faultFree.explains < diagnosis.faultFree.of;
  const suspect = diagnosis?.candidates.find((c) => c.fault === chosen) ?? (wrong ? diagnosis?.candidates[0] : undefined);
  const highlight = useMemo<ReadonlySet<string> | undefined>(() => (show && suspect ? new Set(suspect.parts) : undefined), [show, suspect]);
  return {
    boardId, role, board, vectors: result, error: tv.error, observations, diagnosis, wrong, suspect,
    chosen, setChosen, show, setShow, highlight,
  };
}

export type Bringup = ReturnType<typeof useBringup>;
