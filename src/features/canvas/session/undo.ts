/**
 * Per-user undo: a Y.UndoManager over the board's maps that tracks only this session's own origin, so
 * undo never removes a collaborator's edit. captureTimeout 0: every named edit (one transaction) is one
 * undo step, so two quick edits, say a switch flip and a delete, are never undone together.
 */
import * as Y from 'yjs';
import { metaMap, modulesMap, partsMap, wiresMap } from '../../../../shared/board';

export function createUndoManager(doc: Y.Doc, origin: object): Y.UndoManager {
  // modules too: an edit inside a module is undone like any other (docs/decisions/004-modules.md)
  return new Y.UndoManager([partsMap(doc), wiresMap(doc), metaMap(doc), modulesMap(doc)], { trackedOrigins: new Set([origin]), captureTimeout: 0 });
}
