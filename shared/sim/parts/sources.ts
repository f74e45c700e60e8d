/**
 * Input parts: toggle switch (out and its complement outn, as a changeover switch gives), push button
 * (a changeover contact: out the normally-open throw, outn the normally-closed one — complements except
 * while a throw bounces, see bounce.ts), clock, constant. They are set from outside (Simulator.setInput) and drive at once (no delay).
 */
import type { Part } from '../../board';
import { L0, L1, not4 } from '../codes';

/** Outputs of an input part at level v: out = v, and outn = not v for a switch or button. */
export function sourceOutputs(v: number, out: Uint8Array): void {
  out[0] = v;
  out[1] = not4(v);
}

/** The level an input part starts at: switch `on`, button `pressed`, const `value`, clock low. */
export function initialSourceLevel(part: Part): number {
  switch (part.kind) {
    case 'switch': return part.on ? L1 : L0;
    case 'button': return part.pressed ? L1 : L0;
    case 'const': return part.value === 1 ? L1 : L0;
    case 'clock': return L0;
    default: return L0;
  }
}
