/** Gate-level circuits shared by the simulator tests. */
import { BoardBuilder } from './board-builder';

/**
 * Six-gate edge-triggered D flip-flop of NANDs (the structure of the 7474 logic diagram), without
 * preset and clear: G1 = NAND(G2, G4); G2 = NAND(G1, CLK); G3 = NAND(CLK, G2, G4); G4 = NAND(D, G3);
 * Q = G5 = NAND(G2, G6); Q' = G6 = NAND(G3, G5).
 * Source: NJIT Digital Commons "dld-animations" 84, Fig. 6.18, 2023.
 */
export function sixNandDff(b = new BoardBuilder()): BoardBuilder {
  b.switch('d', 'D').switch('clk', 'CLK');
  b.gate('g1', 'nand', ['g2.out', 'g4.out']);
  b.gate('g2', 'nand', ['g1.out', 'clk.out']);
  b.gate('g3', 'nand', ['clk.out', 'g2.out', 'g4.out']);
  b.gate('g4', 'nand', ['d.out', 'g3.out']);
  b.gate('g5', 'nand', ['g2.out', 'g6.out']);
  b.gate('g6', 'nand', ['g3.out', 'g5.out']);
  return b.lamp('q', 'Q', 'g5.out').lamp('qn', 'QN', 'g6.out');
}

/** SR latch of two cross-coupled NOR gates: Q = NOR(R, Q'), Q' = NOR(S, Q). */
export function norSrLatch(b = new BoardBuilder()): BoardBuilder {
  b.switch('s', 'S').switch('r', 'R');
  b.gate('n1', 'nor', ['r.out', 'n2.out']);
  b.gate('n2', 'nor', ['s.out', 'n1.out']);
  return b.lamp('q', 'Q', 'n1.out').lamp('qn', 'QN', 'n2.out');
}

/**
 * Ring of `stages` inverting stages: the first is a NAND whose other input is the enable switch EN
 * (EN = 0 holds the ring in a known state; EN = 1 turns the NAND into an inverter), the rest are NOTs.
 */
export function ringOscillator(stages: number, b = new BoardBuilder()): BoardBuilder {
  b.switch('en', 'EN');
  b.gate('r0', 'nand', ['en.out', `r${stages - 1}.out`]);
  for (let i = 1; i < stages; i++) b.gate(`r${i}`, 'not', [`r${i - 1}.out`]);
  return b.lamp('y', 'Y', `r${stages - 1}.out`);
}

/** A ring of `n` plain inverters. */
export function inverterRing(n: number, b = new BoardBuilder()): BoardBuilder {
  for (let i = 0; i < n; i++) b.gate(`i${i}`, 'not', [`i${(i + n - 1) % n}.out`]);
  return b.lamp('y', 'Y', `i${n - 1}.out`);
}

/**
 * 4-bit ripple counter of rising-edge D flip-flops: each Q' to its own D and to the next stage's clock.
 * Common practice, no source.
 */
export function rippleCounter(b = new BoardBuilder()): BoardBuilder {
  b.part({ id: 'ck', kind: 'clock', label: 'CLK' });
  for (let i = 0; i < 4; i++) {
    b.part({ id: `f${i}`, kind: 'dff' });
    b.wire(`f${i}.qn`, `f${i}.d`);
    b.wire(i === 0 ? 'ck.out' : `f${i - 1}.qn`, `f${i}.clk`);
  }
  for (let i = 3; i >= 0; i--) b.lamp(`l${i}`, `Q${i}`, `f${i}.q`);
  return b;
}
