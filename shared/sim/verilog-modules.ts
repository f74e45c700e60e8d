/**
 * Hierarchical structural Verilog (IEEE Std 1364) of a board with modules: one Verilog module per
 * Gatefold module, instantiated by name, under the board's own module (written first, so it is the
 * top). The only export that does not read the flat board (docs/decisions/004-modules.md).
 *
 * Each level (the board, or a module's inside) is written by `toVerilog` from a stand-in board: a port
 * `in` is a switch labelled with the port's label (an input port), a port `out` a lamp (an output
 * port), and each instance pin a switch (the instance drives it) or a lamp (the instance reads it) with a
 * generated label; those stand-ins are then turned back into plain wires joined to an instance line.
 * Lamps and probes inside a module are left out, as the flattening leaves them out.
 */
import { flattenBoard, modulePinTable, type BoardFile, type Module, type Part, type Wire } from '../board';
import { compileBoard } from './compile';
import { toVerilog, type VerilogOptions } from './verilog';
import { VerilogNames } from './verilog-names';

interface Level {
  title: string;
  parts: Part[];
  wires: Wire[];
  inside: boolean;
}

/** Verilog text of `board`: hierarchical when it has modules, else what `toVerilog` writes. */
export function toHierarchicalVerilog(board: BoardFile, opts: VerilogOptions = {}): string {
  if (!board.modules?.length) return toVerilog(board, compileBoard(board), opts);
  const pins = modulePinTable(board.modules);
  const byId = new Map(board.modules.map((m) => [m.id, m]));
  // module names: their own name space, apart from the board's module (taken first, from the title)
  const names = new VerilogNames();
  const topName = names.take(board.title.trim() ? board.title : 'gatefold_board', 'm_');
  const used: Module[] = [];
  const visit = (parts: readonly Part[]) => {
    for (const p of parts) {
      if (p.kind !== 'module' || used.some((m) => m.id === p.module)) continue;
      const m = byId.get(p.module);
      if (!m) continue;
      used.push(m);
      visit(m.parts);
    }
  };
  visit(board.parts);
  const moduleName = new Map(used.map((m) => [m.id, names.take(`gf_${m.id}`, 'm_')]));
  const texts = [writeLevel(board, { title: topName, parts: board.parts, wires: board.wires, inside: false }, pins, moduleName, opts)];
  for (const m of used) texts.push(writeLevel(board, { title: moduleName.get(m.id)!, parts: m.parts, wires: m.wires, inside: true }, pins, moduleName, opts));
  // the board's header (comment, `timescale`, caution) once, at the top
  return [texts[0], ...texts.slice(1).map((t) => t.slice(t.search(/^module /m)))].join('\n');
}

function writeLevel(board: BoardFile, level: Level, pins: ReturnType<typeof modulePinTable>, moduleName: Map<string, string>, opts: VerilogOptions): string {
  const taken = new Set(level.parts.map((p) => p.label).filter((l): l is string => !!l));
  let n = 0;
  const stand = (base: string) => {
    let label = `gf_${base}_${++n}`;
    while (taken.has(label)) label = `gf_${base}_${++n}`;
    taken.add(label);
    return label;
  };
  const parts: Part[] = [];
  const wires: Wire[] = [...level.wires];
  const hidden = new Set<string>();
  const instances: { part: Extract<Part, { kind: 'module' }>; conn: [string, string][] }[] = [];
  const portMap = new Map<string, string>(); // instance pin `u3.A` → stand-in part id
  for (const p of level.parts) {
    if (level.inside && (p.kind === 'lamp' || p.kind === 'probe')) continue;
    if (p.kind === 'port') {
      parts.push(p.dir === 'out' ? { id: p.id, kind: 'lamp', label: p.label, x: p.x, y: p.y } : { id: p.id, kind: 'switch', label: p.label, on: false, x: p.x, y: p.y });
      continue;
    }
    if (p.kind === 'module') {
      const pp = pins.get(p.module) ?? { inputs: [], outputs: [] };
      const conn: [string, string][] = [];
      for (const pin of pp.inputs) {
        const label = stand(`${p.id}_${pin}`);
        const id = `${p.id}~${pin}`;
        parts.push({ id, kind: 'lamp', label, x: 0, y: 0 });
        portMap.set(`${p.id}.${pin}`, `${id}.in`);
        conn.push([pin, label]);
        hidden.add(label);
      }
      for (const pin of pp.outputs) {
        const label = stand(`${p.id}_${pin}`);
        const id = `${p.id}~${pin}`;
        parts.push({ id, kind: 'switch', label, on: false, x: 0, y: 0 });
        portMap.set(`${p.id}.${pin}`, `${id}.out`);
        conn.push([pin, label]);
        hidden.add(label);
      }
      instances.push({ part: p, conn });
      continue;
    }
    parts.push(level.inside && (p.kind === 'const') ? { ...p, label: undefined } : p);
  }
  const stood = wires.map((w) => ({ ...w, from: portMap.get(w.from) ?? w.from, to: portMap.get(w.to) ?? w.to }));
  const levelBoard: BoardFile = { ...board, title: level.title, parts: parts.map(stripUndefined), wires: stood };
  delete levelBoard.modules;
  const text = toVerilog(levelBoard, compileBoard(flattenBoard(levelBoard)), opts);
  return rewire(text, hidden, instances.map((i) => {
    const name = moduleName.get(i.part.module) ?? i.part.module;
    const inst = new VerilogNames().take(i.part.id, 'u_');
    const pinName = new VerilogNames();
    return `  ${name} ${inst} (${i.conn.map(([pin, wire]) => `.${pinName.label(pin)}(${wire})`).join(', ')});`;
  }));
}

function stripUndefined(p: Part): Part {
  const out = { ...p } as Record<string, unknown>;
  for (const k of Object.keys(out)) if (out[k] === undefined) delete out[k];
  return out as Part;
}

/** Turns the stand-in ports into wires and adds the instance lines before `endmodule`. */
function rewire(text: string, hidden: Set<string>, instanceLines: string[]): string {
  const lines = text.split('\n');
  const out: string[] = [];
  for (const line of lines) {
    const header = /^module (\S+) \((.*)\);$/.exec(line);
    if (header) {
      const ports = header[2].split(', ').filter((p) => p && !hidden.has(p));
      out.push(`module ${header[1]} (${ports.join(', ')});`);
      continue;
    }
    const decl = /^ {2}(input|output) wire (\S+);$/.exec(line);
    if (decl && hidden.has(decl[2])) {
      out.push(`  wire ${decl[2]};`);
      continue;
    }
    if (line === 'endmodule') out.push(...instanceLines);
    out.push(line);
  }
  return out.join('\n');
}
