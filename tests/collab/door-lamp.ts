/** A board shared by the collaboration tests of modules. */
import type { BoardFile } from '../../shared/board';

// Room 14's door lamp through an inverter module: OPEN lights while KEY is off (NOT, common practice, no source).
export const DOOR_LAMP: BoardFile = {
  format: 'gatefold-board', version: 1, title: 'Room 14 door lamp', family: 'ideal',
  parts: [
    { id: 'a', kind: 'switch', label: 'KEY', on: false, x: 0, y: 0 },
    { id: 'u1', kind: 'module', module: 'inv', x: 160, y: 0 },
    { id: 'l1', kind: 'lamp', label: 'OPEN', x: 400, y: 0 },
  ],
  wires: [{ id: 'w1', from: 'a.out', to: 'u1.A' }, { id: 'w2', from: 'u1.Y', to: 'l1.in' }],
  modules: [{
    id: 'inv', title: 'Inverter',
    parts: [
      { id: 'pa', kind: 'port', dir: 'in', label: 'A', x: 0, y: 0 },
      { id: 'g1', kind: 'not', x: 120, y: 0 },
      { id: 'py', kind: 'port', dir: 'out', label: 'Y', x: 240, y: 0 },
    ],
    wires: [{ id: 'w1', from: 'pa.out', to: 'g1.in0' }, { id: 'w2', from: 'g1.out', to: 'py.in' }],
  }],
};
