/**
 * The bench and `simulate --clock` run one live simulation (shared/sim/live): driven as the bench's worker
 * drives it (clock steps, button presses as try-outs) it gives, cycle for cycle, the outputs the command
 * line prints, on the two clocked examples.
 */
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { BoardFileSchema, type BoardFile } from '../../shared/board';
import { LiveEngine, type Level, type LiveCommand, type LiveUpdate, type Timers } from '../../shared/sim';
import { runCli } from './run-cli';

const example = (name: string) => join(dirname(fileURLToPath(import.meta.url)), '..', '..', 'examples', `${name}.gatefold.json`);
const load = (name: string): BoardFile => BoardFileSchema.parse(JSON.parse(readFileSync(example(name), 'utf8')));

/** The bench never runs its clock on wall time here: only steps and presses. */
const stillTimers: Timers = { now: () => 0, setTimeout: () => undefined, clearTimeout: () => undefined };

type Outputs = Record<string, Level>;

/** A live engine as the worker runs it; `outputs()` reads the last state's outputs by label. */
function bench(board: BoardFile) {
  const sent: LiveUpdate[] = [];
  const engine = new LiveEngine((m) => sent.push(m), stillTimers);
  const send = (msg: LiveCommand) => engine.handle(msg);
  send({ type: 'load', board, tryOut: [] });
  const outputs = (): Outputs => {
    const compiled = sent.filter((m) => m.type === 'compiled').at(-1)!;
    const state = sent.filter((m) => m.type === 'state').at(-1)!;
    expect(sent.filter((m) => m.type === 'error')).toEqual([]);
    return Object.fromEntries(compiled.outputs.map((p) => [p.label, state.values[p.partId]]));
  };
  return { send, outputs };
}

async function cliTrace(name: string, clock: string, cycles: number): Promise<Outputs[]> {
  const r = await runCli(['simulate', example(name), '--clock', clock, '--cycles', String(cycles)]);
  expect(r.stderr).toBe('');
  expect(r.code).toBe(0);
  const trace: { cycle: number; outputs: Outputs }[] = JSON.parse(r.stdout).trace;
  expect(trace.map((t) => t.cycle)).toEqual(Array.from({ length: cycles }, (_, i) => i + 1));
  return trace.map((t) => t.outputs);
}

describe('bench and simulate --clock', () => {
  it('agree cycle for cycle on the 4-bit ripple counter, which counts 0, 1, 2, … mod 16', async () => {
    const cycles = 20;
    const b = bench(load('ripple-counter-4bit'));
    const stepped: Outputs[] = [];
    for (let k = 1; k <= cycles; k++) {
      b.send({ type: 'clock', action: 'step' });
      stepped.push(b.outputs());
    }
    const printed = await cliTrace('ripple-counter-4bit', 'CLK', cycles);
    expect(stepped).toEqual(printed);
    // a 4-bit ripple counter reads k mod 16 after k clock cycles, from 0 at power-on (common practice, no source)
    const counts = stepped.map((o) => Number.parseInt(`${o.Q3}${o.Q2}${o.Q1}${o.Q0}`, 2));
    expect(counts).toEqual(Array.from({ length: cycles }, (_, i) => (i + 1) % 16));
  });

  it('agree press for press on the debounced clock, PUSH pressed and released as the clock input', async () => {
    // the example has no clock part: the bench presses and releases PUSH (a changeover contact whose
    // throws bounce), the command line drives PUSH as its --clock
    const cycles = 8;
    const b = bench(load('debounced-clock'));
    const pressed: Outputs[] = [];
    for (let k = 1; k <= cycles; k++) {
      b.send({ type: 'set-input', partId: 'push', value: true });
      b.send({ type: 'set-input', partId: 'push', value: false });
      pressed.push(b.outputs());
    }
    const printed = await cliTrace('debounced-clock', 'PUSH', cycles);
    expect(pressed).toEqual(printed);
    // released: the raw contact reads low after every press, and the two flip-flops count the presses
    // mod 4 (ripple counter of rising-edge D flip-flops; common practice, no source) — the bounce never
    // adds a count
    expect(pressed.map((o) => o.RAW)).toEqual(Array(cycles).fill('0'));
    expect(pressed.map((o) => Number.parseInt(`${o.C1}${o.C0}`, 2))).toEqual(Array.from({ length: cycles }, (_, i) => (i + 1) % 4));
  });
});
