/**
 * Run in a fresh process by analysis.bench.ts: the first (cold) truth table of the 16-input,
 * 1,000-gate board, as the first analysis in a new worker or command-line process meets it — cone,
 * program, kernel (WebAssembly where it compiles, `js` as an argument forces the JS kernel), with no
 * code warmed up (the board is compiled first, untimed). Prints the wall milliseconds, the process's
 * CPU milliseconds over the same span (all its threads: the module compiler and the garbage collector
 * run beside the main thread) and the kernel that ran.
 */
import { compileBoard } from '../shared/sim';
import { enumerateTable, resolveSpec } from '../shared/analysis';
import { board16 } from './boards';

const kernel = process.argv.includes('js') ? 'js' : undefined;
const netlist = compileBoard(board16());
const cpu = (): number => { const u = process.cpuUsage(); return (u.user + u.system) / 1000; };
const c0 = cpu();
const t0 = performance.now();
const table = enumerateTable(netlist, resolveSpec(netlist), { kernel });
const ms = performance.now() - t0;
console.log(JSON.stringify({ ms, cpuMs: cpu() - c0, kernel: table.kernel }));
