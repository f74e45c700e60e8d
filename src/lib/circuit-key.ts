import type { BoardFile } from '../../shared/board';

/**
 * What decides a board's circuit, as one string: its family, its parts and wires without their places
 * on the sheet, and its modules likewise (an edit inside a module changes the circuit too). Work that
 * depends only on the circuit (test vectors, the build sheet) is redone when this changes, not on a move.
 */
export function circuitKey(board: BoardFile): string {
  const circuit = (c: Pick<BoardFile, 'parts' | 'wires'>) => [c.parts.map(({ x: _x, y: _y, ...p }) => p), c.wires.map((w) => [w.from, w.to])];
  return JSON.stringify([board.family, circuit(board), (board.modules ?? []).map((m) => [m.id, circuit(m)])]);
}
