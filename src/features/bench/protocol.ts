import type { BoardFile, FamilyId } from '../../../shared/board';
import type { Level } from '../../../shared/sim/levels';

/** Messages from the page to the simulation worker, a union on `type`. */
export type ToWorker =
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
  /** signals (net names) the timing strip records from now on; rows already recorded keep their history */
  | { type: 'subscribe'; signals: string[] }
  /** forget the recording so far and record the same signals from now on */
  | { type: 'clear-trace' };

/** An input or output of the board as the bench lists it. */
export interface PortInfo {
  partId: string;
  label: string;
  kind: string;
  /** name of the net it sits on (what the timing strip records) */
  net: string;
}

/** The settle report the bench shows. */
export interface BenchReport {
  settled: boolean;
  oscillating: string[];
  conflicts: string[];
  undrivenInputs: string[];
  /** storage parts that met a race in the last settle (SR released from 11, D changing on the clock edge) */
  races: string[];
  /** nets in gate feedback loops whose power-on level was chosen (low), since the last compile or reset */
  powerOn: string[];
}

/** Messages from the worker to the page. */
export type FromWorker =
  /** after every (re)compilation: the order of pin keys used by later `levels` arrays, ports, nets */
  | {
      type: 'compiled';
      keys: string[];
      inputs: PortInfo[];
      outputs: PortInfo[];
      nets: string[];
      family: FamilyId;
      timeUnitNs: number;
      problems: string[];
    }
  | {
      type: 'state';
      /** level codes in the order of the last `compiled.keys` (see `encodeLevels`) */
      levels: Uint8Array;
      report: BenchReport;
      /** input and output values by part id */
      values: Record<string, Level>;
      time: number;
      events: number;
      /** events of the last settle */
      lastEvents: number;
      clock: { running: boolean; rate: number; cycles: number };
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
  | { type: 'error'; message: string };

const CODES: readonly Level[] = ['0', '1', 'X', 'Z'];

/** Level → its one-byte code (0, 1, X, Z → 0…3). */
export function levelCode(level: Level): number {
  switch (level) {
    case '0':
      return 0;
    case '1':
      return 1;
    case 'X':
      return 2;
    case 'Z':
      return 3;
    default: {
      const never: never = level;
      throw new Error(`unknown level ${String(never)}`);
    }
  }
}

/** Code → level; anything out of range reads as unknown. */
export function codeLevel(code: number): Level {
  return CODES[code] ?? 'X';
}

/**
 * Packs pin levels into one byte per pin in the order of `keys`, so a state message is a small
 * transferable array rather than a map of strings. Pins missing from `levels` read as Z (undriven).
 */
export function encodeLevels(keys: readonly string[], levels: ReadonlyMap<string, Level>): Uint8Array {
  const out = new Uint8Array(keys.length);
  for (let i = 0; i < keys.length; i++) out[i] = levelCode(levels.get(keys[i]) ?? 'Z');
  return out;
}

/** Unpacks `encodeLevels` output back into a `"partId.pin" → Level` map. */
export function decodeLevels(keys: readonly string[], codes: Uint8Array): Map<string, Level> {
  const out = new Map<string, Level>();
  const n = Math.min(keys.length, codes.length);
  for (let i = 0; i < n; i++) out.set(keys[i], codeLevel(codes[i]));
  return out;
}
