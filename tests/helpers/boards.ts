import type { BoardFile } from '../../shared/board';
import halfAdder from '../fixtures/half-adder.gatefold.json';

/** The half adder of CONTRACTS §1 (`tests/fixtures/half-adder.gatefold.json`), a fresh copy on each call. */
export function contractHalfAdder(): BoardFile {
  return structuredClone(halfAdder) as unknown as BoardFile;
}
