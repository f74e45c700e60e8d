import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import type { BoardFile } from '../../../shared/board';
import type { AnalysisResult, FromWorker, ToWorker } from './protocol';

/** The user's choices; `undefined` inputs/outputs mean the defaults (switches and buttons; lamps and probes). */
export interface AnalysisChoices {
  inputs?: string[];
  outputs?: string[];
  select: string[];
  dontCares: Record<string, number[]>;
}

export type AnalysisStatus = 'waiting' | 'running' | 'done' | 'error' | 'cancelled';

/** Wait after the last edit before recomputing, so a drag or a burst of typing runs one analysis. */
export const ANALYSIS_DEBOUNCE_MS = 100;

/**
 * The part of a board that decides its table: positions, rotations and notes do not, nor the
 * positions of the switches and buttons being enumerated (`chosen` labels; undefined = the default,
 * every switch and button) — flipping one of those must not recompute a million rows.
 */
export function logicKey(board: BoardFile, chosen?: readonly string[]): string {
  const enumerated = (p: BoardFile['parts'][number]) =>
    (p.kind === 'switch' || p.kind === 'button') && (chosen === undefined || chosen.includes(p.label || p.id));
  const parts = board.parts.filter((p) => p.kind !== 'note').map((p) => {
    const { x: _x, y: _y, rotation: _r, ...rest } = p;
    if (enumerated(p)) {
      const { on: _on, pressed: _pressed, ...fixed } = rest as typeof rest & { on?: boolean; pressed?: boolean };
      return fixed;
    }
    return rest;
  });
  return JSON.stringify([board.family, parts, board.wires.map((w) => [w.from, w.to])]);
}

/**
 * Live analysis of a board in a Web Worker: recomputes (debounced) when the board's logic or the
 * choices change; reports progress; can be cancelled. `highlight` is the fan-in cone of the focused output.
 * Nothing runs (no worker, no table) until the panel has been on screen (`want`).
 */
export function useAnalysis(board: BoardFile) {
  const [seen, setSeen] = useState(false);
  const worker = useRef<Worker | null>(null);
  const latest = useRef(0);
  const [choices, setChoices] = useState<AnalysisChoices>({ select: [], dontCares: {} });
  const [status, setStatus] = useState<AnalysisStatus>('waiting');
  const [progress, setProgress] = useState<{ done: number; total: number } | null>(null);
  const [result, setResult] = useState<AnalysisResult | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [focus, setFocus] = useState<string | null>(null);
  const [runCount, setRunCount] = useState(0);
  const key = useMemo(() => (seen ? logicKey(board, choices.inputs) : ''), [seen, board, choices.inputs]);
  const boardRef = useRef(board);
  boardRef.current = board;

  useEffect(() => {
    if (!seen) return;
    const w = new Worker(new URL('./analysis-worker.ts', import.meta.url), { type: 'module' });
    worker.current = w;
    w.onmessage = (e: MessageEvent<FromWorker>) => {
      const msg = e.data;
      if (msg.id !== latest.current) return; // an older run's late message
      switch (msg.type) {
        case 'progress': setProgress({ done: msg.done, total: msg.total }); break;
        case 'result': setResult(msg.result); setStatus('done'); setError(null); setProgress(null); break;
        case 'error': setStatus(msg.cancelled ? 'cancelled' : 'error'); setError(msg.cancelled ? null : msg.message); setProgress(null); break;
        default: {
          const never: never = msg;
          throw new Error(`unknown worker message ${JSON.stringify(never)}`);
        }
      }
    };
    w.onerror = (e) => { setStatus('error'); setError(e.message || 'the analysis worker failed'); };
    return () => { w.terminate(); worker.current = null; };
  }, [seen]);

  useEffect(() => {
    if (key === '') return;
    const t = setTimeout(() => {
      const id = ++latest.current;
      setStatus('running');
      setProgress(null);
      const msg: ToWorker = { type: 'analyze', id, request: { board: boardRef.current, ...choices } };
      worker.current?.postMessage(msg);
    }, ANALYSIS_DEBOUNCE_MS);
    return () => clearTimeout(t);
  }, [key, choices, runCount]);

  const cancel = useCallback(() => worker.current?.postMessage({ type: 'cancel', id: latest.current } satisfies ToWorker), []);
  const rerun = useCallback(() => setRunCount((n) => n + 1), []);
  // a new set of inputs renumbers the rows, so row marks no longer apply
  const setInputs = useCallback((inputs: string[]) => setChoices((c) => ({ ...c, inputs, select: c.select.filter((s) => inputs.includes(s)), dontCares: {} })), []);
  // marks of an output no longer analysed would be refused (one don't-care rule): they go with it
  const setOutputs = useCallback((outputs: string[]) => setChoices((c) => ({
    ...c, outputs, dontCares: Object.fromEntries(Object.entries(c.dontCares).filter(([o]) => outputs.includes(o))),
  })), []);
  const setSelect = useCallback((select: string[]) => setChoices((c) => ({ ...c, select })), []);
  const toggleDontCare = useCallback((output: string, row: number) => setChoices((c) => {
    const rows = new Set(c.dontCares[output] ?? []);
    if (rows.has(row)) rows.delete(row); else rows.add(row);
    return { ...c, dontCares: { ...c.dontCares, [output]: [...rows].sort((a, b) => a - b) } };
  }), []);
  const clearDontCares = useCallback(() => setChoices((c) => ({ ...c, dontCares: {} })), []);

  const highlight = useMemo<ReadonlySet<string> | undefined>(() => {
    if (!focus || !result?.cones[focus]) return undefined;
    return new Set(result.cones[focus]);
  }, [focus, result]);

  const want = useCallback(() => setSeen(true), []);
  return {
    board, choices, status, progress, result, error, focus, highlight,
    setFocus, cancel, rerun, setInputs, setOutputs, setSelect, toggleDontCare, clearDontCares,
    /** the panel calls this once it is on screen: the analysis runs from then on */
    want,
  };
}

export type Analysis = ReturnType<typeof useAnalysis>;
