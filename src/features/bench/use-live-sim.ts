import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import type * as Y from 'yjs';
import type { BoardFile } from '../../../shared/board';
import { inputValuesOf, setPartField } from '../../../shared/board';
import { defaultSignals, emptyTrace, signalChoices, type Trace, type SignalChoice } from '../timing';
import { decodeLevels, type Badge, type Level, type LiveCommand, type LivePort, type LiveReport, type LiveUpdate } from '../../../shared/sim';
import { pulsingWireIds } from './pulse-style';
import { applyTrace } from './trace-store';
import { useRoomRun } from './use-room-run';

/** What the hook needs of a board session (the canvas's `BoardSession` fits). */
export interface LiveSimSession {
  board: BoardFile;
  doc: Y.Doc;
  origin: object;
  readOnly: boolean;
}

type Compiled = Extract<LiveUpdate, { type: 'compiled' }>;
/** A state message with the pin keys of the compilation it belongs to. */
type State = Extract<LiveUpdate, { type: 'state' }> & { keys: string[] };

export interface PortValue extends LivePort {
  value: Level;
  /** on a net that does not settle: `value` is only the level of the moment */
  oscillating: boolean;
}

const NO_REPORT: LiveReport = { settled: true, oscillating: [], conflicts: [], undrivenInputs: [], races: [], powerOn: [] };

/**
 * The live simulation of a board, in a Web Worker. With `tryOut` (viewers) input changes stay private
 * to this page and are never sent; otherwise they are document edits everyone sees.
 */
export function useLiveSim(session: LiveSimSession, { tryOut }: { tryOut: boolean }) {
  const worker = useRef<Worker | null>(null);
  const [compiled, setCompiled] = useState<Compiled | null>(null);
  const [state, setState] = useState<State | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [tryOutValues, setTryOutValues] = useState<ReadonlyMap<string, boolean>>(() => new Map());
  // a viewer who steps or runs the clock has left the shared state too: that is a try-out as well
  const [clockTried, setClockTried] = useState(false);
  const [chosen, setChosen] = useState<string[] | null>(null);
  const traceRef = useRef<Trace>(emptyTrace());
  const [traceVersion, setTraceVersion] = useState(0);
  // the worker's copy must never lag a click, so the ref changes at once and the state follows
  const tryOutRef = useRef(tryOutValues);

  // Effects of hooks called above the worker's own effect (the room's run) send before the worker exists:
  // keep those messages and hand them over once it does, or the engine never learns it is in the room.
  const pending = useRef<LiveCommand[]>([]);
  const send = useCallback((msg: LiveCommand) => {
    if (worker.current) worker.current.postMessage(msg);
    else pending.current.push(msg);
  }, []);
  // The room's run: editors write the clock, resets and inputs into the room's record; viewers follow it
  // unless they tried the clock themselves.
  const room = useRoomRun(session.doc, session.origin, { editor: !tryOut, following: !clockTried, send });
  const dueRef = useRef((cycles: number) => { if (!tryOut) room.append([{ kind: 'cycles', n: cycles }]); });
  dueRef.current = (cycles: number) => { if (!tryOut) room.append([{ kind: 'cycles', n: cycles }]); };

  useEffect(() => {
    const w = new Worker(new URL('./sim-worker.ts', import.meta.url), { type: 'module' });
    worker.current = w;
    for (const msg of pending.current.splice(0)) w.postMessage(msg);
    // a state decodes with the keys of the compilation before it, even if React renders in between
    let keys: string[] = [];
    w.onmessage = (e: MessageEvent<LiveUpdate>) => {
      const msg = e.data;
      switch (msg.type) {
        case 'compiled':
          keys = msg.keys;
          setCompiled(msg);
          setError(null);
          break;
        case 'state': {
          const next = applyTrace(traceRef.current, msg);
          traceRef.current = next.trace;
          if (next.changed) setTraceVersion((v) => v + 1);
          setState({ ...msg, keys });
          break;
        }
        case 'due':
          dueRef.current(msg.cycles);
          break;
        case 'error':
          setError(msg.message);
          break;
        default: {
          const never: never = msg;
          throw new Error(`unknown worker message ${JSON.stringify(never)}`);
        }
      }
    };
    w.onerror = (e) => setError(e.message || 'the simulation worker failed');
    return () => {
      w.terminate();
      worker.current = null;
    };
  }, []);

  // The session's board changes at most once a frame; each change is one load message.
  useEffect(() => {
    if (session.board.parts.length === 0 && !session.board.title) return;
    send({ type: 'load', board: session.board, tryOut: [...tryOutRef.current] });
  }, [session.board, send]);

  const available = useMemo<SignalChoice[]>(() => (compiled ? signalChoices(compiled) : []), [compiled]);
  // recorded by default: the inputs that can change and the outputs (no constants); the picker adds any net
  const defaults = useMemo(() => (compiled ? defaultSignals(compiled) : []), [compiled]);
  const signals = chosen ?? defaults;
  const signalsKey = signals.join('\n');
  useEffect(() => {
    if (compiled) send({ type: 'subscribe', signals: signalsKey ? signalsKey.split('\n') : [] });
  }, [signalsKey, compiled, send]);

  const setTry = useCallback((partId: string, _field: 'on' | 'pressed', value: boolean) => {
    const next = new Map(tryOutRef.current).set(partId, value);
    tryOutRef.current = next;
    setTryOutValues(next);
    send({ type: 'set-input', partId, value });
  }, [send]);
  const clearTry = useCallback(() => {
    tryOutRef.current = new Map();
    setTryOutValues(tryOutRef.current);
    send({ type: 'clear-try-out' });
    // back to live: following the room's run again replays its record
    if (clockTried) setClockTried(false);
  }, [send, clockTried]);
  /** A clock command; for a viewer it marks the view as a try-out. */
  const clockAction = useCallback((action: 'run' | 'pause' | 'step') => {
    if (!tryOut) {
      const rate = state?.clock.rate ?? 1;
      room.append([action === 'run' ? { kind: 'run', rate, by: session.doc.clientID } : { kind: action }]);
      return;
    }
    if (action !== 'pause') setClockTried(true);
    send({ type: 'clock', action });
  }, [send, tryOut, room, state?.clock.rate, session.doc]);

  /** Sets an input from the bench: a private try-out for viewers, a document edit for editors. */
  const setInput = useCallback((partId: string, value: boolean) => {
    const part = session.board.parts.find((p) => p.id === partId);
    if (!part || (part.kind !== 'switch' && part.kind !== 'button')) return;
    const field = part.kind === 'switch' ? 'on' : 'pressed';
    if (tryOut) setTry(partId, field, value);
    else setPartField(session.doc, partId, field, value, session.origin);
  }, [session.board, session.doc, session.origin, tryOut, setTry]);

  const levels = useMemo(() => (state ? decodeLevels(state.keys, state.levels) : new Map<string, Level>()), [state]);
  const partBadges = useMemo(() => new Map<string, Badge>((state?.badges ?? []).map(([id, tone, text]) => [id, { tone, text }])), [state]);
  const pulsing = useMemo<ReadonlySet<string>>(() => new Set(state?.pulsing ?? []), [state]);
  const pulsingWires = useMemo(() => pulsingWireIds(session.board.wires, pulsing), [session.board.wires, pulsing]);
  const withValue = (ports: LivePort[] | undefined): PortValue[] => (ports ?? []).map((p) => ({
    ...p, value: state?.values[p.partId] ?? 'X', oscillating: pulsing.has(`${p.partId}.in`) || pulsing.has(`${p.partId}.out`),
  }));
  const outputs = withValue(compiled?.outputs);

  return {
    ready: Boolean(compiled && state),
    error,
    problems: compiled?.problems ?? [],
    family: compiled?.family ?? session.board.family,
    levels,
    pulsing,
    pulsingWires,
    report: state?.report ?? NO_REPORT,
    partBadges,
    inputs: withValue(compiled?.inputs),
    outputs,
    /** lamps and probes on a net that does not settle */
    oscillatingOutputs: outputs.filter((p) => p.oscillating).map((p) => p.partId),
    setInput,
    stats: { time: state?.time ?? 0, events: state?.events ?? 0, lastEvents: state?.lastEvents ?? 0 },
    clock: {
      running: state?.clock.running ?? false,
      rate: state?.clock.rate ?? 1,
      cycles: state?.clock.cycles ?? 0,
      run: () => clockAction('run'),
      pause: () => clockAction('pause'),
      step: () => clockAction('step'),
      setRate: (hz: number) => (tryOut && clockTried ? send({ type: 'rate', hz }) : tryOut ? undefined : room.append([{ kind: 'rate', hz }])),
    },
    resetState: () => {
      if (!tryOut) return room.append([{ kind: 'reset', inputs: inputValuesOf(session.doc) }]);
      setClockTried(true); // a viewer's reset is theirs alone
      send({ type: 'reset-state' });
    },
    /** in the room's run: following it, and which stored states the last edit changed (and why) */
    room: state?.room ?? { following: true, replays: 0, changes: [] },
    /** power on again with the tube heaters cold for `units` time units (shared/sim warm-up) */
    warmUp: (units: number) => send({ type: 'warm-up', units }),
    /** a viewer's private changes: input values, and whether they stepped or ran the clock themselves */
    tryOut: { active: tryOut, values: tryOutValues, clock: clockTried, set: setTry, clear: clearTry },
    timing: {
      trace: traceRef.current,
      version: traceVersion,
      available,
      chosen: signals,
      defaults,
      onChoose: setChosen,
      onClear: () => send({ type: 'clear-trace' }),
      timeUnitNs: compiled?.timeUnitNs ?? 1,
      title: session.board.title,
    },
  };
}

export type LiveSim = ReturnType<typeof useLiveSim>;
