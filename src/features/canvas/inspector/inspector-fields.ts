/**
 * Which of a part's own fields (CONTRACTS §1) the part inspector offers, and with which control.
 * `label` and `rotation` belong to every part and are shown for all; `on` and `pressed` are the
 * live state of a switch or button, worked on the symbol itself, so the inspector leaves them out.
 */
import { MAX_GATE_INPUTS, MIN_GATE_INPUTS, type PartKind } from '../../../../shared/board';

export type InspectorField =
  | { field: 'inputs'; control: 'count'; title: string; min: number; max: number }
  | { field: 'bounce'; control: 'check'; title: string }
  | { field: 'period'; control: 'number'; title: string; unit: string }
  | { field: 'value' | 'init'; control: 'bit'; title: string }
  | { field: 'text'; control: 'text'; title: string };

export type InspectorFieldName = InspectorField['field'];

/** Fields every part has, shown above the kind's own fields. */
export const COMMON_FIELDS = ['label', 'rotation'] as const;
/** Rotations the board file allows, in quarter turns clockwise. */
export const ROTATIONS = [0, 90, 180, 270] as const;

const GATE_INPUTS: InspectorField = { field: 'inputs', control: 'count', title: 'Inputs', min: MIN_GATE_INPUTS, max: MAX_GATE_INPUTS };
const POWER_ON: InspectorField = { field: 'init', control: 'bit', title: 'Power-on Q' };

/** The kind's own fields, in the order the inspector lists them. */
export function inspectorFields(kind: PartKind): InspectorField[] {
  switch (kind) {
    case 'button': return [{ field: 'bounce', control: 'check', title: 'Bounce' }];
    case 'clock': return [{ field: 'period', control: 'number', title: 'Period', unit: 'time units' }];
    case 'const': return [{ field: 'value', control: 'bit', title: 'Value' }];
    case 'and': case 'or': case 'nand': case 'nor': case 'xor': case 'xnor': return [GATE_INPUTS];
    case 'srlatch': case 'dlatch': case 'dff': return [POWER_ON];
    case 'note': return [{ field: 'text', control: 'text', title: 'Text' }];
    case 'switch': case 'lamp': case 'probe': case 'buffer': case 'not': case 'mux2': case 'mux4': return [];
    case 'port': case 'module': return []; // a port's label is its pin name; an instance is edited by opening it
    default: {
      const never: never = kind;
      throw new Error(`unknown part kind ${String(never)}`);
    }
  }
}

/** Fields of the kind that are operated on the symbol (live state), not set in the inspector. */
export function operatedFields(kind: PartKind): string[] {
  if (kind === 'switch') return ['on'];
  if (kind === 'button') return ['pressed'];
  // a port's direction and an instance's module are set by the module edits (make module, place instance)
  if (kind === 'port') return ['dir'];
  if (kind === 'module') return ['module'];
  return [];
}

/** Parses the clock period box: '' means "use the default" (the field is removed). */
export function parsePeriod(text: string): { ok: true; value: number | undefined } | { ok: false; reason: string } {
  const t = text.trim();
  if (t === '') return { ok: true, value: undefined };
  const n = Number(t);
  if (!Number.isFinite(n) || n <= 0) return { ok: false, reason: `period "${t}" must be a number above 0` };
  return { ok: true, value: n };
}
