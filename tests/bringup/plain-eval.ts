/**
 * An independent reference for the bring-up tests: evaluates a combinational board file pin by pin,
 * straight from its wires, with one pin optionally stuck — no levelising, no bit-parallel words, nothing
 * shared with shared/bringup. Slow and plain on purpose.
 */
import type { BoardFile } from '../../shared/board';

export interface PlainFault { part: string; pin: string; value: 0 | 1 }

export class PlainBoard {
  private readonly parent = new Map<string, string>();
  private readonly parts: Map<string, BoardFile['parts'][number]>;
  private readonly driverOf = new Map<string, string>();
  readonly inputIds: string[];
  readonly outputIds: string[];

  constructor(readonly board: BoardFile) {
    this.parts = new Map(board.parts.map((p) => [p.id, p]));
    for (const w of board.wires) this.union(w.from, w.to);
    this.frozen = true;
    const outPins: Record<string, string[]> = { switch: ['out', 'outn'], button: ['out', 'outn'], const: ['out'], clock: ['out'] };
    for (const p of board.parts) {
      const outs = outPins[p.kind] ?? (['lamp', 'probe', 'note'].includes(p.kind) ? [] : ['out']);
      for (const pin of outs) this.driverOf.set(this.find(`${p.id}.${pin}`), `${p.id}.${pin}`);
    }
    this.inputIds = board.parts.filter((p) => p.kind === 'switch' || p.kind === 'button').map((p) => p.id);
    this.outputIds = board.parts.filter((p) => p.kind === 'lamp' || p.kind === 'probe').map((p) => p.id);
  }

  private readonly roots = new Map<string, string>();

  private find(x: string): string {
    const hit = this.roots.get(x);
    if (hit !== undefined) return hit;
    const start = x;
    while (this.parent.has(x) && this.parent.get(x) !== x) x = this.parent.get(x)!;
    if (this.frozen) this.roots.set(start, x);
    return x;
  }

  private frozen = false;

  private union(a: string, b: string): void {
    const ra = this.find(a); const rb = this.find(b);
    if (ra !== rb) this.parent.set(ra, rb);
    if (!this.parent.has(rb)) this.parent.set(rb, rb);
  }

  /** Lamp values (in file order) for the switch settings (in file order), with an optional stuck pin. */
  run(settings: number[], fault?: PlainFault): number[] {
    const memo = new Map<string, number>();
    const stuck = (ref: string) => (fault && `${fault.part}.${fault.pin}` === ref ? fault.value : undefined);
    const inputPin = (part: string, pin: string): number => {
      const ref = `${part}.${pin}`;
      const s = stuck(ref);
      if (s !== undefined) return s;
      const d = this.driverOf.get(this.find(ref));
      if (!d) throw new Error(`${ref} is not driven`);
      return outputPin(d);
    };
    const outputPin = (ref: string): number => {
      const s = stuck(ref);
      if (s !== undefined) return s;
      if (memo.has(ref)) return memo.get(ref)!;
      const [id, pin] = ref.split('.');
      const p = this.parts.get(id)!;
      const ins = (n: number) => Array.from({ length: n }, (_, i) => inputPin(id, `in${i}`));
      const n = 'inputs' in p && typeof p.inputs === 'number' ? p.inputs : 2;
      let v: number;
      switch (p.kind) {
        case 'switch': case 'button': { const on = settings[this.inputIds.indexOf(id)]; v = pin === 'out' ? on : 1 - on; break; }
        case 'const': v = p.value; break;
        case 'buffer': v = inputPin(id, 'in0'); break;
        case 'not': v = 1 - inputPin(id, 'in0'); break;
        case 'and': v = ins(n).every((x) => x === 1) ? 1 : 0; break;
        case 'nand': v = ins(n).every((x) => x === 1) ? 0 : 1; break;
        case 'or': v = ins(n).some((x) => x === 1) ? 1 : 0; break;
        case 'nor': v = ins(n).some((x) => x === 1) ? 0 : 1; break;
        case 'xor': v = ins(n).reduce((a, b) => a ^ b, 0); break;
        case 'xnor': v = 1 - ins(n).reduce((a, b) => a ^ b, 0); break;
        case 'mux2': v = inputPin(id, 'sel') ? inputPin(id, 'd1') : inputPin(id, 'd0'); break;
        case 'mux4': v = inputPin(id, `d${inputPin(id, 'sel0') + 2 * inputPin(id, 'sel1')}`); break;
        default: throw new Error(`plain evaluator: no ${p.kind}`);
      }
      memo.set(ref, v);
      return v;
    };
    return this.outputIds.map((id) => inputPin(id, 'in'));
  }
}

/** Settings string ('0101') → numbers. */
export const settingsOf = (s: string) => Array.from(s, Number);

/** A fault name `"g2.out sa0"` → its parts. */
export function parseFault(name: string): PlainFault {
  const m = /^(.+)\.([^.\s]+) sa([01])$/.exec(name);
  if (!m) throw new Error(`not a fault name: ${name}`);
  return { part: m[1], pin: m[2], value: Number(m[3]) as 0 | 1 };
}
