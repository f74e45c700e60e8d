import { describe, expect, it } from 'vitest';
import { levelise } from '../../shared/analysis';
import { compileBoard } from '../../shared/sim';
import { BoardBuilder } from '../sim/board-builder';
import { ringOscillator, sixNandDff } from '../sim/circuits';

describe('levelise', () => {
  it('lists every stage of a ring as on a loop, and a gate after the ring as not', () => {
    const b = ringOscillator(5);
    b.gate('after', 'not', ['r4.out']).lamp('z', 'Z', 'after.out');
    const lev = levelise(compileBoard(b.board()));
    expect(lev.loopParts).toEqual(['r0', 'r1', 'r2', 'r3', 'r4']);
    expect(lev.order.map((p) => p.id)).toEqual([]);
  });

  it('finds both cross-coupled pairs of the six-NAND flip-flop (G1/G2 with G3/G4, and G5/G6)', () => {
    const netlist = compileBoard(sixNandDff().board());
    const lev = levelise(netlist);
    expect(lev.loopParts.sort()).toEqual(['g1', 'g2', 'g3', 'g4', 'g5', 'g6']);
    expect(lev.stateful[netlist.netOf('g5', 'out')]).toBe(1);
  });

  it('finds a gate reading its own output as a loop of one', () => {
    const b = new BoardBuilder().switch('a', 'A');
    b.gate('g', 'or', ['a.out', 'g.out']).gate('h', 'not', ['a.out']).lamp('y', 'Y', 'g.out').lamp('n', 'N', 'h.out');
    const netlist = compileBoard(b.board());
    const lev = levelise(netlist);
    expect(lev.loopParts).toEqual(['g']);
    expect(lev.order.map((p) => p.id)).toEqual(['h']);
    expect(lev.stateful[netlist.netOf('h', 'out')]).toBe(0);
  });
});
