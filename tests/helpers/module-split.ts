/**
 * Random module splits of flat boards, for the flattening property tests: parts of a board are moved
 * into modules with the product's own `extractModule` (what the make-module edit does), sometimes
 * inside a module made before (nesting). A split keeps the circuit and only draws it as blocks, so the
 * split board and the flat one must behave the same.
 */
import { BoardFileSchema, extractModule, modulePinTable, parseBoardFile, type BoardFile, type Part } from '../../shared/board';
import { mulberry32 } from '../../shared/sim';
import { randomCircuit, type RandomCircuitOptions } from './random-circuit';

/** A random circuit with `flipFlops` rising-edge D flip-flops on a clock `CLK` whose outputs feed later gates. */
export function randomSequentialCircuit(opts: RandomCircuitOptions & { flipFlops: number }): BoardFile {
  const board = structuredClone(randomCircuit(opts));
  const rnd = mulberry32(opts.seed ^ 0x5eed);
  const gates = board.parts.filter((p) => p.id.startsWith('g'));
  board.parts.unshift({ id: 'clk', kind: 'clock', label: 'CLK', x: 0, y: -60 });
  for (let k = 0; k < opts.flipFlops; k++) {
    const id = `ff${k}`;
    board.parts.push({ id, kind: 'dff', x: 1000, y: 600 + k * 100, ...(rnd() < 0.5 ? { init: 1 as const } : {}) });
    const source = gates[Math.floor(rnd() * gates.length)];
    board.wires.push({ id: `wf${k}d`, from: `${source.id}.out`, to: `${id}.d` }, { id: `wf${k}c`, from: 'clk.out', to: `${id}.clk` });
    // a gate input now reads the flip-flop: state feeds back through the logic
    const readers = board.wires.filter((w) => /^g\d+\.in/.test(w.to));
    const wire = readers[Math.floor(rnd() * readers.length)];
    wire.from = `${id}.${rnd() < 0.5 ? 'q' : 'qn'}`;
  }
  return BoardFileSchema.parse(board);
}

function pickSome(rnd: () => number, parts: Part[], share: number): string[] {
  if (!parts.length) return [];
  // a contiguous run in file order (a block as a builder would draw it), sometimes with strays
  const start = Math.floor(rnd() * parts.length);
  const len = 1 + Math.floor(rnd() * Math.max(1, parts.length * share));
  const ids = parts.slice(start, start + len).map((p) => p.id);
  for (const p of parts) if (rnd() < 0.05) ids.push(p.id);
  return ids;
}

/**
 * Draws `board` as blocks: `splits` times, a random selection of the top level (or, one time in three,
 * of a module made before) becomes a module. The result passes parseBoardFile.
 */
export function splitIntoModules(board: BoardFile, seed: number, splits = 3): BoardFile {
  const rnd = mulberry32(seed);
  const out: BoardFile = structuredClone(board);
  out.modules = [];
  for (let s = 0; s < splits; s++) {
    const nested = out.modules.length > 0 && rnd() < 0.34;
    const host = nested ? out.modules[Math.floor(rnd() * out.modules.length)] : out;
    const movable = host.parts.filter((p) => !['switch', 'button', 'clock', 'lamp', 'probe', 'port', 'note'].includes(p.kind));
    const ids = pickSome(rnd, movable, 0.4);
    if (!ids.length) continue;
    const moduleId = `m${s}`;
    const taken = new Set(host.parts.map((p) => p.id));
    let instanceId = `u${s}`;
    while (taken.has(instanceId)) instanceId += 'x';
    let made;
    try {
      made = extractModule(host, ids, { moduleId, instanceId, title: `Block ${s}`, modulePins: modulePinTable(out.modules) });
    } catch {
      continue; // nothing movable in that selection
    }
    host.parts = made.level.parts;
    host.wires = made.level.wires;
    out.modules.push(made.module);
  }
  if (!out.modules.length) delete out.modules;
  const parsed = parseBoardFile(out);
  if (!parsed.ok) throw new Error(`split board is invalid: ${parsed.problems.map((p) => p.message).join('; ')}`);
  return parsed.board;
}
