/**
 * Strongly connected components of a directed graph in compressed rows (Tarjan's algorithm, iterative,
 * over typed arrays): linear in nodes plus edges, with no recursion to overflow on long chains.
 */

/** A directed graph on nodes 0 … n − 1: the successors of v are `to[start[v]] … to[start[v + 1] − 1]`. */
export interface CsrGraph {
  start: Int32Array;
  to: Int32Array;
}

/**
 * Marks the nodes on a cycle: 1 for a node in a component of two or more nodes, or with an edge to
 * itself; 0 otherwise.
 */
export function nodesOnCycles(g: CsrGraph): Uint8Array {
  const n = g.start.length - 1;
  const { start, to } = g;
  const index = new Int32Array(n).fill(-1);
  const low = new Int32Array(n);
  const onStack = new Uint8Array(n);
  const stack = new Int32Array(n);
  const callNode = new Int32Array(n);
  const callEdge = new Int32Array(n);
  const cyclic = new Uint8Array(n);
  let sp = 0;
  let next = 0;
  for (let root = 0; root < n; root++) {
    if (index[root] !== -1) continue;
    let depth = 0;
    callNode[0] = root;
    callEdge[0] = start[root];
    index[root] = low[root] = next++;
    stack[sp++] = root;
    onStack[root] = 1;
    while (depth >= 0) {
      const v = callNode[depth];
      if (callEdge[depth] < start[v + 1]) {
        const w = to[callEdge[depth]++];
        if (w === v) cyclic[v] = 1;
        if (index[w] === -1) {
          index[w] = low[w] = next++;
          stack[sp++] = w;
          onStack[w] = 1;
          depth++;
          callNode[depth] = w;
          callEdge[depth] = start[w];
        } else if (onStack[w] && index[w] < low[v]) low[v] = index[w];
        continue;
      }
      if (low[v] === index[v]) {
        // pop the component; it is a cycle when it has two or more nodes
        const top = sp;
        while (stack[sp - 1] !== v) { sp--; onStack[stack[sp]] = 0; }
        sp--;
        onStack[v] = 0;
        if (top - sp > 1) for (let i = sp; i < top; i++) cyclic[stack[i]] = 1;
      }
      depth--;
      if (depth >= 0) {
        const u = callNode[depth];
        if (low[v] < low[u]) low[u] = low[v];
      }
    }
  }
  return cyclic;
}
