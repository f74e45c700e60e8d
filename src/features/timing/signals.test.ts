import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { BoardFileSchema, parseBoardFile, type BoardFile } from '../../../shared/board';
import { LiveEngine, type LiveUpdate, type Timers } from '../../../shared/sim';
import { defaultSignals, signalChoices } from './signals';

type Compiled = Extract<LiveUpdate, { type: 'compiled' }>;
type State = Extract<LiveUpdate, { type: 'state' }>;

const stillTimers: Timers = { now: () => 0, setTimeout: () => undefined, clearTimeout: () => undefined };

/** Loads `board` in a live engine as the bench does and subscribes the strip's default signals. */
function run(board: BoardFile) {
  const sent: LiveUpdate[] = [];
  const engine = new LiveEngine((m) => sent.push(m), stillTimers);
  engine.handle({ type: 'load', board, tryOut: [] });
  const compiled = sent.find((m): m is Compiled => m.type === 'compiled')!;
  const defaults = defaultSignals(compiled);
  engine.handle({ type: 'subscribe', signals: defaults });
  const rows = [...sent].reverse().find((m): m is State => m.type === 'state' && !!m.traceReset)?.traceReset?.signals;
  return { compiled, defaults, rows };
}

/**
 * A program store in miniature: module `bits` drives its ports B0 = 1 and B1 = 0 from constants; the board
 * has two instances of it (u1, u2), a switch S, a clock CLK, a button BTN, its own constant ONE, and lamps
 * on the instances' bits and on the inputs. Invented for this test.
 */
function storeBoard(): BoardFile {
  return BoardFileSchema.parse({
    format: 'gatefold-board', version: 1, title: 'Two words of constants', family: 'ideal',
    parts: [
      { id: 's', kind: 'switch', label: 'S', on: true },
      { id: 'clk', kind: 'clock', label: 'CLK' },
      { id: 'btn', kind: 'button', label: 'BTN', pressed: false },
      { id: 'one', kind: 'const', label: 'ONE', value: 1 },
      { id: 'u1', kind: 'module', module: 'bits' },
      { id: 'u2', kind: 'module', module: 'bits' },
      { id: 'g1', kind: 'and', inputs: 2 },
      { id: 'g2', kind: 'and', inputs: 2 },
      { id: 'y', kind: 'lamp', label: 'Y' },
      { id: 'p', kind: 'probe', label: 'P' },
      { id: 'z', kind: 'lamp', label: 'Z' },
    ],
    wires: [
      { id: 'w1', from: 's.out', to: 'g1.in0' }, { id: 'w2', from: 'u1.B0', to: 'g1.in1' }, { id: 'w3', from: 'g1.out', to: 'y.in' },
      { id: 'w4', from: 'u2.B1', to: 'p.in' },
      { id: 'w5', from: 'btn.out', to: 'g2.in0' }, { id: 'w6', from: 'one.out', to: 'g2.in1' }, { id: 'w7', from: 'g2.out', to: 'z.in' },
    ],
    modules: [{
      id: 'bits', title: 'Two bits',
      parts: [
        { id: 'c0', kind: 'const', value: 1 }, { id: 'c1', kind: 'const', value: 0 },
        { id: 'b0', kind: 'port', dir: 'out', label: 'B0' }, { id: 'b1', kind: 'port', dir: 'out', label: 'B1' },
      ],
      wires: [{ id: 'm1', from: 'c0.out', to: 'b0.in' }, { id: 'm2', from: 'c1.out', to: 'b1.in' }],
    }],
  });
}

describe('the timing strip’s signals', () => {
  it('records by default the inputs that can change and the outputs, not the constants inside a module', () => {
    const { compiled, defaults, rows } = run(storeBoard());
    expect(defaults).toEqual(['S', 'CLK', 'BTN', 'Y', 'P', 'Z']);
    // what the engine records is exactly that choice, row by row
    expect(rows).toEqual(defaults);
    // the picker still offers everything: the board's own constant under inputs, the inner constants' nets under nets
    const choices = signalChoices(compiled);
    expect(choices.find((s) => s.name === 'ONE')?.group).toBe('input');
    expect(choices.filter((s) => s.name.startsWith('u')).map((s) => [s.name, s.group])).toEqual(expect.arrayContaining([
      ['u1/c0_out', 'net'], ['u1/c1_out', 'net'], ['u2/c0_out', 'net'],
    ]));
    expect(choices.filter((s) => s.group !== 'net').map((s) => s.name)).toEqual(['S', 'CLK', 'BTN', 'ONE', 'Y', 'P', 'Z']);
    expect(new Set(choices.map((s) => s.name)).size).toBe(choices.length);
  });

  it('records every input and output of a board without constants, as before', () => {
    const board = storeBoard();
    const flat: BoardFile = {
      ...board,
      modules: undefined,
      parts: board.parts.filter((p) => p.kind !== 'module' && p.kind !== 'const' && p.id !== 'p'),
      wires: board.wires.filter((w) => !/^(u1|u2|one|p)\./.test(w.from) && !/^(u1|u2|one|p)\./.test(w.to)),
    };
    const { compiled, defaults } = run(flat);
    expect(defaults).toEqual(signalChoices(compiled).filter((s) => s.group !== 'net').map((s) => s.name));
    expect(defaults).toEqual(['S', 'CLK', 'BTN', 'Y', 'Z']);
  });

  it('leaves the 1-bit processor demo’s program store out of the default rows', () => {
    const file = parseBoardFile(JSON.parse(readFileSync(new URL('../../../examples/one-bit-processor.gatefold.json', import.meta.url), 'utf8')));
    if (!file.ok) throw new Error(`the demo does not parse: ${JSON.stringify(file.problems).slice(0, 300)}`);
    const { compiled, defaults, rows } = run(file.board);
    // the bench lists the board's own inputs: DIN, CLK and its constant, none of the 16 program bits
    expect(compiled.inputs.map((p) => p.kind)).toEqual(['switch', 'clock', 'const']);
    expect(compiled.inputs.some((p) => p.partId.includes('/'))).toBe(false);
    // the strip: DIN, CLK and the eleven lamps
    expect(defaults.slice(0, 2)).toEqual(['DIN', 'CLK']);
    expect(defaults).toHaveLength(13);
    expect(defaults).toEqual(expect.arrayContaining(['STEP0', 'STEP1', 'OUT']));
    expect(rows).toEqual(defaults);
  });
});
