/**
 * Contact bounce and the changeover-switch latch debouncer. Source: Raj Kamal, *Digital Systems:
 * Principles and Design*, Fig. 14.4 — a break-before-make changeover switch with its common to ground,
 * each throw to one input of a cross-coupled NAND latch with pull-ups; bounce on one contact leaves the
 * latch unchanged. Here the changeover switch is one push button (`out` its normally-open throw, `outn` its
 * normally-closed one; contact made = 1) and each pulled-up line is an inverter of a throw (line low while
 * the contact is made: common practice, no source).
 */
import { describe, expect, it } from 'vitest';
import { compileBoard, Simulator } from '../../shared/sim';
import { BoardBuilder } from './board-builder';

function debouncer() {
  const b = new BoardBuilder();
  b.part({ id: 'tb', kind: 'button', label: 'B', bounce: true });
  b.gate('sb', 'not', ['tb.out']).gate('rb', 'not', ['tb.outn']);
  b.gate('q', 'nand', ['sb.out', 'qn.out']).gate('qn', 'nand', ['rb.out', 'q.out']);
  b.lamp('lq', 'Q', 'q.out');
  return compileBoard(b.board());
}

function edges(levels: string[]): number {
  let n = 0;
  for (let i = 1; i < levels.length; i++) if (levels[i] !== levels[i - 1]) n++;
  return n;
}

describe('push-button contact bounce', () => {
  /** Changes of `out` and `outn` (time:level) for a press and a release. */
  function run(seed: number) {
    const netlist = compileBoard(new BoardBuilder().part({ id: 'b', kind: 'button', label: 'B', bounce: true }).board());
    const sim = new Simulator(netlist, { seed });
    const seen = { out: [] as string[], outn: [] as string[] };
    sim.settle();
    sim.onChange((t, net, level) => {
      if (net === netlist.netOf('b', 'out')) seen.out.push(`${t}:${level}`);
      if (net === netlist.netOf('b', 'outn')) seen.outn.push(`${t}:${level}`);
    });
    sim.setInput('b', 1); sim.settle();
    const afterPress = { out: [...seen.out], outn: [...seen.outn] };
    sim.setInput('b', 0); sim.settle();
    return { afterPress, all: seen, time: sim.time };
  }

  it('bounces only the throw the common meets, the same way for the same seed', () => {
    const { afterPress, all } = run(7);
    // press: the rest throw (outn) opens once, cleanly; the push throw (out) closes, bounces, rests closed
    expect(afterPress.outn).toHaveLength(1);
    expect(afterPress.outn[0].endsWith(':0')).toBe(true);
    expect(afterPress.out.length).toBeGreaterThanOrEqual(3);
    expect(afterPress.out.at(-1)?.endsWith(':1')).toBe(true);
    // release: out opens once, cleanly; outn closes, bounces, rests closed
    const outRelease = all.out.slice(afterPress.out.length);
    const outnRelease = all.outn.slice(afterPress.outn.length);
    expect(outRelease).toHaveLength(1);
    expect(outRelease[0].endsWith(':0')).toBe(true);
    expect(outnRelease.length).toBeGreaterThanOrEqual(3);
    expect(outnRelease.at(-1)?.endsWith(':1')).toBe(true);
    expect(run(7)).toEqual(run(7));
  });

  it('never closes both throws at once (break before make)', () => {
    for (const seed of [1, 2, 3, 7, 99]) {
      const { all } = run(seed);
      const events = [...all.out.map((e) => ['out', e] as const), ...all.outn.map((e) => ['outn', e] as const)]
        .map(([pin, e]) => ({ pin, t: Number(e.split(':')[0]), v: e.split(':')[1] }));
      const level = { out: '0', outn: '1' };
      for (const t of [...new Set(events.map((e) => e.t))].sort((a, b) => a - b)) {
        for (const e of events.filter((x) => x.t === t)) level[e.pin] = e.v;
        expect([t, level.out === '1' && level.outn === '1']).toEqual([t, false]);
      }
    }
  });
});

describe('changeover-switch latch debouncer', () => {
  for (const seed of [1, 2, 3, 99]) {
    it(`turns a bouncing contact into one clean edge each way (seed ${seed})`, () => {
      const netlist = debouncer();
      const sim = new Simulator(netlist, { seed });
      const q: string[] = [];
      const contact: string[] = [];
      sim.settle();
      expect(sim.outputValues().Q).toBe('0');
      sim.onChange((_t, net, level) => {
        if (net === netlist.netOf('q', 'out')) q.push(level);
        if (net === netlist.netOf('tb', 'out') || net === netlist.netOf('tb', 'outn')) contact.push(level);
      });
      // press: the common leaves the rest throw and meets the push throw, which bounces
      sim.setInput('tb', 1); expect(sim.settle().settled).toBe(true);
      expect(sim.outputValues().Q).toBe('1');
      // release: it leaves the push throw and meets the rest throw, which bounces
      sim.setInput('tb', 0); expect(sim.settle().settled).toBe(true);
      expect(sim.outputValues().Q).toBe('0');
      expect(edges(['0', ...contact])).toBeGreaterThanOrEqual(4);
      expect(q).toEqual(['1', '0']);
    });
  }
});
