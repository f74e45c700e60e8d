/**
 * The strict document check against the import's own rule (parseBoardFile of the exported file), on
 * random well-formed but mostly invalid Yjs edits: whatever the edit, the check never throws; a
 * document it passes exports a valid file; the incremental check of what an edit touched agrees with
 * the full check; quarantining always leaves a valid board.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import * as Y from 'yjs';
import { checkDoc, checkDocChanges, docToBoard, emptyTouched, parseBoardFile, quarantineDoc, touchedBy } from '../../shared/board';
import { applyRawEdits, rawEdit, startingBoard } from './random-edits';

function freshBoard(): Y.Doc {
  const doc = new Y.Doc();
  startingBoard(doc);
  return doc;
}

describe('checkDoc on random raw edits', () => {
  it('incremental = full on shape problems; no problems ⇒ the export passes parseBoardFile; quarantine ⇒ valid', () => {
    fc.assert(
      fc.property(fc.array(rawEdit, { minLength: 1, maxLength: 4 }), (edits) => {
        const doc = freshBoard();
        const touched = emptyTouched();
        doc.on('afterTransaction', (tr: Y.Transaction) => touchedBy(tr, touched));
        applyRawEdits(doc, edits);
        const full = checkDoc(doc);
        const shapeFull = full.filter((p) => p.kind === 'shape').map((p) => p.message).sort();
        const shapeIncremental = checkDocChanges(doc, touched).map((p) => p.message).sort();
        expect(shapeIncremental).toEqual(shapeFull);
        if (!full.length) {
          const parsed = parseBoardFile(docToBoard(doc));
          expect(parsed.ok ? [] : parsed.problems).toEqual([]);
        }
        quarantineDoc(doc, null);
        expect(checkDoc(doc)).toEqual([]);
        const parsed = parseBoardFile(docToBoard(doc));
        expect(parsed.ok ? [] : parsed.problems).toEqual([]);
        doc.destroy();
      }),
      { numRuns: 400, seed: 20261210 },
    );
  });
});
