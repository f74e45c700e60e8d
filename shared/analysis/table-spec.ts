import { isOutputKind } from '../board';
import type { CompiledPart, Netlist } from '../sim';

/** Most inputs a truth table may have (2^20 = 1,048,576 rows). */
export const MAX_TABLE_INPUTS = 20;

/** A bad analysis request: the message names the problem, `fields` the offending labels or ids. */
export class AnalysisError extends Error {
  constructor(message: string, readonly fields: Record<string, string> = {}) {
    super(message);
    this.name = 'AnalysisError';
  }
}

/** Which inputs are enumerated and which outputs are read. */
export interface TableSpec {
  inputs: CompiledPart[];
  outputs: CompiledPart[];
}

/**
 * Resolves input and output names (labels, or ids of unlabelled parts). Defaults: switches and buttons
 * in file order; lamps and probes in file order.
 */
export function resolveSpec(netlist: Netlist, inputs?: string[], outputs?: string[]): TableSpec {
  const byName = (list: CompiledPart[], name: string) => list.find((p) => p.name === name) ?? list.find((p) => p.id === name);
  const pick = (names: string[], list: CompiledPart[], what: 'inputs' | 'outputs'): CompiledPart[] => {
    const seen = new Set<string>();
    return names.map((name) => {
      const p = byName(list, name);
      if (!p) throw new AnalysisError(`${what === 'inputs' ? 'input' : 'output'} "${name}" is not ${what === 'inputs' ? 'a switch, button, clock or constant' : 'a lamp or probe'} on this board`, { [what]: name });
      if (seen.has(p.id)) throw new AnalysisError(`${what === 'inputs' ? 'input' : 'output'} "${name}" is listed twice`, { [what]: name });
      seen.add(p.id);
      return p;
    });
  };
  const ins = inputs ? pick(inputs, netlist.inputs, 'inputs') : netlist.inputs.filter((p) => p.kind === 'switch' || p.kind === 'button');
  const outs = outputs ? pick(outputs, netlist.outputs, 'outputs') : netlist.outputs.filter((p) => isOutputKind(p.kind));
  if (ins.length > MAX_TABLE_INPUTS) {
    throw new AnalysisError(`${ins.length} inputs: a truth table is limited to ${MAX_TABLE_INPUTS} inputs (about a million rows); choose fewer with inputs`, { inputs: `${ins.length} > ${MAX_TABLE_INPUTS}` });
  }
  return { inputs: ins, outputs: outs };
}
