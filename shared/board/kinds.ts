/**
 * Part kinds of the board file (CONTRACTS §1) and the pins each kind has.
 * This table is the single description of pins used by the schema, the simulator,
 * the canvas handles and the Verilog export.
 */
export const PART_KINDS = [
  'switch', 'button', 'clock', 'const',
  'lamp', 'probe',
  'buffer', 'not', 'and', 'or', 'nand', 'nor', 'xor', 'xnor',
  'srlatch', 'dlatch', 'dff',
  'mux2', 'mux4',
  'note',
  'port', 'module',
] as const;
export type PartKind = (typeof PART_KINDS)[number];

export const GATE_KINDS = ['and', 'or', 'nand', 'nor', 'xor', 'xnor'] as const;
export type GateKind = (typeof GATE_KINDS)[number];
export const INPUT_KINDS = ['switch', 'button', 'clock', 'const'] as const;
/** The inputs someone operates or that change on their own while the board runs (every input but a constant). */
export const CHANGING_INPUT_KINDS = ['switch', 'button', 'clock'] as const;
export const OUTPUT_KINDS = ['lamp', 'probe'] as const;
export const STORAGE_KINDS = ['srlatch', 'dlatch', 'dff'] as const;

export const MIN_GATE_INPUTS = 2;
export const MAX_GATE_INPUTS = 8;

export function isGateKind(kind: string): kind is GateKind {
  return (GATE_KINDS as readonly string[]).includes(kind);
}
export function isInputKind(kind: string): kind is (typeof INPUT_KINDS)[number] {
  return (INPUT_KINDS as readonly string[]).includes(kind);
}
export function isOutputKind(kind: string): kind is (typeof OUTPUT_KINDS)[number] {
  return (OUTPUT_KINDS as readonly string[]).includes(kind);
}
export function isStorageKind(kind: string): kind is (typeof STORAGE_KINDS)[number] {
  return (STORAGE_KINDS as readonly string[]).includes(kind);
}

export interface PinSet {
  /** pins the part reads */
  inputs: string[];
  /** pins the part drives */
  outputs: string[];
}

/** Pins of a part, given its kind and (for gates) its input count. */
export function pinsOf(kind: PartKind, inputs = 2): PinSet {
  switch (kind) {
    case 'switch':
    case 'button': // a changeover contact: outn is the normally-closed throw
      return { inputs: [], outputs: ['out', 'outn'] };
    case 'clock':
    case 'const':
      return { inputs: [], outputs: ['out'] };
    case 'lamp':
    case 'probe':
      return { inputs: ['in'], outputs: [] };
    case 'buffer':
    case 'not':
      return { inputs: ['in0'], outputs: ['out'] };
    case 'and':
    case 'or':
    case 'nand':
    case 'nor':
    case 'xor':
    case 'xnor':
      return { inputs: Array.from({ length: inputs }, (_, i) => `in${i}`), outputs: ['out'] };
    case 'srlatch':
      return { inputs: ['s', 'r'], outputs: ['q', 'qn'] };
    case 'dlatch':
      return { inputs: ['d', 'en'], outputs: ['q', 'qn'] };
    case 'dff':
      return { inputs: ['d', 'clk'], outputs: ['q', 'qn'] };
    case 'mux2':
      return { inputs: ['sel', 'd0', 'd1'], outputs: ['out'] };
    case 'mux4':
      return { inputs: ['sel0', 'sel1', 'd0', 'd1', 'd2', 'd3'], outputs: ['out'] };
    case 'note':
      return { inputs: [], outputs: [] };
    case 'port': // a port `in` (the default here); pinsOfPart reads `dir`
      return { inputs: [], outputs: ['out'] };
    case 'module': // an instance: its pins are its module's port labels (pinsOfPart with the board's modules)
      return { inputs: [], outputs: [] };
    default: {
      const never: never = kind;
      throw new Error(`unknown part kind ${String(never)}`);
    }
  }
}

/** Human names of the kinds, as the parts tray shows them. */
export const KIND_TITLES: Record<PartKind, string> = {
  switch: 'Toggle switch', button: 'Push button', clock: 'Clock', const: 'Constant',
  lamp: 'Lamp', probe: 'Probe',
  buffer: 'Buffer', not: 'NOT (inverter)', and: 'AND', or: 'OR', nand: 'NAND', nor: 'NOR', xor: 'XOR', xnor: 'XNOR',
  srlatch: 'SR latch', dlatch: 'D latch', dff: 'D flip-flop (rising edge)',
  mux2: '2:1 multiplexer', mux4: '4:1 multiplexer',
  note: 'Text note',
  port: 'Port', module: 'Module instance',
};
