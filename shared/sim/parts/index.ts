/**
 * Evaluation of one part by kind (exhaustive). Inputs are read levels in `inp`, outputs are written
 * to `out`; storage parts keep their state in `st` from offset `o`.
 */
import type { PartKind } from '../../board';
import { evalBuffer, evalGate, evalNot } from './gates';
import { evalDLatch, evalSrLatch } from './latches';
import { evalDff } from './flip-flop';
import { evalMux2, evalMux4 } from './mux';

/** Bytes of state a part kind keeps. */
export function stateSize(kind: PartKind): number {
  switch (kind) {
    case 'srlatch': case 'dlatch': return 2;
    case 'dff': return 3;
    default: return 0;
  }
}

/**
 * Evaluates a non-input part: writes its output levels to out[0..]. Returns true when a built-in SR
 * latch met its release race (11 → 00).
 */
export function evaluatePart(kind: PartKind, inp: Uint8Array, n: number, st: Uint8Array, o: number, out: Uint8Array): boolean {
  switch (kind) {
    case 'buffer': out[0] = evalBuffer(inp[0]); return false;
    case 'not': out[0] = evalNot(inp[0]); return false;
    case 'and': case 'or': case 'nand': case 'nor': case 'xor': case 'xnor':
      out[0] = evalGate(kind, inp, n); return false;
    case 'mux2': out[0] = evalMux2(inp); return false;
    case 'mux4': out[0] = evalMux4(inp); return false;
    case 'srlatch': {
      const race = evalSrLatch(inp, st, o);
      out[0] = st[o]; out[1] = st[o + 1];
      return race;
    }
    case 'dlatch': evalDLatch(inp, st, o); out[0] = st[o]; out[1] = st[o + 1]; return false;
    case 'dff': evalDff(inp, st, o); out[0] = st[o]; out[1] = st[o + 1]; return false;
    // input parts are driven by setInput, indicators and notes drive nothing
    case 'switch': case 'button': case 'clock': case 'const':
    case 'lamp': case 'probe': case 'note':
    case 'port': case 'module': // never reach the simulator: compileBoard flattens them away
      return false;
    default: {
      const never: never = kind;
      throw new Error(`unknown part kind ${String(never)}`);
    }
  }
}
