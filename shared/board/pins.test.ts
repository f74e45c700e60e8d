import { describe, expect, it } from 'vitest';
import { allPins, pinRef, pinSide, pinsOfPart, splitPinRef } from '.';

// Pin names and counts: the kinds-and-pins table of CONTRACTS §1.
describe('pin references', () => {
  it('writes and splits part.pin, the pin after the last dot', () => {
    expect(pinRef('g1', 'out')).toBe('g1.out');
    expect(splitPinRef('g1.in0')).toEqual({ part: 'g1', pin: 'in0' });
    expect(splitPinRef('u3.g2.out')).toEqual({ part: 'u3.g2', pin: 'out' });
    expect(splitPinRef(pinRef('a.b', 'q'))).toEqual({ part: 'a.b', pin: 'q' });
    for (const bad of ['out', '.out', 'g1.', '']) expect(splitPinRef(bad), bad).toBeNull();
  });
});

describe('pinsOfPart', () => {
  it('reads a gate\'s input count, 2 when it has none', () => {
    expect(pinsOfPart({ kind: 'nand', inputs: 3 })).toEqual({ inputs: ['in0', 'in1', 'in2'], outputs: ['out'] });
    expect(pinsOfPart({ kind: 'and' }).inputs).toEqual(['in0', 'in1']);
    expect(allPins({ kind: 'dff' })).toEqual(['d', 'clk', 'q', 'qn']);
    expect(allPins({ kind: 'switch' })).toEqual(['out', 'outn']);
  });

  it('tells a read pin from a driven one', () => {
    expect(pinSide({ kind: 'mux2' }, 'sel')).toBe('in');
    expect(pinSide({ kind: 'mux2' }, 'out')).toBe('out');
    expect(pinSide({ kind: 'or', inputs: 2 }, 'in2')).toBeNull();
  });
});
