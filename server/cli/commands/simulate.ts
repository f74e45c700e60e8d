/**
 * `simulate FILE [--set A=1,B=0] [--clock LABEL --cycles N] [--vcd OUT.vcd] [--power-on resolve|x]` (CONTRACTS §2).
 * Runs the live simulation the bench runs (shared/sim/live), with its clocking rules: a cycle drives the
 * clock input high, settles, drives it low, settles, holds half a period, then records the outputs; each
 * phase lasts at least half the clock's period so that the dumped waveform shows the clock's shape.
 */
import {
  compileBoard, familyOf, LiveSimulation, timescaleFor, toVcd,
  type CompiledPart, type Level, type Netlist, type SettleReport, type Timers, type VcdSample, type VcdSignal,
} from '../../../shared/sim';
import { parseCommandArgs } from '../args';
import { readBoard } from '../board-file';
import { CliError } from '../errors';
import type { CliCommand } from './types';

const MAX_CYCLES = 100_000;
const OSCILLATING_BUDGET = 2_000;
const POWER_ON = ['resolve', 'x'] as const;

/** `--power-on`: how gate loops power on (decision 002); default resolve. */
function parsePowerOn(value: string | boolean | undefined): (typeof POWER_ON)[number] {
  if (value === undefined) return 'resolve';
  const mode = POWER_ON.find((m) => m === value);
  if (!mode) throw new CliError(`--power-on: "${String(value)}" is not resolve or x`);
  return mode;
}

function inputByLabel(netlist: Netlist, label: string, flag: string): CompiledPart {
  const part = netlist.inputs.find((p) => p.name === label);
  if (!part) throw new CliError(`${flag}: unknown input label "${label}" (inputs: ${netlist.inputs.map((p) => p.name).join(', ') || 'none'})`);
  return part;
}

/** `A=1,B=0` → [[part id, value]] */
function parseSets(netlist: Netlist, text: string): [string, boolean][] {
  return text.split(',').filter((s) => s.trim()).map((item) => {
    const m = /^\s*([^=\s]+)\s*=\s*([01])\s*$/.exec(item);
    if (!m) throw new CliError(`--set: "${item}" is not LABEL=0 or LABEL=1`);
    return [inputByLabel(netlist, m[1], '--set').id, m[2] === '1'];
  });
}

/** The command line never runs the clock on wall time: only the run's time budgets read it. */
const timers: Timers = { now: () => performance.now(), setTimeout: () => undefined, clearTimeout: () => undefined };

/** The dumped signals: inputs and outputs by label, then every other net in scope `nets`. */
function vcdSignals(netlist: Netlist): { signals: VcdSignal[]; byNet: number[][] } {
  const signals: VcdSignal[] = [];
  const byNet: number[][] = netlist.nets.map(() => []);
  const add = (net: number, signal: VcdSignal) => { byNet[net].push(signals.length); signals.push(signal); };
  for (const p of netlist.inputs) add(p.outputs[0], { name: p.name });
  for (const p of netlist.outputs) add(p.inputs[0], { name: p.name });
  for (const net of netlist.nets) {
    // an unused switch complement (outn) is left out
    const unusedOutn = net.readers.length === 0 && net.drivers.length === 1 && net.drivers[0].pin === 'outn';
    if (byNet[net.id].length !== 0 || unusedOutn) continue;
    // a net inside an instance sits in the instance's scope: `u3/g2_out` is g2_out in scope u3
    const slash = net.name.lastIndexOf('/');
    add(net.id, slash > 0 ? { name: net.name.slice(slash + 1), scope: net.name.slice(0, slash) } : { name: net.name, scope: 'nets' });
  }
  return { signals, byNet };
}

export const simulate: CliCommand = {
  usage: 'simulate FILE [--set A=1,B=0] [--clock LABEL --cycles N] [--vcd OUT.vcd] [--power-on resolve|x]',
  run(args, io) {
    const { positionals, values } = parseCommandArgs(args, {
      set: { type: 'string' }, clock: { type: 'string' }, cycles: { type: 'string' }, vcd: { type: 'string' },
      'power-on': { type: 'string' },
    });
    const powerOn = parsePowerOn(values['power-on']);
    const board = readBoard(positionals[0]);
    // labels are checked before anything runs
    const labels = compileBoard(board);
    const sets = typeof values.set === 'string' ? parseSets(labels, values.set) : [];
    const clock = typeof values.clock === 'string' ? inputByLabel(labels, values.clock, '--clock') : undefined;
    let cycles = 0;
    if (values.cycles !== undefined) {
      if (!clock) throw new CliError('--cycles needs --clock LABEL');
      const n = Number(values.cycles);
      if (!Number.isInteger(n) || n < 1 || n > MAX_CYCLES) throw new CliError(`--cycles: "${String(values.cycles)}" must be a whole number ≥ 1 (at most ${MAX_CYCLES})`);
      cycles = n;
    } else if (clock) cycles = 1;

    const samples: VcdSample[] = [];
    let signals: VcdSignal[] = [];
    let initial: Level[] = [];
    const oscillating = new Set<string>();
    const races = new Set<string>();
    let settled = true;
    let report: SettleReport | undefined;
    // the loop nets whose power-on level was chosen (only the first settle chooses)
    let resolved: string[] | undefined;
    const live = new LiveSimulation(timers, {
      powerOn,
      clockInputs: clock ? [clock.id] : [],
      // once the board is known to oscillate, later settles get a small budget so long runs stay quick
      oscillatingBudget: OSCILLATING_BUDGET,
      onCompile: (netlist, sim) => {
        const dump = vcdSignals(netlist);
        signals = dump.signals;
        // levels at power-on (time 0): sources and storage are driven already, gates still X
        initial = signals.map(() => 'X');
        dump.byNet.forEach((list, net) => { for (const s of list) initial[s] = sim.level(net); });
        if (values.vcd) sim.onChange((time, net, level) => { for (const s of dump.byNet[net]) samples.push({ time, signal: s, level }); });
      },
      onSettle: (r) => {
        report = r;
        resolved ??= r.powerOn;
        settled &&= r.settled;
        r.oscillating.forEach((n) => oscillating.add(n));
        r.races.forEach((n) => races.add(n));
      },
    });
    live.load(board);
    // the values of --set change together, straight after power-on; without a change the board settles
    // once more all the same (an oscillating board runs on), as this command always has
    if (!live.setTryOut(sets, false)) live.settle();
    const sim = live.sim!;
    const trace: { cycle: number; outputs: Record<string, Level> }[] = [];
    for (let cycle = 1; cycle <= cycles; cycle++) {
      live.cycle();
      trace.push({ cycle, outputs: sim.outputValues() });
    }
    const result = {
      settled, oscillating: [...oscillating], conflicts: report!.conflicts, outputs: sim.outputValues(), trace,
      undrivenInputs: report!.undrivenInputs, races: [...races], powerOn: resolved ?? [], time: sim.time, events: sim.stats.events,
      ...(familyOf(board.family).caution ? { caution: familyOf(board.family).caution } : {}),
    };
    io.stdout(JSON.stringify(result, null, 2) + '\n');
    if (values.vcd) {
      io.writeFile(String(values.vcd), toVcd(samples, signals, {
        initial, timescale: timescaleFor(familyOf(board.family).timeUnitNs), top: 'board',
        date: new Date().toISOString(), version: 'Gatefold simulate',
      }));
    }
  },
};

export default simulate;
