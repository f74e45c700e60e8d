/**
 * What a live simulation is told and what it reports, as unions on `type` — plain data, so the page can
 * send them to a worker (the bench) and tests can drive the engine directly.
 */
import type { BoardFile, FamilyId, SimLogEntry } from '../../board';
import type { Level } from '../levels';
import type { StateChange } from './state-changes';

/** Commands to a live simulation. */
export type LiveCommand =
  /** the board changed (at most once a frame); `tryOut` are the viewer's private input values */
  | { type: 'load'; board: BoardFile; tryOut: [partId: string, value: boolean][] }
  /** one input part's value (switch `on`, button `pressed`) as a private try-out, never synced */
  | { type: 'set-input'; partId: string; value: boolean }
  /** forget every try-out value and return to the board's own values */
  | { type: 'clear-try-out' }
  | { type: 'clock'; action: 'run' | 'pause' | 'step' }
  /** simulated clock rate in Hz: full clock cycles per second of wall time while running */
  | { type: 'rate'; hz: number }
  /** stored state back to power-on (storage parts to their init, gate loops to X) */
  | { type: 'reset-state' }
  /** power-on again with the tube heaters cold for `units` time units (gate outputs high), then let them warm */
  | { type: 'warm-up'; units: number }
  /**
   * Join the room's run (decision 005): `me` is this screen's document client id (the screen that
   * appended a `run` drives the clock); `following` false while a viewer tries the clock privately —
   * back to true replays the room's record.
   */
  | { type: 'room'; me: number; following: boolean }
  /** the room's simulation record, whole, in the room's order (shared/board sim-log.ts) */
  | { type: 'room-log'; entries: SimLogEntry[] }
  /** signals (net names) the timing strip records from now on; rows already recorded keep their history */
  | { type: 'subscribe'; signals: string[] }
  /** forget the recording so far and record the same signals from now on */
  | { type: 'clear-trace' };

/** An input or output of the board as the bench lists it. */
export interface LivePort {
  partId: string;
  label: string;
  kind: string;
  /** name of the net it sits on (what the timing strip records) */
  net: string;
}

/** The settle report the bench shows. */
export interface LiveReport {
  settled: boolean;
  oscillating: string[];
  conflicts: string[];
  undrivenInputs: string[];
  /** storage parts that met a race in the last settle (SR released from 11, D changing on the clock edge) */
  races: string[];
  /** nets in gate feedback loops whose power-on level was chosen (low), since the last compile or reset */
  powerOn: string[];
}

/** Messages from a live simulation. */
export type LiveUpdate =
  /** after every (re)compilation: the order of pin keys used by later `levels` arrays, ports, nets */
  | {
      type: 'compiled';
      keys: string[];
      /** the board's own (top-level) switches, buttons, clocks and constants, in file order; none from inside a module instance */
      inputs: LivePort[];
      /** the board's own lamps and probes, in file order */
      outputs: LivePort[];
      nets: string[];
      family: FamilyId;
      timeUnitNs: number;
      problems: string[];
    }
  | {
      type: 'state';
      /** level codes in the order of the last `compiled.keys` (see `encodeLevels`) */
      levels: Uint8Array;
      report: LiveReport;
      /** input and output values by part id */
      values: Record<string, Level>;
      time: number;
      events: number;
      /** events of the last settle */
      lastEvents: number;
      clock: { running: boolean; rate: number; cycles: number };
      /** in a room: following its run (else a private try-out of the clock), and what the last edit did to stored state */
      room?: { following: boolean; replays: number; changes: StateChange[] };
      /** new timing-strip changes since the last state: [signal index, time, level code] triples */
      trace: number[];
      /** rising clock edges since the last state */
      edges: number[];
      /** canvas badges: [partId, tone, sentence] */
      badges: [partId: string, tone: 'conflict' | 'oscillating' | 'undriven' | 'info', text: string][];
      /** `partId.pin` keys of every pin on a net that does not settle (the canvas pulses them) */
      pulsing: string[];
      /** set when the rows changed (another choice of signals, a signal gone): rows that stay keep their history */
      traceReset?: { signals: string[]; at: number; fresh?: boolean };
    }
  /** this screen drives the room's running clock: `cycles` full cycles are due (the page appends them to the record) */
  | { type: 'due'; cycles: number }
  | { type: 'error'; message: string };
