import { isStorageKind } from '../../board';
import type { Level } from '../levels';
import type { Simulator } from '../simulator';
import type { CompiledPart, Netlist } from '../types';

/** A storage element whose stored level an edit changed, and why, in the trade's words. */
export interface StateChange {
  partId: string;
  name: string;
  was: Level;
  now: Level;
  reason: string;
}

const GATE_KINDS = new Set(['buffer', 'not', 'and', 'or', 'nand', 'nor', 'xor', 'xnor', 'mux2', 'mux4']);

/** True when the part's output can reach one of its own inputs through gates (a gate loop: it stores). */
function inLoop(netlist: Netlist, part: CompiledPart): boolean {
  const own = new Set(part.inputs);
  const seen = new Set<number>();
  const todo = [...part.outputs];
  while (todo.length) {
    const net = todo.pop()!;
    if (own.has(net)) return true;
    if (seen.has(net)) continue;
    seen.add(net);
    for (const r of netlist.nets[net].readers) {
      const p = netlist.partById(r.part);
      if (p && GATE_KINDS.has(p.kind)) todo.push(...p.outputs);
    }
  }
  return false;
}

/** What drives each input pin of the part, and its own settings: equal signatures, same logic. */
function signature(netlist: Netlist, part: CompiledPart): string {
  const { x: _x, y: _y, label: _l, rotation: _r, ...fields } = part.part as unknown as Record<string, unknown>;
  const drivers = part.inputs.map((net, i) => `${part.inputPins[i]}<${netlist.nets[net].drivers.map((d) => `${d.part}.${d.pin}`).sort().join(',')}`);
  return JSON.stringify(fields) + drivers.join(';');
}

/**
 * The storage elements — built-in latches and flip-flops (their Q) and gates in feedback loops (their
 * output) — present before and after an edit whose stored level differs, each with the reason: its own
 * wiring or settings changed, or only the logic feeding it did.
 */
export function stateChanges(before: { netlist: Netlist; sim: Simulator }, after: { netlist: Netlist; sim: Simulator }): StateChange[] {
  const out: StateChange[] = [];
  for (const part of after.netlist.parts) {
    const old = before.netlist.partById(part.id);
    if (!old) continue;
    const storage = isStorageKind(part.kind);
    if (!storage && !(GATE_KINDS.has(part.kind) && inLoop(after.netlist, part))) continue;
    const pin = storage ? 'q' : 'out';
    if (!old.outputPins.includes(pin) || !part.outputPins.includes(pin)) continue;
    const was = before.sim.pinLevel(part.id, pin);
    const now = after.sim.pinLevel(part.id, pin);
    if (was === now) continue;
    const own = signature(before.netlist, old) !== signature(after.netlist, part);
    const what = storage ? `${part.kind === 'dff' ? 'flip-flop' : 'latch'} ${part.name}` : `${part.kind.toUpperCase()} ${part.name} (in a feedback loop)`;
    const reason = own
      ? `${what}: its own wiring or settings changed, so it holds ${now} instead of ${was}`
      : `${what}: the logic feeding it changed, so the room's run gives ${now} instead of ${was}`;
    out.push({ partId: part.id, name: part.name, was, now, reason });
  }
  return out;
}
