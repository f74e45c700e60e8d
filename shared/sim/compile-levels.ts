/**
 * The pin layout compileBoard works on: every real part of the flat board (depth first), its pins, and
 * the net of each pin slot — built from a flat board, or from a board with modules without building the
 * flat board (docs/decisions/004-modules.md): each module's inside is laid out once as a template of
 * typed arrays (its parts, the local net of each pin, the net of each port) and an instance copies its
 * module's template with an offset. The result is the same as flattenBoard followed by the flat layout,
 * net for net; a board the fast way cannot take exactly like that (duplicate ids, a wire to a pin that
 * does not exist, a missing or nested-in-itself module…) gets `null`, and compileBoard flattens it.
 */
import { isNamedKind, MAX_FLAT_PARTS, pinsOfPart, type BoardFile, type Module, type Part, type PinSet } from '../board';

/** Parts, pins and nets of a flat board, in the flat board's order. */
export interface PinLayout {
  /** the flat board's parts (path ids `u3/g2` inside instances) */
  parts: Part[];
  pins: PinSet[];
  /** part p's pins are slots slotBase[p] … slotBase[p + 1] − 1, inputs first */
  slotBase: Int32Array;
  /** net of each slot; nets are numbered in the order of their first slot */
  slotNet: Int32Array;
  nNets: number;
  /** flat part id → index (the first part with that id), built on first use */
  index: () => Map<string, number>;
  /** true when two parts have one id (a flat board parseBoardFile would refuse) */
  repeats: boolean;
}

const pinCache = new Map<string, PinSet[]>();

/** pinsOfPart for real parts, one shared pin list per kind and input count. */
export function pinsFor(part: Part): PinSet {
  const raw = (part as { inputs?: unknown }).inputs;
  const n = typeof raw === 'number' ? raw : 2;
  if (part.kind === 'port' || part.kind === 'module' || !(n >= 0 && n <= 64 && Number.isInteger(n))) return pinsOfPart(part);
  let byCount = pinCache.get(part.kind);
  if (!byCount) pinCache.set(part.kind, (byCount = []));
  return (byCount[n] ??= pinsOfPart(part));
}

function find(parent: Int32Array, i: number): number {
  let r = i;
  while (parent[r] !== r) r = parent[r];
  // path compression keeps later finds short on long wire chains
  while (parent[i] !== r) {
    const next = parent[i];
    parent[i] = r;
    i = next;
  }
  return r;
}

function union(parent: Int32Array, a: number, b: number): void {
  const ra = find(parent, a);
  const rb = find(parent, b);
  if (ra !== rb) { if (ra < rb) parent[rb] = ra; else parent[ra] = rb; }
}

/** Index of the pin named by ref[from …] in `names`, −1 when none (no string is cut out). */
function pinIndex(names: readonly string[], ref: string, from: number): number {
  const len = ref.length - from;
  for (let i = 0; i < names.length; i++) if (names[i].length === len && ref.startsWith(names[i], from)) return i;
  return -1;
}

/** Nets numbered in the order of their first slot, from the union-find roots of the slots. */
function numberNets(root: (s: number) => number, nSlots: number, nNodes: number): { slotNet: Int32Array; nNets: number } {
  const netOfRoot = new Int32Array(nNodes).fill(-1);
  const slotNet = new Int32Array(nSlots);
  let nNets = 0;
  for (let s = 0; s < nSlots; s++) {
    const r = root(s);
    let net = netOfRoot[r];
    if (net < 0) netOfRoot[r] = net = nNets++;
    slotNet[s] = net;
  }
  return { slotNet, nNets };
}

/**
 * Part ids → index (the first part with that id), looked up by the part half of a pin reference without
 * cutting it out of the reference: an open-addressing table over a hash of the id's characters. A board
 * has a few wire ends per part, and a cut-out string per end was a fifth of compiling a flat board.
 */
class IdTable {
  private readonly slots: Int32Array;
  private readonly mask: number;

  constructor(private readonly parts: readonly Part[]) {
    let size = 16;
    while (size < parts.length * 2) size *= 2;
    this.mask = size - 1;
    this.slots = new Int32Array(size).fill(-1);
    for (let p = 0; p < parts.length; p++) {
      const id = parts[p].id;
      let h = IdTable.hash(id, id.length) & this.mask;
      for (;;) {
        const q = this.slots[h];
        if (q < 0) { this.slots[h] = p; break; }
        if (parts[q].id === id) break; // a repeated id: the first part keeps it
        h = (h + 1) & this.mask;
      }
    }
  }

  private static hash(text: string, end: number): number {
    let h = 0x811c9dc5;
    for (let i = 0; i < end; i++) h = Math.imul(h ^ text.charCodeAt(i), 0x01000193);
    return h >>> 0;
  }

  /** Index of the part whose id is ref[0 … end), −1 when none. */
  find(ref: string, end: number): number {
    let h = IdTable.hash(ref, end) & this.mask;
    for (;;) {
      const q = this.slots[h];
      if (q < 0) return -1;
      const id = this.parts[q].id;
      if (id.length === end && ref.startsWith(id)) return q;
      h = (h + 1) & this.mask;
    }
  }
}

/** The layout of a board without modules (every part real; wires to unknown parts or pins skipped). */
export function flatLayout(board: BoardFile): PinLayout {
  const parts = board.parts;
  const n = parts.length;
  const pins: PinSet[] = new Array<PinSet>(n);
  const slotBase = new Int32Array(n + 1);
  for (let p = 0; p < n; p++) {
    const pp = pinsFor(parts[p]);
    pins[p] = pp;
    slotBase[p + 1] = slotBase[p] + pp.inputs.length + pp.outputs.length;
  }
  const ids = new IdTable(parts);
  const nSlots = slotBase[n];
  const slotOf = (ref: string): number => {
    const dot = ref.lastIndexOf('.');
    if (dot <= 0 || dot === ref.length - 1) return -1;
    const p = ids.find(ref, dot);
    if (p < 0) return -1;
    const pp = pins[p];
    const i = pinIndex(pp.inputs, ref, dot + 1);
    if (i >= 0) return slotBase[p] + i;
    const o = pinIndex(pp.outputs, ref, dot + 1);
    return o >= 0 ? slotBase[p] + pp.inputs.length + o : -1;
  };
  const parent = new Int32Array(nSlots);
  for (let i = 0; i < nSlots; i++) parent[i] = i;
  for (const wire of board.wires) {
    const a = slotOf(wire.from);
    if (a < 0) continue;
    const b = slotOf(wire.to);
    if (b >= 0) union(parent, a, b);
  }
  const { slotNet, nNets } = numberNets((s) => find(parent, s), nSlots, nSlots);
  let index: Map<string, number> | undefined;
  let repeats = false;
  for (let p = 0; p < n && !repeats; p++) repeats = ids.find(parts[p].id, parts[p].id.length) !== p;
  return {
    parts: parts as Part[], pins, slotBase, slotNet, nNets, repeats,
    index: () => {
      if (!index) { index = new Map(); for (let p = 0; p < n; p++) if (!index.has(parts[p].id)) index.set(parts[p].id, p); }
      return index;
    },
  };
}

/** One module's inside, laid out once per compile and copied for each instance. */
interface Template {
  /** real parts, depth first, as written in their module */
  src: Part[];
  /** path of each relative to this module (`g2`, `a/g2`) */
  rel: string[];
  pins: PinSet[];
  slotBase: Int32Array;
  /** local net of each slot (0 … nNets − 1) */
  slotNet: Int32Array;
  nNets: number;
  /** local net of each instance pin, in the instance's pin order (port labels: inputs, then outputs) */
  portNet: Int32Array;
  /** instance pin name → index in portNet */
  pinAt: Map<string, number>;
  /** levels of modules this one holds, itself included */
  depth: number;
}

/** Thrown inside levelLayout when the fast way cannot promise the flattening's exact result. */
class Unsure extends Error {}

const MAX_DEPTH = 64;

/** What the levels of one compile share. */
interface Ctx {
  modules: Map<string, Module>;
  templates: Map<string, Template | null>;
}

/**
 * The layout of one level — the board's top level (`mod` undefined) or a module's inside. Instances are
 * copies of their module's template; ports (inside a module) are nodes of the union, as in flattenBoard.
 */
function levelLayout(ctx: Ctx, parts: readonly Part[], wires: BoardFile['wires'], mod: Module | undefined): Template {
  const inside = mod !== undefined;
  const n = parts.length;
  const local = new Map<string, number>();
  // per local part: 0 real, 1 instance, 2 port, 3 dropped (a lamp or probe inside a module)
  const role = new Uint8Array(n);
  const child: (Template | undefined)[] = new Array<Template | undefined>(n);
  const nodeBase = new Int32Array(n + 1);
  let flatParts = 0;
  let flatSlots = 0;
  let depth = 0;
  for (let k = 0; k < n; k++) {
    const part = parts[k];
    if (local.has(part.id) || part.id.includes('/')) throw new Unsure();
    local.set(part.id, k);
    let nodes: number;
    if (part.kind === 'module') {
      const t = template(ctx, part.module);
      role[k] = 1;
      child[k] = t;
      nodes = t.nNets;
      flatParts += t.src.length;
      flatSlots += t.slotNet.length;
      if (t.depth > depth) depth = t.depth;
    } else if (part.kind === 'port') {
      if (!inside) throw new Unsure();
      role[k] = 2;
      nodes = 1;
    } else if (inside && (part.kind === 'lamp' || part.kind === 'probe')) {
      role[k] = 3;
      nodes = 0;
    } else {
      const pp = pinsFor(part);
      nodes = pp.inputs.length + pp.outputs.length;
      flatParts++;
      flatSlots += nodes;
    }
    nodeBase[k + 1] = nodeBase[k] + nodes;
  }
  if (flatParts > MAX_FLAT_PARTS) throw new Unsure();
  const nNodes = nodeBase[n];
  const parent = new Int32Array(nNodes);
  for (let i = 0; i < nNodes; i++) parent[i] = i;
  /** node of a wire end, −1 to skip the wire (as flattenBoard does) */
  const partOf = (ref: string): number => {
    const dot = ref.lastIndexOf('.');
    if (dot <= 0 || dot === ref.length - 1) return -1;
    return local.get(ref.slice(0, dot)) ?? -1;
  };
  const nodeOf = (k: number, ref: string): number => {
    const from = ref.lastIndexOf('.') + 1;
    const part = parts[k];
    switch (role[k]) {
      case 0: {
        const pp = pinsFor(part);
        const i = pinIndex(pp.inputs, ref, from);
        if (i >= 0) return nodeBase[k] + i;
        const o = pinIndex(pp.outputs, ref, from);
        if (o >= 0) return nodeBase[k] + pp.inputs.length + o;
        break;
      }
      case 1: {
        const at = child[k]!.pinAt.get(ref.slice(from));
        if (at !== undefined) return nodeBase[k] + child[k]!.portNet[at];
        break;
      }
      case 2:
        if (ref.slice(from) === ((part as { dir?: string }).dir === 'out' ? 'in' : 'out')) return nodeBase[k];
        break;
    }
    // a pin the part does not have is a node of its own in flattenBoard; not worth copying that here
    throw new Unsure();
  };
  for (const wire of wires) {
    const a = partOf(wire.from);
    const b = partOf(wire.to);
    if (a < 0 || b < 0 || role[a] === 3 || role[b] === 3) continue;
    union(parent, nodeOf(a, wire.from), nodeOf(b, wire.to));
  }
  // the flat parts and slots of this level, depth first
  const src: Part[] = new Array<Part>(flatParts);
  const rel: string[] = new Array<string>(flatParts);
  const pins: PinSet[] = new Array<PinSet>(flatParts);
  const slotBase = new Int32Array(flatParts + 1);
  const slotNode = new Int32Array(flatSlots);
  let p = 0;
  let s = 0;
  for (let k = 0; k < n; k++) {
    if (role[k] === 0) {
      const part = parts[k];
      const pp = pinsFor(part);
      src[p] = part;
      rel[p] = part.id;
      pins[p] = pp;
      const count = pp.inputs.length + pp.outputs.length;
      for (let i = 0; i < count; i++) slotNode[s++] = nodeBase[k] + i;
      slotBase[++p] = s;
    } else if (role[k] === 1) {
      const t = child[k]!;
      const prefix = `${parts[k].id}/`;
      const base = nodeBase[k];
      const s0 = s;
      for (let i = 0; i < t.src.length; i++) {
        src[p] = t.src[i];
        rel[p] = prefix + t.rel[i];
        pins[p] = t.pins[i];
        slotBase[++p] = s0 + t.slotBase[i + 1];
      }
      for (let i = 0; i < t.slotNet.length; i++) slotNode[s++] = base + t.slotNet[i];
    }
  }
  // local nets: every union root that holds a slot or a port, in order of first slot
  const { slotNet, nNets: slotNets } = numberNets((i) => find(parent, slotNode[i]), flatSlots, nNodes);
  let nNets = slotNets;
  const pinAt = new Map<string, number>();
  let portNet = new Int32Array(0);
  if (mod) {
    const netOfRoot = new Int32Array(nNodes).fill(-1);
    for (let i = 0; i < flatSlots; i++) netOfRoot[find(parent, slotNode[i])] = slotNet[i];
    const ins: number[] = [];
    const outs: number[] = [];
    const inLabels: string[] = [];
    const outLabels: string[] = [];
    for (let k = 0; k < n; k++) {
      if (role[k] !== 2) continue;
      const port = parts[k] as Part & { label?: unknown; dir?: unknown };
      const r = find(parent, nodeBase[k]);
      if (netOfRoot[r] < 0) netOfRoot[r] = nNets++;
      if (typeof port.label !== 'string' || port.label === '') continue;
      // two ports with one label are joined through the instance pin in flattenBoard
      if (inLabels.includes(port.label) || outLabels.includes(port.label)) throw new Unsure();
      (port.dir === 'out' ? outLabels : inLabels).push(port.label);
      (port.dir === 'out' ? outs : ins).push(netOfRoot[r]);
    }
    portNet = Int32Array.from([...ins, ...outs]);
    [...inLabels, ...outLabels].forEach((label, i) => pinAt.set(label, i));
  }
  return { src, rel, pins, slotBase, slotNet, nNets, portNet, pinAt, depth: depth + (inside ? 1 : 0) };
}

/** The template of module `id`, laid out on first use in this compile. */
function template(ctx: Ctx, id: string): Template {
  const done = ctx.templates.get(id);
  if (done) return done;
  // null: being laid out — a module that contains itself
  if (done === null) throw new Unsure();
  const m = ctx.modules.get(id);
  if (!m) throw new Unsure();
  ctx.templates.set(id, null);
  const t = levelLayout(ctx, m.parts, m.wires, m);
  if (t.depth > MAX_DEPTH) throw new Unsure();
  ctx.templates.set(id, t);
  return t;
}

/**
 * The layout of a board with modules, without building its flat board: the same parts (path ids, inner
 * labels of inputs and outputs dropped), the same slots and the same net numbers as the flat layout of
 * flattenBoard(board). Null when the board needs the flattening's own handling (then it also reports
 * what is wrong).
 */
export function moduleLayout(board: BoardFile): PinLayout | null {
  const modules = new Map<string, Module>();
  for (const m of board.modules ?? []) if (!modules.has(m.id)) modules.set(m.id, m);
  let top: Template;
  try {
    top = levelLayout({ modules, templates: new Map() }, board.parts, board.wires, undefined);
  } catch (err) {
    if (err instanceof Unsure) return null;
    throw err;
  }
  const n = top.src.length;
  const parts: Part[] = new Array<Part>(n);
  for (let p = 0; p < n; p++) {
    const part = top.src[p];
    const id = top.rel[p];
    // a part of the top level is itself (the flattening's copy of it is equal); an inner one gets its path
    if (!id.includes('/')) { parts[p] = part; continue; }
    const flat = { ...part, id } as Part & { label?: string };
    if (isNamedKind(part.kind)) delete flat.label;
    parts[p] = flat;
  }
  let index: Map<string, number> | undefined;
  return {
    parts, pins: top.pins, slotBase: top.slotBase, slotNet: top.slotNet, nNets: top.nNets,
    index: () => {
      if (!index) { index = new Map(); for (let p = 0; p < n; p++) if (!index.has(parts[p].id)) index.set(parts[p].id, p); }
      return index;
    },
    repeats: false,
  };
}
