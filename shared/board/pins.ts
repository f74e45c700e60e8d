/**
 * Pin references (`part.pin` in wires, CONTRACTS §1) and the pin list of a placed part: the one place
 * that reads a part's `inputs` count and the one place that splits or writes a reference.
 */
import { pinsOf, type PartKind, type PinSet } from './kinds';

/** A pin reference split into its two halves. */
export interface PinRefParts {
  part: string;
  pin: string;
}

/** Writes a pin reference: `pinRef('g1', 'out')` is `g1.out`. */
export function pinRef(part: string, pin: string): string {
  return `${part}.${pin}`;
}

/** Splits `part.pin` into its two halves (the part id may itself contain dots; the pin is after the last). */
export function splitPinRef(ref: string): PinRefParts | null {
  const dot = ref.lastIndexOf('.');
  if (dot <= 0 || dot === ref.length - 1) return null;
  return { part: ref.slice(0, dot), pin: ref.slice(dot + 1) };
}

/** The pins of each module's instances, module id → pins (see `modulePinTable`). */
export type ModulePins = ReadonlyMap<string, PinSet>;

/** What the pin list of a part is read from. */
export interface PinnedPart {
  kind: PartKind;
  inputs?: unknown;
  /** a port's direction */
  dir?: unknown;
  /** an instance's module id */
  module?: unknown;
}

const NO_PINS: PinSet = { inputs: [], outputs: [] };

/**
 * Pins of a placed part: its kind's pins, with a gate's `inputs` count (2 when absent or not a number,
 * as the schema's default), a port's by its `dir`, an instance's from `modules` (none without it, or
 * when its module is missing).
 */
export function pinsOfPart(part: PinnedPart, modules?: ModulePins): PinSet {
  if (part.kind === 'port') return part.dir === 'out' ? { inputs: ['in'], outputs: [] } : { inputs: [], outputs: ['out'] };
  if (part.kind === 'module') return (typeof part.module === 'string' && modules?.get(part.module)) || NO_PINS;
  return pinsOf(part.kind, typeof part.inputs === 'number' ? part.inputs : 2);
}

/** All pins (inputs then outputs) of a part. */
export function allPins(part: PinnedPart, modules?: ModulePins): string[] {
  const p = pinsOfPart(part, modules);
  return [...p.inputs, ...p.outputs];
}

/** What a pin of a part is: 'in' (read by the part), 'out' (driven by it), or null when it has no such pin. */
export function pinSide(part: PinnedPart, pin: string, modules?: ModulePins): 'in' | 'out' | null {
  const p = pinsOfPart(part, modules);
  if (p.inputs.includes(pin)) return 'in';
  if (p.outputs.includes(pin)) return 'out';
  return null;
}
