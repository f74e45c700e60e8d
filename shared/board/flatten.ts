/**
 * The one flattening of a board with modules (docs/decisions/004-modules.md): every computation — the
 * simulator, the analysers, the build sheet, the bring-up tools — runs on the flat board it gives.
 * compileBoard gets the same netlist without building this board (shared/sim/compile-levels.ts lays each
 * module out once and copies it per instance; tests/modules/compile-levels.test.ts holds the two equal)
 * and calls flattenBoard only for a board it cannot take that way, or when `netlist.board` is read.
 *
 * Each part inside an instance becomes a part with the path id `u3/g2` (`u3/u1/g4` when nested), in place
 * of its instance, so file order stays depth first. Ports and instance pins are junctions, not parts: a
 * union of all wire ends gives the nets; wires between two real pins are kept (ids prefixed by the
 * path), and on a net that passes a junction bridging wires `~1`, `~2`, … join its first real pin to
 * the others. No gate and no delay is added.
 * Lamps and probes inside modules are dropped (they read and drive nothing), labels of inner constants too.
 */
import { isNamedKind } from './labels';
import { modulePinTable } from './modules';
import type { ModulePins } from './pins';
import { pinRef, splitPinRef } from './pins';
import type { BoardFile, Module, Part, Wire } from './schema';

/** Where instance pins and ports went in the flat board. */
export interface FlatBoard {
  board: BoardFile;
  /**
   * For every instance pin (`u3.A`, `u3/u1.B`) and every port pin inside an instance (`u3/p1.out`):
   * a real pin of the flat board on the same net, or null when that net has no real pin (open).
   */
  junctions: Map<string, string | null>;
}

/** Thrown when a board cannot be flattened (a cycle or a missing module that validation would name). */
export class FlattenError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'FlattenError';
  }
}

/** Most parts a flat board may have: nesting multiplies, and a mistake should not fill the memory. */
export const MAX_FLAT_PARTS = 400_000;
const MAX_DEPTH = 64;

const cache = new WeakMap<BoardFile, FlatBoard>();

/** The flat board of `board` (the board itself when it has no modules). Pure; the result is shared, do not change it. */
export function flattenBoard(board: BoardFile): BoardFile {
  if (!board.modules?.length && !board.parts.some((p) => p.kind === 'module')) return board;
  return flattenWithPins(board).board;
}

/** The flat board and where every instance pin went (see FlatBoard). Cached per board object. */
export function flattenWithPins(board: BoardFile): FlatBoard {
  const hit = cache.get(board);
  if (hit) return hit;
  const flat = new Flattener(board).run();
  cache.set(board, flat);
  return flat;
}

class Flattener {
  private readonly modules = new Map<string, Module>();
  private readonly pins: ModulePins;
  private readonly parts: Part[] = [];
  private readonly wires: Wire[] = [];
  /** union-find over wire ends (real pins and junctions) */
  private readonly index = new Map<string, number>();
  private readonly keys: string[] = [];
  private readonly real: boolean[] = [];
  private parent: number[] = [];
  /** junction keys: the ones a caller may ask about */
  private readonly junctionKeys: string[] = [];
  private readonly wireIds = new Set<string>();

  constructor(private readonly board: BoardFile) {
    for (const m of board.modules ?? []) if (!this.modules.has(m.id)) this.modules.set(m.id, m);
    this.pins = modulePinTable(board.modules);
  }

  run(): FlatBoard {
    this.expand('', this.board.parts, this.board.wires, []);
    this.bridge();
    const junctions = new Map<string, string | null>();
    const firstReal = new Map<number, string>();
    this.keys.forEach((key, i) => {
      if (!this.real[i]) return;
      const r = this.find(i);
      if (!firstReal.has(r)) firstReal.set(r, key);
    });
    for (const key of this.junctionKeys) junctions.set(key, firstReal.get(this.find(this.index.get(key)!)) ?? null);
    const board: BoardFile = { ...this.board, parts: this.parts, wires: this.wires };
    delete board.modules;
    return { board, junctions };
  }

  private node(key: string, real: boolean): number {
    let i = this.index.get(key);
    if (i === undefined) {
      i = this.keys.length;
      this.index.set(key, i);
      this.keys.push(key);
      this.real.push(real);
      this.parent.push(i);
      if (!real) this.junctionKeys.push(key);
    }
    return i;
  }

  private find(i: number): number {
    const p = this.parent;
    let r = i;
    while (p[r] !== r) r = p[r];
    while (p[i] !== r) { const n = p[i]; p[i] = r; i = n; }
    return r;
  }

  private union(a: number, b: number): void {
    const ra = this.find(a);
    const rb = this.find(b);
    if (ra !== rb) { if (ra < rb) this.parent[rb] = ra; else this.parent[ra] = rb; }
  }

  /**
   * Emits the parts of one level. `prefix` is the path of the instance ('' at the top); `chain` the
   * module ids above, to stop a cycle that validation did not catch.
   */
  private expand(prefix: string, parts: readonly Part[], wires: readonly Wire[], chain: string[]): void {
    if (chain.length > MAX_DEPTH) throw new FlattenError(`modules nest deeper than ${MAX_DEPTH}: ${chain.join(' → ')}`);
    const kindOf = new Map<string, Part>();
    for (const part of parts) if (!kindOf.has(part.id)) kindOf.set(part.id, part);
    const inside = prefix !== '';
    /** is the pin `id.pin` of this level a real pin of the flat board? */
    const isReal = (part: Part | undefined) => !!part && part.kind !== 'port' && part.kind !== 'module' && !(inside && (part.kind === 'lamp' || part.kind === 'probe'));
    for (const part of parts) {
      const id = prefix + part.id;
      if (part.kind === 'module') {
        const m = this.modules.get(part.module);
        if (!m) throw new FlattenError(`instance ${id} uses missing module "${part.module}"`);
        if (chain.includes(m.id)) throw new FlattenError(`module "${m.id}" contains itself: ${[...chain.slice(chain.indexOf(m.id)), m.id].join(' → ')}`);
        const pins = this.pins.get(m.id)!;
        // instance pin `u3.A` ≡ the pin of port A inside (`u3/p1.out` or `u3/p1.in`)
        for (const port of m.parts) {
          if (port.kind !== 'port' || !port.label) continue;
          const outer = this.node(pinRef(id, port.label), false);
          this.union(outer, this.node(pinRef(`${id}/${port.id}`, port.dir === 'out' ? 'in' : 'out'), false));
        }
        for (const pin of [...pins.inputs, ...pins.outputs]) this.node(pinRef(id, pin), false);
        if (this.parts.length > MAX_FLAT_PARTS) throw new FlattenError(`the flat board would have more than ${MAX_FLAT_PARTS} parts`);
        this.expand(`${id}/`, m.parts, m.wires, [...chain, m.id]);
        continue;
      }
      if (!isReal(part)) continue;
      const flat = { ...part, id } as Part;
      if (inside && isNamedKind(part.kind)) delete (flat as { label?: string }).label;
      this.parts.push(flat);
    }
    for (const wire of wires) {
      const a = splitPinRef(wire.from);
      const b = splitPinRef(wire.to);
      if (!a || !b) continue;
      const pa = kindOf.get(a.part);
      const pb = kindOf.get(b.part);
      if (!pa || !pb) continue;
      // a wire to a dropped indicator joins nothing
      if ((inside && (pa.kind === 'lamp' || pa.kind === 'probe')) || (inside && (pb.kind === 'lamp' || pb.kind === 'probe'))) continue;
      const ra = isReal(pa);
      const rb = isReal(pb);
      const from = prefix + wire.from;
      const to = prefix + wire.to;
      this.union(this.node(from, ra), this.node(to, rb));
      if (ra && rb) this.emitWire(prefix + wire.id, from, to);
    }
  }

  private emitWire(id: string, from: string, to: string): void {
    let wid = id;
    for (let k = 2; this.wireIds.has(wid); k++) wid = `${id}~${k}`;
    this.wireIds.add(wid);
    this.wires.push({ id: wid, from, to });
  }

  /** Joins, with bridging wires, the real pins that only junctions joined. */
  private bridge(): void {
    // a group of real pins is already one net when the kept wires join them; otherwise a wire from the
    // group's first real pin to each other real pin makes it one (a few extra wires cost nothing)
    const anchor = new Map<number, number>();
    const realCount = new Map<number, number>();
    const junctioned = new Set<number>();
    for (let i = 0; i < this.keys.length; i++) {
      const r = this.find(i);
      if (!this.real[i]) { junctioned.add(r); continue; }
      realCount.set(r, (realCount.get(r) ?? 0) + 1);
      if (!anchor.has(r)) anchor.set(r, i);
    }
    let n = 0;
    for (let i = 0; i < this.keys.length; i++) {
      if (!this.real[i]) continue;
      const r = this.find(i);
      // only nets that pass through a port or an instance pin need bridging
      if (!junctioned.has(r) || anchor.get(r) === i || (realCount.get(r) ?? 0) < 2) continue;
      this.emitWire(`~${++n}`, this.keys[anchor.get(r)!], this.keys[i]);
    }
  }
}
