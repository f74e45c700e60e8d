/** What the parts tray places: a new part of a kind with sensible defaults and a free label. */
import { isGateKind, isInputKind, isOutputKind, type PartKind } from '../../../../shared/board';
import type { Part } from '../../../../shared/board';

export interface TrayChoice {
  kind: PartKind;
  /** gate input count, 2–8 */
  inputs?: number;
  /** value of a constant */
  value?: 0 | 1;
  /** which way a port's signal flows (ports exist only inside a module) */
  dir?: 'in' | 'out';
}

const LETTERS = 'ABCDEFGHIJKLMNOPQRSTUVWXYZ';

/** The first label of the series for `kind` not used by any part: A, B, … for inputs, L1, L2… for lamps. */
export function nextLabel(kind: PartKind, used: ReadonlySet<string>): string | undefined {
  const series = (prefix: string) => { for (let n = 1; ; n++) if (!used.has(`${prefix}${n}`)) return `${prefix}${n}`; };
  switch (kind) {
    case 'switch':
    case 'button': {
      const free = [...LETTERS].find((l) => !used.has(l));
      return free ?? series('IN');
    }
    case 'clock': return used.has('CLK') ? series('CLK') : 'CLK';
    case 'lamp': return series('L');
    case 'probe': return series('P');
    default: return undefined;
  }
}

/** A new part (empty id: the edit function picks one) at a grid point. */
export function newPart(choice: TrayChoice, x: number, y: number, parts: readonly Part[]): Part {
  const used = new Set(parts.filter((p) => isInputKind(p.kind) || isOutputKind(p.kind)).map((p) => p.label ?? ''));
  const label = nextLabel(choice.kind, used);
  const base = { id: '', x, y, ...(label ? { label } : {}) };
  const kind = choice.kind;
  if (isGateKind(kind)) return { ...base, kind, inputs: Math.min(8, Math.max(2, choice.inputs ?? 2)) };
  switch (kind) {
    case 'switch': return { ...base, kind, on: false };
    case 'button': return { ...base, kind, pressed: false };
    case 'clock': return { ...base, kind };
    case 'const': return { ...base, kind, value: choice.value ?? 0 };
    case 'lamp':
    case 'probe':
    case 'buffer':
    case 'not':
    case 'srlatch':
    case 'dlatch':
    case 'dff':
    case 'mux2':
    case 'mux4': return { ...base, kind };
    case 'note': return { ...base, kind, text: 'Note' };
    case 'port': {
      // a port's label is its instance pin: in1, in2… or out1, out2…, unique among the module's ports
      const dir = choice.dir ?? 'in';
      const taken = new Set(parts.filter((p) => p.kind === 'port').map((p) => p.label ?? ''));
      let n = 1;
      while (taken.has(`${dir}${n}`)) n++;
      return { ...base, kind, dir, label: `${dir}${n}` };
    }
    case 'module': throw new Error('an instance is placed from the board\'s modules (placeInstance)');
    default: {
      const never: never = kind;
      throw new Error(`cannot place ${String(never)}`);
    }
  }
}
