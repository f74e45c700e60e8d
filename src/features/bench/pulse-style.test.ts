import { describe, expect, it } from 'vitest';
import { oscillatingOutputIds, pulseCss, pulsingWireIds } from './pulse-style';

describe('pulsing wires', () => {
  const wires = [{ id: 'w1', from: 'r1.out', to: 'r2.in0' }, { id: 'w2', from: 'a.out', to: 'g.in0' }, { id: 'w"3', from: 'g.out', to: 'r1.in1' }];
  it('picks every wire with an end on a pulsing pin', () => {
    expect(pulsingWireIds(wires, new Set(['r2.in0', 'r1.in1']))).toEqual(['w1', 'w"3']);
    expect(pulsingWireIds(wires, new Set())).toEqual([]);
  });
  it('targets each edge by its data-id, quoting ids safely, and nothing when no net pulses', () => {
    const css = pulseCss(['w1', 'w"3']);
    expect(css).toContain('.react-flow__edge[data-id="w1"] .react-flow__edge-path');
    expect(css).toContain('[data-id="w\\"3"]');
    expect(css).toContain('animation: gf-net-pulse');
    expect(pulseCss([])).toBe('');
  });
});

describe('oscillating lamps', () => {
  it('picks the lamps and probes on a pulsing net and makes their bulbs pulse in the X colour', () => {
    expect(oscillatingOutputIds([{ partId: 'y' }, { partId: 'z' }], new Set(['y.in', 'g.out']))).toEqual(['y']);
    const css = pulseCss([], ['y']);
    expect(css).toContain('.react-flow__node[data-id="y"] .gf-bulb { fill: #e040a0');
    expect(css).toContain('.react-flow__node[data-id="y"] .gf-glow { display: none; }');
  });
});
