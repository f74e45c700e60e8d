import { describe, expect, it } from 'vitest';
import { cycleAt, emptyTrace, levelAt, pushChange, readout, risingEdges, segmentsIn, type Change } from './trace';

describe('pushChange', () => {
  it('drops repeats of the current level and keeps time order', () => {
    const list: Change[] = [];
    expect(pushChange(list, 0, '0')).toBe(true);
    expect(pushChange(list, 5, '0')).toBe(false);
    expect(pushChange(list, 10, '1')).toBe(true);
    expect(list).toEqual([{ t: 0, v: '0' }, { t: 10, v: '1' }]);
    expect(() => pushChange(list, 3, '0')).toThrow(/earlier/);
  });

  it('lets a second change at the same time replace the first, and merges a zero-width glitch away', () => {
    const list: Change[] = [{ t: 0, v: '0' }];
    pushChange(list, 4, '1');
    pushChange(list, 4, 'X');
    expect(list).toEqual([{ t: 0, v: '0' }, { t: 4, v: 'X' }]);
    pushChange(list, 6, '1');
    pushChange(list, 6, 'X'); // back to X at the same instant: the 1 never lasted
    expect(list).toEqual([{ t: 0, v: '0' }, { t: 4, v: 'X' }]);
  });

  it('keeps only the newest changes past the limit', () => {
    const list: Change[] = [];
    for (let t = 0; t < 10; t++) pushChange(list, t, t % 2 ? '1' : '0', 4);
    expect(list.map((c) => c.t)).toEqual([6, 7, 8, 9]);
  });
});

describe('levelAt and readout', () => {
  const list: Change[] = [{ t: 0, v: '0' }, { t: 10, v: '1' }, { t: 25, v: 'Z' }];
  it('reads the last change at or before the time, X before the first', () => {
    expect(levelAt(list, -1)).toBe('X');
    expect(levelAt(list, 0)).toBe('0');
    expect(levelAt(list, 9.99)).toBe('0');
    expect(levelAt(list, 10)).toBe('1');
    expect(levelAt(list, 1e6)).toBe('Z');
    expect(levelAt([], 3)).toBe('X');
  });
  it('gives every signal of a trace in order', () => {
    const trace = emptyTrace(['A', 'Q']);
    trace.signals[0].changes.push(...list);
    trace.signals[1].changes.push({ t: 12, v: '1' });
    expect(readout(trace, 11)).toEqual([{ name: 'A', level: '1' }, { name: 'Q', level: 'X' }]);
    expect(readout(trace, 30)).toEqual([{ name: 'A', level: 'Z' }, { name: 'Q', level: '1' }]);
  });
});

describe('cycleAt', () => {
  it('counts rising edges at or before the time', () => {
    const edges = [10, 30, 50];
    expect(cycleAt(edges, 0)).toBe(0);
    expect(cycleAt(edges, 10)).toBe(1);
    expect(cycleAt(edges, 49)).toBe(2);
    expect(cycleAt(edges, 99)).toBe(3);
  });
});

describe('segmentsIn', () => {
  it('gives one segment per steady level inside the window, X before the first change', () => {
    const list: Change[] = [{ t: 5, v: '0' }, { t: 20, v: '1' }, { t: 60, v: '0' }];
    expect(segmentsIn(list, 0, 50, 1)).toEqual([
      { from: 0, to: 5, v: 'X' },
      { from: 5, to: 20, v: '0' },
      { from: 20, to: 50, v: '1' },
    ]);
    expect(segmentsIn(list, 30, 40, 1)).toEqual([{ from: 30, to: 40, v: '1' }]);
    expect(segmentsIn([], 0, 10, 1)).toEqual([{ from: 0, to: 10, v: 'X' }]);
  });

  it('collapses changes closer than a pixel into one busy segment', () => {
    // an oscillating net toggling every time unit, drawn at 10 units per pixel
    const list: Change[] = [{ t: 0, v: '0' }];
    for (let t = 100; t < 200; t++) pushChange(list, t, t % 2 ? '0' : '1');
    pushChange(list, 200, '1');
    const segs = segmentsIn(list, 0, 300, 10);
    expect(segs[0]).toEqual({ from: 0, to: 100, v: '0' });
    expect(segs.some((s) => s.v === 'busy' && s.from === 100 && s.to >= 199)).toBe(true);
    expect(segs[segs.length - 1]).toEqual({ from: 200, to: 300, v: '1' });
    expect(segs.length).toBeLessThanOrEqual(4);
  });
});

describe('risingEdges', () => {
  it('counts only 0 → 1 changes', () => {
    const list: Change[] = [{ t: 0, v: 'X' }, { t: 1, v: '1' }, { t: 2, v: '0' }, { t: 3, v: '1' }, { t: 4, v: 'Z' }, { t: 5, v: '1' }, { t: 6, v: '0' }, { t: 7, v: '1' }];
    expect(risingEdges(list)).toBe(2);
  });
});
