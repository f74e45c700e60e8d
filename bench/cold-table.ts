/**
 * Run in a fresh process by analysis.bench.ts: the first (cold) truth table of the 16-input,
 * 1,000-gate board, as the first analysis in a new worker or command-line process meets it — levelise,
 * program, enumerate, with no code warmed up (the board is compiled first, untimed). Prints the milliseconds.
 */
import { compileBoard } from '../shared/sim';
import { enumerateTable, resolveSpec } from '../shared/analysis';
import { board16 } from './boards';

const board = board16();
const netlist = compileBoard(board);
const t0 = performance.now();
enumerateTable(netlist, resolveSpec(netlist));
console.log(JSON.stringify({ ms: performance.now() - t0 }));
