/**
 * The bench's commands (delete, copy, paste, duplicate, rotate, undo, redo, place a part), each one
 * named edit of shared/board/edits on the session's own origin, and the keyboard that triggers them.
 */
import { useCallback, useEffect, useRef } from 'react';
import { toast } from 'sonner';
import { addPart, copyFragment, deleteSelection, pasteFragment, rotateParts } from '../../../../shared/board/edits';
import { fragmentOrigin, readFragment, writeFragment } from '../io/clipboard';
import { snap } from '../lib/geometry';
import { newPart, type TrayChoice } from '../lib/new-part';
import { commandOf, type CommandName } from '../toolbar/shortcuts';
import type { PartNode, WireEdge } from '../flow/types';
import type { BoardSession } from '../session/use-board-session';

interface Deps {
  session: BoardSession;
  nodes: PartNode[];
  edges: WireEdge[];
  selectOnly(ids: Iterable<string>): void;
  /** last pointer position on the bench, flow coordinates */
  pointer: React.RefObject<{ x: number; y: number } | null>;
  onHelp(): void;
  onCancel(): void;
}

function isEditable(target: EventTarget | null): boolean {
  const el = target as HTMLElement | null;
  if (!el || !el.tagName) return false;
  return el.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(el.tagName);
}

export function useBenchCommands(deps: Deps) {
  const ref = useRef(deps);
  ref.current = deps;

  const selectedIds = () => ref.current.nodes.filter((n) => n.selected).map((n) => n.id);

  const paste = useCallback(async (shift?: { x: number; y: number }) => {
    const { session, pointer, selectOnly } = ref.current;
    if (session.readOnly) return;
    const fragment = await readFragment();
    if (!fragment || !fragment.parts.length) { toast.message('Nothing to paste: copy some parts first'); return; }
    const o = fragmentOrigin(fragment);
    const at = shift ? { x: o.x + shift.x, y: o.y + shift.y } : pointer.current ?? { x: o.x + 40, y: o.y + 40 };
    const offset = { x: snap(at.x - o.x), y: snap(at.y - o.y) };
    const { partIds } = pasteFragment(session.doc, fragment, offset, session.origin);
    selectOnly(partIds);
  }, []);

  const run = useCallback((command: CommandName) => {
    const { session, edges, selectOnly } = ref.current;
    const editing = !session.readOnly;
    switch (command) {
      case 'delete': {
        if (!editing) return;
        const parts = selectedIds();
        const wires = edges.filter((e) => e.selected).map((e) => e.id);
        if (parts.length || wires.length) deleteSelection(session.doc, parts, wires, session.origin);
        return;
      }
      case 'copy': {
        const ids = selectedIds();
        if (!ids.length) return;
        void writeFragment(copyFragment(session.doc, ids)).then(() => toast.message(`Copied ${ids.length} part${ids.length === 1 ? '' : 's'}`));
        return;
      }
      case 'paste': void paste(); return;
      case 'duplicate': {
        if (!editing) return;
        const ids = selectedIds();
        if (!ids.length) return;
        const { partIds } = pasteFragment(session.doc, copyFragment(session.doc, ids), { x: 40, y: 40 }, session.origin);
        selectOnly(partIds);
        return;
      }
      case 'rotate': {
        const ids = selectedIds();
        if (editing && ids.length) rotateParts(session.doc, ids, session.origin);
        return;
      }
      case 'undo': session.undo(); return;
      case 'redo': session.redo(); return;
      case 'selectAll': selectOnly(ref.current.nodes.map((n) => n.id)); return;
      case 'help': ref.current.onHelp(); return;
      case 'cancel': ref.current.onCancel(); selectOnly([]); return;
      default: {
        const never: never = command;
        throw new Error(`unknown command ${String(never)}`);
      }
    }
  }, [paste]);

  const place = useCallback((choice: TrayChoice, at: { x: number; y: number }) => {
    const { session, selectOnly } = ref.current;
    if (session.readOnly) return;
    try {
      const part = newPart(choice, snap(at.x), snap(at.y), session.board.parts);
      const id = addPart(session.doc, part, session.origin);
      selectOnly([id]);
    } catch (err) {
      toast.error((err as Error).message);
    }
  }, []);

  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (isEditable(e.target)) return;
      const command = commandOf(e);
      if (!command) return;
      // Leave the browser's own copy alone when the user has selected text somewhere.
      if (command === 'copy' && String(window.getSelection() ?? '').length > 0) return;
      e.preventDefault();
      run(command);
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [run]);

  return { run, place, paste };
}
