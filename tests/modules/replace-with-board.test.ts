import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import * as Y from 'yjs';
import { replaceWithBoard } from '../../shared/board';
import { boardToDoc, docToBoard } from '../../shared/board';
import { parseBoardFile } from '../../shared/board';
import type { BoardFile } from '../../shared/board';

const example = (name: string): BoardFile => {
  const parsed = parseBoardFile(JSON.parse(readFileSync(new URL(`../../examples/${name}.gatefold.json`, import.meta.url), 'utf8')));
  if (!parsed.ok) throw new Error(parsed.problems.map((p) => p.message).join('; '));
  return parsed.board;
};

describe('replaceWithBoard', () => {
  it('brings modules along: a flat board becomes one with modules and back (restore and import rely on it)', () => {
    const flat = example('half-adder');
    const nested = example('one-bit-processor');
    expect(nested.modules?.length).toBeGreaterThan(0);
    const doc = new Y.Doc();
    boardToDoc(flat, doc);
    replaceWithBoard(doc, nested, 'test');
    expect(docToBoard(doc)).toEqual(docToBoard((() => { const d = new Y.Doc(); boardToDoc(nested, d); return d; })()));
    replaceWithBoard(doc, flat, 'test');
    expect(docToBoard(doc).modules ?? []).toEqual([]);
    expect(docToBoard(doc).parts.map((p) => p.id)).toEqual(flat.parts.map((p) => p.id));
  });

  it('leaves an unchanged module alone (no update when nothing differs)', () => {
    const nested = example('one-bit-processor');
    const doc = new Y.Doc();
    boardToDoc(nested, doc);
    let updates = 0;
    doc.on('update', () => updates++);
    replaceWithBoard(doc, nested, 'test');
    expect(updates).toBe(0);
  });
});
