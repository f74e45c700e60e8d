import { describe, expect, it } from 'vitest';
import { emptyTrace } from '../timing';
import { levelCode } from '../../../shared/sim';
import { applyTrace } from './trace-store';

describe('applyTrace', () => {
  it('starts a recording on the first reset and folds triples into compressed changes', () => {
    const c = levelCode;
    const first = applyTrace(emptyTrace(['OLD']), {
      traceReset: { signals: ['CLK', 'Q'], at: 5 },
      trace: [0, 5, c('0'), 1, 5, c('X'), 1, 7, c('0'), 0, 15, c('1'), 0, 15, c('1'), 1, 18, c('1')],
      edges: [15],
      time: 20,
    });
    expect(first.changed).toBe(true);
    expect(first.trace.start).toBe(5);
    expect(first.trace.signals.map((s) => s.name)).toEqual(['CLK', 'Q']);
    expect(first.trace.signals[0].changes).toEqual([{ t: 5, v: '0' }, { t: 15, v: '1' }]);
    expect(first.trace.signals[1].changes).toEqual([{ t: 5, v: 'X' }, { t: 7, v: '0' }, { t: 18, v: '1' }]);
    expect(first.trace.edges).toEqual([15]);
    expect(first.trace.end).toBe(20);

    const again = applyTrace(first.trace, { trace: [0, 25, c('1'), 5, 25, c('0')], edges: [], time: 20 });
    expect(again.trace).toBe(first.trace);
    expect(again.changed).toBe(false); // a repeat level and an unknown signal index change nothing
  });

  it('keeps the history of rows that stay when the rows change, in the new order', () => {
    const c = levelCode;
    const first = applyTrace(emptyTrace(), { traceReset: { signals: ['A', 'B'], at: 2 }, trace: [0, 2, c('0'), 1, 2, c('1'), 0, 9, c('1')], edges: [4], time: 10 }).trace;
    const next = applyTrace(first, { traceReset: { signals: ['N', 'A'], at: 10 }, trace: [0, 10, c('Z'), 1, 10, c('1')], edges: [], time: 10 });
    expect(next.trace.signals.map((s) => s.name)).toEqual(['N', 'A']);
    expect(next.trace.signals[1].changes).toEqual([{ t: 2, v: '0' }, { t: 9, v: '1' }]);
    expect(next.trace.signals[0].changes).toEqual([{ t: 10, v: 'Z' }]);
    expect([next.trace.start, next.trace.edges]).toEqual([2, [4]]);
  });

  it('drops everything on a fresh reset', () => {
    const c = levelCode;
    const first = applyTrace(emptyTrace(), { traceReset: { signals: ['A'], at: 0 }, trace: [0, 0, c('0'), 0, 5, c('1')], edges: [5], time: 8 }).trace;
    const next = applyTrace(first, { traceReset: { signals: ['A'], at: 8, fresh: true }, trace: [0, 8, c('1')], edges: [], time: 8 }).trace;
    expect(next.signals[0].changes).toEqual([{ t: 8, v: '1' }]);
    expect([next.start, next.edges]).toEqual([8, []]);
  });
});
