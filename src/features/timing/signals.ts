import { CHANGING_INPUT_KINDS } from '../../../shared/board';
import type { SignalChoice } from './signal-picker';

/** What the strip needs of a compiled board (shared/sim/live `compiled`): its ports and net names. */
export interface SignalSource {
  /** the board's inputs (switches, buttons, clocks, constants) with the net each drives */
  inputs: readonly { net: string; kind: string }[];
  /** the board's outputs (lamps, probes) with the net each reads */
  outputs: readonly { net: string }[];
  /** every net name */
  nets: readonly string[];
}

/** Inputs whose level can change while the board runs; a constant never does. */
const CHANGING_INPUTS = new Set<string>(CHANGING_INPUT_KINDS);

/** Everything the Signals picker offers, each net once: inputs, then outputs, then the other nets. */
export function signalChoices(src: SignalSource): SignalChoice[] {
  const seen = new Set<string>();
  const out: SignalChoice[] = [];
  const addOne = (name: string, group: SignalChoice['group']) => {
    if (seen.has(name)) return;
    seen.add(name);
    out.push({ name, group });
  };
  src.inputs.forEach((p) => addOne(p.net, 'input'));
  src.outputs.forEach((p) => addOne(p.net, 'output'));
  src.nets.forEach((n) => addOne(n, 'net'));
  return out;
}

/**
 * The signals the strip records until someone picks others: the inputs that can change (switches,
 * buttons, clocks) and the outputs, in the picker's order. Constants are left out: a flat line says
 * nothing and pushes the useful rows out of view; any net can still be picked.
 */
export function defaultSignals(src: SignalSource): string[] {
  const changing = new Set(src.inputs.filter((p) => CHANGING_INPUTS.has(p.kind)).map((p) => p.net));
  return signalChoices(src)
    .filter((s) => s.group === 'output' || (s.group === 'input' && changing.has(s.name)))
    .map((s) => s.name);
}
