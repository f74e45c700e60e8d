import { describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { copyFragment, pasteFragment } from '../../../../shared/board';
import { boardToDoc, docToBoard } from '../../../../shared/board';
import { fragmentOrigin, parseFragment, rememberFragment, rememberedFragment } from './clipboard';

const board = {
  format: 'gatefold-board' as const, version: 1 as const, title: 'Latch', family: 'ideal' as const,
  parts: [
    { id: 's', kind: 'switch' as const, label: 'S', x: 60, y: 80, on: false },
    { id: 'q', kind: 'lamp' as const, label: 'Q', x: 220, y: 40 },
  ],
  wires: [{ id: 'w1', from: 's.out', to: 'q.in' }],
};

describe('canvas clipboard', () => {
  it('carries a fragment as JSON text between two documents (another board or tab)', () => {
    const a = new Y.Doc();
    boardToDoc(board, a);
    const text = rememberFragment(copyFragment(a, ['s', 'q']));
    expect(parseFragment(text)).toEqual(rememberedFragment());
    const fragment = parseFragment(text); // what the other tab's paste event reads
    expect(fragment).not.toBeNull();
    expect(fragmentOrigin(fragment!)).toEqual({ x: 60, y: 40 });
    const b = new Y.Doc();
    boardToDoc(board, b);
    const pasted = pasteFragment(b, fragment!, { x: 40, y: 40 }, {});
    const after = docToBoard(b);
    expect(after.parts).toHaveLength(4);
    expect(pasted.wireIds).toHaveLength(1);
    expect(after.parts.filter((p) => p.kind === 'lamp').map((p) => p.label).sort()).toEqual(['Q', 'Q_2']);
  });

  it('refuses text that is not a fragment', () => {
    expect(parseFragment('hello')).toBeNull();
    expect(parseFragment(JSON.stringify(board))).toBeNull();
    expect(parseFragment(null)).toBeNull();
  });
});
