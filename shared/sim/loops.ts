/**
 * Feedback loops made of gates: the strongly connected components of the graph net → gate reading it →
 * net that gate drives (Tarjan's algorithm, iterative, over typed arrays). Only combinational parts
 * (gates and multiplexers) make edges: built-in storage parts power on at a known state and so break a
 * loop, and a net with two or more drivers always reads X, so it is a source of X, not part of a loop.
 * The simulator uses the loops for its power-on resolution (docs/decisions/002-simulation-model.md).
 */
import type { SimLayout } from './layout';

/**
 * The non-trivial strongly connected components of the gate graph. A loop's nets are ordered by their
 * driver's place in the file (the first part listed comes first), and the loops by their first net.
 */
export interface FeedbackLoops {
  /** number of loops */
  count: number;
  /** nets of loop k, in driver file order: loopNet[loopStart[k] … loopStart[k + 1]) */
  loopStart: Int32Array;
  loopNet: Int32Array;
  /** nets read by the loop's gates from outside the loop (each once): entryNet[entryStart[k] … entryStart[k + 1]) */
  entryStart: Int32Array;
  entryNet: Int32Array;
  /**
   * the loops whose resolution a net's level can change (those it belongs to or enters), in loop order:
   * netLoop[netLoopStart[n] … netLoopStart[n + 1]); the simulator re-checks only these after a change
   */
  netLoopStart: Int32Array;
  netLoop: Int32Array;
}

/** net → net adjacency (CSR) through the combinational parts marked in `gate`. */
function gateGraph(lay: SimLayout, gate: Uint8Array, nNets: number): { start: Int32Array; to: Int32Array } {
  const start = new Int32Array(nNets + 1);
  const usable = (net: number) => lay.netDrivers[net] >= 0;
  const each = (visit: (from: number, to: number) => void) => {
    for (let net = 0; net < nNets; net++) {
      if (!usable(net)) continue;
      for (let k = lay.fanStart[net]; k < lay.fanStart[net + 1]; k++) {
        const p = lay.fanPart[k];
        if (!gate[p]) continue;
        for (let s = lay.slotStart[p]; s < lay.slotStart[p + 1]; s++) if (lay.netDrivers[lay.slotNet[s]] === s) visit(net, lay.slotNet[s]);
      }
    }
  };
  each((from) => { start[from + 1]++; });
  for (let i = 0; i < nNets; i++) start[i + 1] += start[i];
  const to = new Int32Array(start[nNets]);
  const fill = start.slice(0, nNets);
  each((from, t) => { to[fill[from]++] = t; });
  return { start, to };
}

/**
 * Finds the feedback loops of a layout. `gate[p]` is 1 for the parts that make edges (combinational
 * parts that evaluate). A loop is a component of two or more nets, or one net its own gate reads.
 */
export function findFeedbackLoops(lay: SimLayout, gate: Uint8Array, nNets: number): FeedbackLoops {
  const { start, to } = gateGraph(lay, gate, nNets);
  const index = new Int32Array(nNets).fill(-1);
  const low = new Int32Array(nNets);
  const onStack = new Uint8Array(nNets);
  const stack = new Int32Array(nNets);
  const callNode = new Int32Array(nNets);
  const callEdge = new Int32Array(nNets);
  const comp = new Int32Array(nNets).fill(-1);
  let sp = 0, next = 0, nComp = 0;
  const members: number[][] = [];
  for (let root = 0; root < nNets; root++) {
    if (index[root] !== -1 || start[root] === start[root + 1]) continue;
    let depth = 0;
    callNode[0] = root; callEdge[0] = start[root];
    index[root] = low[root] = next++; stack[sp++] = root; onStack[root] = 1;
    while (depth >= 0) {
      const v = callNode[depth];
      if (callEdge[depth] < start[v + 1]) {
        const w = to[callEdge[depth]++];
        if (index[w] === -1) {
          index[w] = low[w] = next++; stack[sp++] = w; onStack[w] = 1;
          depth++; callNode[depth] = w; callEdge[depth] = start[w];
        } else if (onStack[w] && index[w] < low[v]) low[v] = index[w];
        continue;
      }
      if (low[v] === index[v]) {
        const list: number[] = [];
        let w: number;
        do { w = stack[--sp]; onStack[w] = 0; comp[w] = nComp; list.push(w); } while (w !== v);
        members.push(list);
        nComp++;
      }
      depth--;
      if (depth >= 0) { const u = callNode[depth]; if (low[v] < low[u]) low[u] = low[v]; }
    }
  }
  const selfLoop = (net: number) => { for (let e = start[net]; e < start[net + 1]; e++) if (to[e] === net) return true; return false; };
  // file order of the drivers (slots follow the parts), not net ids: a net takes the id of its first pin,
  // which may be an input of an earlier part
  const byDriver = (a: number, b: number) => lay.netDrivers[a] - lay.netDrivers[b];
  const loops = members.filter((m) => m.length > 1 || selfLoop(m[0])).map((m) => m.sort(byDriver));
  loops.sort((a, b) => byDriver(a[0], b[0]));
  const loopStart = new Int32Array(loops.length + 1);
  loops.forEach((m, k) => { loopStart[k + 1] = loopStart[k] + m.length; });
  const loopNet = Int32Array.from(loops.flat());
  const entries: number[] = [];
  const entryStart = new Int32Array(loops.length + 1);
  const mark = new Int32Array(nNets).fill(-1);
  loops.forEach((m, k) => {
    for (const net of m) {
      const p = lay.slotPart[lay.netDrivers[net]];
      for (let i = lay.inStart[p]; i < lay.inStart[p + 1]; i++) {
        const e = lay.inNet[i];
        if (comp[e] === comp[net] || mark[e] === k) continue;
        mark[e] = k;
        entries.push(e);
      }
    }
    entryStart[k + 1] = entries.length;
  });
  const entryNet = Int32Array.from(entries);
  const { start: netLoopStart, items: netLoop } = netToLoops(nNets, loops.length, loopStart, loopNet, entryStart, entryNet);
  return { count: loops.length, loopStart, loopNet, entryStart, entryNet, netLoopStart, netLoop };
}

/** Inverts loop → nets (members and entries) into net → loops (CSR, each list in loop order). */
function netToLoops(nNets: number, count: number, loopStart: Int32Array, loopNet: Int32Array, entryStart: Int32Array, entryNet: Int32Array): { start: Int32Array; items: Int32Array } {
  const start = new Int32Array(nNets + 1);
  // a member net is never an entry of its own loop, so no loop is listed twice for a net
  const each = (visit: (net: number, k: number) => void) => {
    for (let k = 0; k < count; k++) {
      for (let i = loopStart[k]; i < loopStart[k + 1]; i++) visit(loopNet[i], k);
      for (let i = entryStart[k]; i < entryStart[k + 1]; i++) visit(entryNet[i], k);
    }
  };
  each((net) => { start[net + 1]++; });
  for (let i = 0; i < nNets; i++) start[i + 1] += start[i];
  const items = new Int32Array(start[nNets]);
  const fill = start.slice(0, nNets);
  each((net, k) => { items[fill[net]++] = k; });
  return { start, items };
}

/**
 * Whether loop k's X sustains itself — every net entering it reads 0 or 1 (`known`) — and if so the
 * first net of the loop (driver file order) for which `isX` holds (at X, no change pending); −1 otherwise.
 */
export function sustainedXNet(loops: FeedbackLoops, k: number, isX: (net: number) => boolean, known: (net: number) => boolean): number {
  let first = -1;
  for (let i = loops.loopStart[k]; i < loops.loopStart[k + 1] && first < 0; i++) if (isX(loops.loopNet[i])) first = loops.loopNet[i];
  if (first < 0) return -1;
  for (let i = loops.entryStart[k]; i < loops.entryStart[k + 1]; i++) if (!known(loops.entryNet[i])) return -1;
  return first;
}
