/**
 * Boards for the scaling rows of the analysis benchmark: a ring of gates and a shift register of
 * six-NAND flip-flops, each of about `gates` gates. Both are loops, so `analyze` takes their outputs from
 * the event simulator and the levelising step has to find the loops.
 */
import type { BoardFile } from '../shared/board';
import { BoardBuilder } from '../tests/sim/board-builder';
import { ringOscillator } from '../tests/sim/circuits';

/** A ring of `gates` inverting stages (a NAND enabled by the switch EN, then NOTs), lamp Y on the last. */
export function ringBoard(gates: number): BoardFile {
  return ringOscillator(gates, new BoardBuilder('ideal', `Ring of ${gates} gates`)).board();
}

/**
 * A shift register of ⌊gates / 6⌋ six-NAND edge-triggered D flip-flops (the structure of the 7474 logic
 * diagram, as in tests/sim/circuits.ts sixNandDff): switches D and CLK, each stage's Q to the next D,
 * lamp Q on the last stage.
 */
export function shiftRegisterBoard(gates: number): BoardFile {
  const b = new BoardBuilder('ideal', `Shift register of ${Math.floor(gates / 6)} six-NAND flip-flops`);
  b.switch('d', 'D').switch('clk', 'CLK');
  const stages = Math.max(1, Math.floor(gates / 6));
  let d = 'd.out';
  for (let s = 0; s < stages; s++) {
    const g = (k: number) => `s${s}g${k}`;
    b.gate(g(1), 'nand', [`${g(2)}.out`, `${g(4)}.out`]);
    b.gate(g(2), 'nand', [`${g(1)}.out`, 'clk.out']);
    b.gate(g(3), 'nand', ['clk.out', `${g(2)}.out`, `${g(4)}.out`]);
    b.gate(g(4), 'nand', [d, `${g(3)}.out`]);
    b.gate(g(5), 'nand', [`${g(2)}.out`, `${g(6)}.out`]);
    b.gate(g(6), 'nand', [`${g(3)}.out`, `${g(5)}.out`]);
    d = `${g(5)}.out`;
  }
  return b.lamp('q', 'Q', d).board();
}
