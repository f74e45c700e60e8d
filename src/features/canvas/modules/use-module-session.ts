/**
 * The session as the canvas sees it while a module is open: the same session, but its `doc` is the
 * module's view (`moduleDoc`: every named edit lands inside the module, in one transaction with this
 * session's origin, so undo stays per user) and its `board` holds the module's parts and wires, with the
 * board's modules (for the instances inside it). The top-level session when nothing is open.
 */
import { useMemo, useRef } from 'react';
import { moduleDoc, type BoardFile, type Module } from '../../../../shared/board';
import { stabilizeBoard } from '../flow/derive-flow';
import type { BoardSession } from '../session/use-board-session';
import { markModuleView } from './open-module';

export interface ModuleScope {
  session: BoardSession;
  /** the module open on the canvas, or null at the top level */
  module: Module | null;
}

export function useModuleSession(session: BoardSession, moduleId: string | null): ModuleScope {
  const module = moduleId ? session.board.modules?.find((m) => m.id === moduleId) ?? null : null;
  const prev = useRef<{ id: string; board: BoardFile } | null>(null);
  return useMemo(() => {
    if (!module) return { session, module: null };
    let doc;
    try {
      doc = moduleDoc(session.doc, module.id);
      markModuleView(doc, module.id);
    } catch {
      return { session, module: null };
    }
    const next: BoardFile = { ...session.board, title: module.title, parts: module.parts, wires: module.wires };
    const kept = stabilizeBoard(prev.current?.id === module.id ? prev.current.board : null, next);
    const board = kept.modules === next.modules ? kept : { ...kept, modules: next.modules };
    prev.current = { id: module.id, board };
    return { session: { ...session, doc, board }, module };
  }, [session, module]);
}
