import { describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { boardToDoc, copyFragment, docToBoard, moduleDoc, pasteFragment, repairBoard, type BoardFile } from '../../../../shared/board';
import { fitFragmentToLevel, kindFitsLevel, leftOutNotice, placementRefusal } from './level-fit';

/** A top level with two switches, a clock, a gate and a lamp, and a module (one port in, one out, a NOT). */
const board: BoardFile = {
  format: 'gatefold-board', version: 1, title: 'Larkspur bench', family: 'ideal',
  parts: [
    { id: 'a', kind: 'switch', label: 'A', x: 40, y: 40, on: false },
    { id: 'b', kind: 'switch', label: 'B', x: 40, y: 120, on: true },
    { id: 'ck', kind: 'clock', label: 'CLK', x: 40, y: 200 },
    { id: 'g', kind: 'nand', inputs: 2, x: 200, y: 80 },
    { id: 'f', kind: 'dff', x: 200, y: 200 },
    { id: 'l', kind: 'lamp', label: 'L', x: 360, y: 80 },
    { id: 'u1', kind: 'module', module: 'inv', x: 360, y: 200 },
  ],
  wires: [
    { id: 'w1', from: 'a.out', to: 'g.in0' }, { id: 'w2', from: 'b.out', to: 'g.in1' }, { id: 'w3', from: 'g.out', to: 'l.in' },
    { id: 'w4', from: 'ck.out', to: 'f.clk' }, { id: 'w5', from: 'g.out', to: 'f.d' }, { id: 'w6', from: 'f.q', to: 'u1.I' },
  ],
  modules: [{
    id: 'inv', title: 'Inverter',
    parts: [{ id: 'pi', kind: 'port', dir: 'in', label: 'I', x: 0, y: 0 }, { id: 'n', kind: 'not', x: 100, y: 0 }, { id: 'po', kind: 'port', dir: 'out', label: 'O', x: 200, y: 0 }],
    wires: [{ id: 'm1', from: 'pi.out', to: 'n.in0' }, { id: 'm2', from: 'n.out', to: 'po.in' }],
  }],
};

describe('what a level may hold', () => {
  it('keeps switches, buttons and clocks out of a module and ports off the top level', () => {
    for (const kind of ['switch', 'button', 'clock'] as const) {
      expect(kindFitsLevel(kind, true)).toBe(false);
      expect(kindFitsLevel(kind, false)).toBe(true);
    }
    expect(kindFitsLevel('const', true)).toBe(true); // a constant is no input from outside
    expect(kindFitsLevel('port', true)).toBe(true);
    expect(kindFitsLevel('port', false)).toBe(false);
    expect(placementRefusal('nand', true)).toBeNull();
    expect(placementRefusal('switch', true)).toBe('A switch cannot go here. Switches, buttons and clocks stay on the top level: a module takes its inputs through ports.');
    expect(placementRefusal('port', false)).toMatch(/^A port cannot go here\. Ports belong inside a module/);
  });

  it('pastes a selection into an open module without its switches and clock, and says what was left out and why', () => {
    const doc = new Y.Doc();
    boardToDoc(board, doc);
    const fragment = copyFragment(doc, ['a', 'b', 'ck', 'g', 'f', 'l']);
    const fit = fitFragmentToLevel(fragment, true);
    expect(fit.leftOut.map((p) => p.id)).toEqual(['a', 'b', 'ck']);
    // wires to what was left out go with it; the wires between the rest stay
    expect(fit.fragment.wires.map((w) => w.id).sort()).toEqual(['w3', 'w5']);
    expect(leftOutNotice(fit.leftOut, true, fit.fragment.parts.length)).toBe(
      'Pasted 3 part(s). Left out 2 switches (A, B) and 1 clock (CLK). Switches, buttons and clocks stay on the top level: a module takes its inputs through ports.',
    );

    const inside = moduleDoc(doc, 'inv');
    pasteFragment(inside, fit.fragment, { x: 0, y: 300 }, 'me');
    const module = docToBoard(doc).modules!.find((m) => m.id === 'inv')!;
    expect(module.parts.map((p) => p.kind).sort()).toEqual(['dff', 'lamp', 'nand', 'not', 'port', 'port']);
    expect(module.wires).toHaveLength(4);
    // the room's own repair (what the server runs after an edit inside a module) finds nothing to remove
    expect(repairBoard(doc, 'server').parts).toEqual([]);
    // the top level is as it was
    expect(docToBoard(doc).parts.map((p) => p.id)).toEqual(board.parts.map((p) => p.id));

    // the whole fragment pasted as it was: the repair would take the switches and the clock out again
    const other = new Y.Doc();
    boardToDoc(board, other);
    pasteFragment(moduleDoc(other, 'inv'), fragment, { x: 0, y: 300 }, 'me');
    expect(repairBoard(other, 'server').parts).toHaveLength(3);
  });

  it('leaves a fragment alone when everything fits, and refuses a module port pasted on the top level', () => {
    const doc = new Y.Doc();
    boardToDoc(board, doc);
    const plain = copyFragment(doc, ['g', 'l']);
    expect(fitFragmentToLevel(plain, true)).toEqual({ fragment: plain, leftOut: [] });
    expect(fitFragmentToLevel(plain, false)).toEqual({ fragment: plain, leftOut: [] });

    const fromModule = copyFragment(moduleDoc(doc, 'inv'), ['pi', 'n']);
    const fit = fitFragmentToLevel(fromModule, false);
    expect(fit.fragment.parts.map((p) => p.id)).toEqual(['n']);
    expect(fit.fragment.wires).toEqual([]);
    expect(leftOutNotice(fit.leftOut, false, 1)).toMatch(/^Pasted 1 part\(s\)\. Left out 1 port \(I\)\. Ports belong inside a module/);
    expect(leftOutNotice(fitFragmentToLevel(copyFragment(doc, ['a']), true).leftOut, true, 0)).toMatch(/^Nothing pasted\. Left out 1 switch \(A\)\./);
  });
});
