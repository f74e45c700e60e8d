/**
 * Structural Verilog (IEEE Std 1364) of a board: one module, one port per input and output label, gate
 * primitives for gates, continuous assigns for multiplexers and constants, behavioural always blocks
 * for storage parts. A clock part becomes an input port. In a family whose open inputs read 0 or 1,
 * an undriven net is tied to that constant, as the simulator reads it.
 */
import type { BoardFile } from '../board';
import { familyOf } from './families';
import { timescaleFor } from './vcd';
import type { CompiledPart, Netlist } from './types';
import { VerilogNames } from './verilog-names';

const PRIMITIVE: Partial<Record<CompiledPart['kind'], string>> = {
  and: 'and', or: 'or', nand: 'nand', nor: 'nor', xor: 'xor', xnor: 'xnor', not: 'not', buffer: 'buf',
};

/** Options of toVerilog. */
export interface VerilogOptions {
  /**
   * Write each part's delays (`#(rise, fall)` in simulation time units) on its primitive or assign, so an
   * event-driven Verilog simulator reproduces the timing; default false (zero-delay netlist).
   */
  delays?: boolean;
}

/** Verilog text of the board's netlist. */
export function toVerilog(board: BoardFile, netlist: Netlist, opts: VerilogOptions = {}): string {
  const names = new VerilogNames();
  // module names live in their own name space: the title never renames a port
  const moduleName = new VerilogNames().take(board.title.trim() ? board.title : 'gatefold_board', 'm_');
  const ports = new Map<CompiledPart, string>();
  for (const p of [...netlist.inputs, ...netlist.outputs]) {
    if (p.kind === 'const') continue;
    ports.set(p, names.label(p.name));
  }
  // a net takes the name of its input port when an input drives it, else of its output port, else its own
  const wire: string[] = new Array(netlist.nets.length);
  for (const p of netlist.inputs) if (ports.has(p) && netlist.nets[p.outputs[0]].name === p.name) wire[p.outputs[0]] ??= ports.get(p)!;
  for (const p of netlist.outputs) {
    const net = p.inputs[0];
    if (wire[net] === undefined && netlist.nets[net].name === p.name) wire[net] = ports.get(p)!;
  }
  for (const net of netlist.nets) wire[net.id] ??= names.take(net.name);

  const header = [...ports.values()];
  const lines: string[] = [];
  lines.push(`// Structural Verilog (IEEE Std 1364) exported by Gatefold: board "${board.title.replace(/[\r\n]/g, ' ')}", family ${netlist.family}`);
  // one time unit of the simulator = one Verilog time unit, so `#(rise, fall)` means what the bench shows
  lines.push(`\`timescale ${timescaleFor(familyOf(netlist.family).timeUnitNs).replace(' ', '')}/1ps`);
  const caution = familyOf(netlist.family).caution;
  if (caution) lines.push(`// CAUTION: ${caution}`);
  lines.push(`module ${moduleName} (${header.join(', ')});`);
  for (const p of netlist.inputs) if (ports.has(p)) lines.push(`  input wire ${ports.get(p)};`);
  for (const p of netlist.outputs) lines.push(`  output wire ${ports.get(p)};`);
  const portWires = new Set(header);
  // a switch's complement that nothing reads is left out
  const unused = (net: number) => netlist.nets[net].readers.length === 0 && netlist.nets[net].drivers.length === 1 && netlist.nets[net].drivers[0].pin === 'outn';
  wire.forEach((w, net) => { if (!portWires.has(w) && !unused(net)) { lines.push(`  wire ${w};`); portWires.add(w); } });
  const body: string[] = [];
  const floating = familyOf(netlist.family).floating;
  for (const net of netlist.undriven) {
    // only where a part reads the net: a lamp alone on an open net shows Z in the simulator too
    const read = netlist.nets[net].readers.some((r) => { const k = netlist.partById(r.part)?.kind; return k !== 'lamp' && k !== 'probe'; });
    if (read && (floating === '0' || floating === '1')) body.push(`  assign ${wire[net]} = 1'b${floating}; // open input: reads ${floating} in family ${netlist.family}`);
  }
  for (const p of netlist.parts) body.push(...partLines(p, wire, ports, names, unused, opts.delays ? `#(${p.rise}, ${p.fall}) ` : ''));
  return [...lines, ...body, 'endmodule', ''].join('\n');
}

function partLines(p: CompiledPart, wire: string[], ports: Map<CompiledPart, string>, names: VerilogNames,
  unused: (net: number) => boolean, delay: string): string[] {
  const i = (k: number) => wire[p.inputs[k]];
  const o = (k: number) => wire[p.outputs[k]];
  const inst = () => names.take(`g_${p.id}`, 'g_');
  switch (p.kind) {
    case 'switch': case 'button': case 'clock': {
      const port = ports.get(p)!;
      const r = o(0) === port ? [] : [`  assign ${o(0)} = ${port};`];
      if ((p.kind === 'switch' || p.kind === 'button') && !unused(p.outputs[1])) r.push(`  not ${inst()} (${o(1)}, ${port});`);
      return r;
    }
    case 'const':
      return [`  assign ${o(0)} = 1'b${p.part.kind === 'const' ? p.part.value : 0};`];
    case 'lamp': case 'probe': {
      const port = ports.get(p)!;
      return i(0) === port ? [] : [`  assign ${port} = ${i(0)};`];
    }
    case 'buffer': case 'not': case 'and': case 'or': case 'nand': case 'nor': case 'xor': case 'xnor':
      return [`  ${PRIMITIVE[p.kind]} ${delay}${inst()} (${[o(0), ...p.inputs.map((_, k) => i(k))].join(', ')});`];
    case 'mux2':
      return [`  assign ${delay}${o(0)} = ${i(0)} ? ${i(2)} : ${i(1)};`];
    case 'mux4':
      return [`  assign ${delay}${o(0)} = ${i(1)} ? (${i(0)} ? ${i(5)} : ${i(4)}) : (${i(0)} ? ${i(3)} : ${i(2)});`];
    case 'srlatch': case 'dlatch': case 'dff': {
      const init = 'init' in p.part && p.part.init === 1 ? 1 : 0;
      const q = names.take(`${p.id}_q`, 'r_');
      const qn = names.take(`${p.id}_qn`, 'r_');
      const r = [`  reg ${q} = 1'b${init};`, `  reg ${qn} = 1'b${1 - init};`];
      if (p.kind === 'dff') r.push(`  always @(posedge ${i(1)}) begin ${q} <= ${i(0)}; ${qn} <= ~${i(0)}; end`);
      else if (p.kind === 'dlatch') r.push(`  always @(${i(0)} or ${i(1)}) if (${i(1)}) begin ${q} <= ${i(0)}; ${qn} <= ~${i(0)}; end`);
      else {
        r.push(`  always @(${i(0)} or ${i(1)})`,
          `    if (${i(0)} && ${i(1)}) begin ${q} <= 1'b0; ${qn} <= 1'b0; end`,
          `    else if (${i(0)}) begin ${q} <= 1'b1; ${qn} <= 1'b0; end`,
          `    else if (${i(1)}) begin ${q} <= 1'b0; ${qn} <= 1'b1; end`,
          `    else if (${q} === 1'b0 && ${qn} === 1'b0) begin ${q} <= 1'bx; ${qn} <= 1'bx; end // released from 11: a race`);
      }
      r.push(`  assign ${delay}${o(0)} = ${q};`, `  assign ${delay}${o(1)} = ${qn};`);
      return r;
    }
    case 'note':
    case 'port': case 'module': // flattened away by compileBoard
      return [];
    default: {
      const never: never = p.kind;
      throw new Error(`unknown part kind ${String(never)}`);
    }
  }
}
