/**
 * The canvas commands (delete, copy, paste, duplicate, rotate, undo, redo, place a part), each one
 * named edit of shared/board/edits on the session's own origin, and the keyboard that triggers them.
 */
import { useCallback, useEffect, useRef } from 'react';
import { toast } from 'sonner';
import { addPart, copyFragment, deleteSelection, makeModule, modulesMap, pasteFragment, rotateParts } from '../../../../shared/board';
import { fragmentOrigin, parseFragment, rememberFragment, rememberedFragment } from '../io/clipboard';
import { fitFragmentToLevel, leftOutNotice, placementRefusal } from '../io/level-fit';
import { openModuleOf } from '../modules/open-module';
import type { Fragment } from '../../../../shared/board';
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
  /** last pointer position on the canvas, flow coordinates */
  pointer: React.RefObject<{ x: number; y: number } | null>;
  onHelp(): void;
  onCancel(): void;
}

function isEditable(target: EventTarget | null): boolean {
  const el = target as HTMLElement | null;
  if (!el || !el.tagName) return false;
  return el.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(el.tagName);
}

export function useCanvasCommands(deps: Deps) {
  const ref = useRef(deps);
  ref.current = deps;

  const selectedIds = () => ref.current.nodes.filter((n) => n.selected).map((n) => n.id);

  const paste = useCallback((fragment: Fragment | null, shift?: { x: number; y: number }) => {
    const { session, pointer, selectOnly } = ref.current;
    if (session.readOnly) return;
    if (!fragment || !fragment.parts.length) { toast.message('Nothing to paste: copy some parts first'); return; }
    // what this level may not hold (switches in a module, ports on the top level) stays out, and the user hears why
    const inModule = openModuleOf(session.doc) !== null;
    const fit = fitFragmentToLevel(fragment, inModule);
    if (fit.leftOut.length) toast.warning(leftOutNotice(fit.leftOut, inModule, fit.fragment.parts.length), { id: 'paste-left-out' });
    if (!fit.fragment.parts.length) return;
    const o = fragmentOrigin(fragment);
    const at = shift ? { x: o.x + shift.x, y: o.y + shift.y } : pointer.current ?? { x: o.x + 40, y: o.y + 40 };
    const offset = { x: snap(at.x - o.x), y: snap(at.y - o.y) };
    const { partIds } = pasteFragment(session.doc, fit.fragment, offset, session.origin);
    selectOnly(partIds);
  }, []);

  /** The selection as a fragment (also kept in memory), or null when nothing is selected. */
  const copySelection = useCallback((): string | null => {
    const ids = selectedIds();
    if (!ids.length) return null;
    return rememberFragment(copyFragment(ref.current.session.doc, ids));
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
        if (copySelection()) toast.message(`Copied ${selectedIds().length} part(s)`);
        return;
      }
      case 'paste': paste(rememberedFragment()); return;
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
      case 'makeModule': {
        if (!editing) return;
        const ids = selectedIds();
        if (!ids.length) { toast.message('Select the parts that make the module first'); return; }
        try {
          const title = `Module ${modulesMap(session.doc).size + 1}`;
          const made = makeModule(session.doc, ids, session.origin, { title });
          selectOnly([made.instanceId]);
          const kept = made.keptOutside.length ? ` (${made.keptOutside.join(', ')} stay outside: a module takes its inputs through ports)` : '';
          toast.message(`Made ${title}${kept}; double-click it to open it`);
        } catch (err) {
          toast.error((err as Error).message);
        }
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
  }, [paste, copySelection]);

  const place = useCallback((choice: TrayChoice, at: { x: number; y: number }) => {
    const { session, selectOnly } = ref.current;
    if (session.readOnly) return;
    const refused = placementRefusal(choice.kind, openModuleOf(session.doc) !== null);
    if (refused) { toast.warning(refused, { id: 'place-refused' }); return; }
    try {
      const part = newPart(choice, snap(at.x), snap(at.y), session.board.parts);
      const id = addPart(session.doc, part, session.origin);
      selectOnly([id]);
    } catch (err) {
      toast.error((err as Error).message);
    }
  }, []);

  // Copy and paste ride on the browser's own copy/paste events, whose clipboard needs no permission and
  // reaches other tabs, windows and boards; the in-memory copy covers a browser that sends no event.
  useEffect(() => {
    let pasteFallback: ReturnType<typeof setTimeout> | null = null;
    const onKey = (e: KeyboardEvent) => {
      // keys inside a modal dialog are the dialog's (Esc must close it, Delete must not delete parts)
      if (isEditable(e.target) || document.querySelector('dialog[open]')) return;
      const command = commandOf(e);
      if (!command) return;
      if (command === 'copy') {
        if (String(window.getSelection() ?? '').length > 0) return; // the user is copying text
        copySelection(); // the copy event (if the browser sends one) puts it on the system clipboard
        return;
      }
      if (command === 'paste') {
        if (pasteFallback) clearTimeout(pasteFallback);
        pasteFallback = setTimeout(() => { pasteFallback = null; paste(rememberedFragment()); }, 120);
        return;
      }
      e.preventDefault();
      run(command);
    };
    const onCopy = (e: ClipboardEvent) => {
      if (isEditable(e.target) || String(window.getSelection() ?? '').length > 0) return;
      const text = copySelection();
      if (!text || !e.clipboardData) return;
      e.clipboardData.setData('text/plain', text);
      e.preventDefault();
      toast.message(`Copied ${selectedIds().length} part(s)`);
    };
    const onPaste = (e: ClipboardEvent) => {
      if (isEditable(e.target)) return;
      if (pasteFallback) { clearTimeout(pasteFallback); pasteFallback = null; }
      const fragment = parseFragment(e.clipboardData?.getData('text/plain')) ?? rememberedFragment();
      e.preventDefault();
      paste(fragment);
    };
    window.addEventListener('keydown', onKey);
    window.addEventListener('copy', onCopy);
    window.addEventListener('paste', onPaste);
    return () => {
      window.removeEventListener('keydown', onKey);
      window.removeEventListener('copy', onCopy);
      window.removeEventListener('paste', onPaste);
      if (pasteFallback) clearTimeout(pasteFallback);
    };
  }, [run, paste, copySelection]);

  return { run, place, paste };
}
