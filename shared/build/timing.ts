/**
 * Critical path: the longest delay through the combinational logic, from an input or a storage output to
 * a lamp, a probe or a storage input; gate loops (latches of gates) are cut where the search meets them
 * again. Each gate counts one propagation delay t_pd = max(t_PLH, t_PHL); a multiplexer two (its AND-OR
 * levels, common practice, no source). The clock may run no faster than one period per critical path.
 */
import { isInputKind, isOutputKind, isStorageKind } from '../board';
import type { Netlist } from '../sim';

export interface CriticalPath {
  /** part ids along the path, its start and end included */
  parts: string[];
  /** gate delays on it (a multiplexer counts two) */
  levels: number;
  /** typical and worst-case delay, ns */
  delayNs: number;
  maxDelayNs: number;
}

/** Gate delays a part adds to a path. */
export function partLevels(kind: string): number {
  if (kind === 'mux2' || kind === 'mux4') return 2;
  if (isStorageKind(kind)) return 1;
  return isInputKind(kind) || isOutputKind(kind) || kind === 'note' ? 0 : 1;
}

/** The critical path of a netlist for gate delays `tpdNs` (typical) and `tpdMaxNs` (worst case); null without gates. */
export function criticalPath(netlist: Netlist, tpdNs: number, tpdMaxNs: number): CriticalPath | null {
  const parts = netlist.parts;
  const readers = parts.map((p) => [...new Set(p.outputs.flatMap((net) => netlist.nets[net].readers.map((r) => netlist.partById(r.part)!.index)))]);
  const combinational = (i: number) => partLevels(parts[i].kind) > 0 && !isStorageKind(parts[i].kind);
  // longest levels from part i (included) to an end point, and the next part on that path
  const best = new Map<number, { levels: number; next: number }>();
  const onStack = new Set<number>();
  const longest = (i: number): number => {
    const known = best.get(i);
    if (known) return known.levels;
    if (onStack.has(i)) return -Infinity; // a loop: cut here
    onStack.add(i);
    let bestL = -Infinity;
    let next = -1;
    for (const r of readers[i]) {
      const l = combinational(r) ? longest(r) : 0;
      if (l > bestL) { bestL = l; next = r; }
    }
    const levels = Math.max(0, bestL);
    onStack.delete(i);
    const own = combinational(i) ? partLevels(parts[i].kind) : 0;
    best.set(i, { levels: own + levels, next });
    return own + levels;
  };
  let start = -1;
  let total = 0;
  parts.forEach((p, i) => {
    if (!isInputKind(p.kind) && !isStorageKind(p.kind)) return;
    const fromHere = (isStorageKind(p.kind) ? partLevels(p.kind) : 0) + Math.max(0, ...readers[i].map((r) => (combinational(r) ? longest(r) : 0)));
    if (fromHere > total) { total = fromHere; start = i; }
  });
  // a loop of gates with no input feeding it still has gates: start from any combinational part
  if (start < 0) parts.forEach((_, i) => { if (combinational(i) && longest(i) > total) { total = longest(i); start = i; } });
  if (start < 0 || total <= 0) return null;
  const path = [parts[start].id];
  let cur = start;
  if (!combinational(start)) {
    cur = readers[start].filter(combinational).reduce((a, r) => (a < 0 || longest(r) > longest(a) ? r : a), -1);
    if (cur >= 0) path.push(parts[cur].id);
  }
  const seen = new Set([start, cur]);
  while (cur >= 0) {
    const step = best.get(cur);
    if (!step || step.next < 0 || seen.has(step.next)) break;
    seen.add(step.next);
    path.push(parts[step.next].id);
    if (!combinational(step.next)) break;
    cur = step.next;
  }
  return { parts: path, levels: total, delayNs: total * tpdNs, maxDelayNs: total * tpdMaxNs };
}
