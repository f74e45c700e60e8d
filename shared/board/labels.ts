/**
 * The label rule of CONTRACTS §1: inputs (switch, button, clock, const) and outputs (lamp, probe) are
 * named by their labels — truth-table columns, expression names, Verilog ports — so those labels are
 * identifiers, unique among the board's inputs and outputs. The file check, the edits, the canvas and
 * the command line all ask here and show the same words.
 */
import { isInputKind, isOutputKind } from './kinds';

/** Labels of inputs and outputs must be identifiers (they become Verilog ports and expression names). */
export const LABEL_RE = /^[A-Za-z_][A-Za-z0-9_]*$/;

/** Longest label any part may carry. */
export const LABEL_MAX_LENGTH = 64;

/** True for the kinds named by their labels: inputs and outputs. */
export function isNamedKind(kind: string): boolean {
  return isInputKind(kind) || isOutputKind(kind);
}

/**
 * Labels already naming an input or output, label → id of the part that has it (the first in `parts`
 * order when a file repeats one), leaving out the part `exceptId`.
 */
export function namedLabels(parts: Iterable<{ id: string; kind: string; label?: unknown }>, exceptId?: string): Map<string, string> {
  const taken = new Map<string, string>();
  for (const p of parts) {
    if (p.id === exceptId || typeof p.label !== 'string' || p.label === '' || !isNamedKind(p.kind)) continue;
    if (!taken.has(p.label)) taken.set(p.label, p.id);
  }
  return taken;
}

/**
 * Why `label` cannot name an input or output, or null when it can. `taken` maps the labels of the
 * other inputs and outputs to their part ids (see `namedLabels`).
 */
export function labelProblem(label: string, taken: ReadonlyMap<string, string>): string | null {
  if (!LABEL_RE.test(label)) return `label "${label}" must be a letter or _ followed by letters, digits or _`;
  const other = taken.get(label);
  return other === undefined ? null : `label "${label}" is already on ${other}`;
}
