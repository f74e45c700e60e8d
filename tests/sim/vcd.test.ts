/**
 * VCD writer (IEEE Std 1364 four-state VCD; keywords $date $version $timescale $scope $var $upscope
 * $enddefinitions $dumpvars — from memory, CHECKS.md "Formats"), read back with the npm `vcd-stream`
 * parser as an independent reader.
 */
import { describe, expect, it } from 'vitest';
import { compileBoard, Simulator, timescaleFor, toVcd, vcdId, type Level, type VcdSample } from '../../shared/sim';
import { ringOscillator } from './circuits';
import { readVcd } from './vcd-read';

describe('toVcd', () => {
  it('writes the keywords of the format, each closed by $end', () => {
    const text = toVcd([{ time: 3, signal: 0, level: '1' }], [{ name: 'A' }], { timescale: '10 ns', date: 'd', version: 'v' });
    for (const kw of ['$date', '$version', '$timescale 10 ns $end', '$scope module gatefold $end', '$var wire 1 ! A $end', '$upscope $end', '$enddefinitions $end', '$dumpvars']) {
      expect(text).toContain(kw);
    }
    expect(text).toMatch(/#0\n\$dumpvars\nx!\n\$end\n#3\n1!\n$/);
  });

  it('gives every signal its own short identifier code, past one character too', () => {
    const ids = Array.from({ length: 500 }, (_, i) => vcdId(i));
    expect(new Set(ids).size).toBe(500);
    expect(ids.every((id) => /^[!-~]+$/.test(id))).toBe(true);
  });

  it('picks a timescale for a family time unit', () => {
    expect(timescaleFor(1)).toBe('1 ns');
    expect(timescaleFor(10)).toBe('10 ns');
    expect(timescaleFor(100_000)).toBe('100 us');
  });

  it('reads back with vcd-stream: names, scopes, four values and times', async () => {
    const signals = [{ name: 'A' }, { name: 'B' }, { name: 'n1', scope: 'nets' }, { name: 'has space' }];
    const levels: Level[] = ['0', '1', 'X', 'Z'];
    const samples: VcdSample[] = [];
    for (let t = 1; t <= 20; t++) samples.push({ time: t * 5, signal: t % 4, level: levels[(t * 7) % 4] });
    const text = toVcd(samples, signals, { initial: ['0', '1', 'X', 'Z'], timescale: '1 ns' });
    const read = await readVcd(text);
    expect(read.timescale).toBe('1 ns');
    expect([...read.signals.keys()].sort()).toEqual(['gatefold.nets/n1', 'gatefold/A', 'gatefold/B', 'gatefold/has_space']);
    // expected changes: start values, then each sample that differs from the level before it
    const current: Level[] = ['0', '1', 'X', 'Z'];
    const expected: [number, string][][] = current.map((l) => [[0, l]]);
    for (const s of samples) if (current[s.signal] !== s.level) { current[s.signal] = s.level; expected[s.signal].push([s.time, s.level]); }
    signals.forEach((_, i) => expect(read.changes.get(vcdId(i))).toEqual(expected[i]));
  });

  it('dumps a simulated ring oscillator whose read-back period is 2·N·t_pd (Rabaey et al. 2003, from memory)', async () => {
    const netlist = compileBoard(ringOscillator(3).board());
    const sim = new Simulator(netlist);
    sim.settle();
    const samples: VcdSample[] = [];
    const signal = netlist.outputs[0].inputs[0];
    sim.onChange((time, net, level) => { if (net === signal) samples.push({ time, signal: 0, level }); });
    const start = sim.time;
    const initial = [sim.level(signal)];
    sim.setInput('en', 1);
    sim.runFor(60);
    const read = await readVcd(toVcd(samples, [{ name: 'Y' }], { initial, start }));
    const rises = read.changes.get(vcdId(0))!.filter(([, l]) => l === '1').map(([t]) => t);
    expect(rises.length).toBeGreaterThan(5);
    expect(new Set(rises.slice(1).map((t, i) => t - rises[i]))).toEqual(new Set([6]));
  });
});
