/** The canvas's keyboard shortcuts: one table drives both the key handling and the help sheet. */
export type CommandName = 'delete' | 'copy' | 'paste' | 'duplicate' | 'undo' | 'redo' | 'rotate' | 'help' | 'cancel' | 'selectAll' | 'makeModule';

export interface Shortcut { command: CommandName; keys: string; does: string; editOnly: boolean }

export const SHORTCUTS: Shortcut[] = [
  { command: 'delete', keys: 'Delete / Backspace', does: 'Delete the selected parts and wires', editOnly: true },
  { command: 'copy', keys: 'Ctrl+C', does: 'Copy the selected parts (and the wires between them)', editOnly: false },
  { command: 'paste', keys: 'Ctrl+V', does: 'Paste at the pointer (also from another board or tab)', editOnly: true },
  { command: 'duplicate', keys: 'Ctrl+D', does: 'Duplicate the selection', editOnly: true },
  { command: 'undo', keys: 'Ctrl+Z', does: 'Undo your last edit (never a collaborator’s)', editOnly: true },
  { command: 'redo', keys: 'Ctrl+Shift+Z / Ctrl+Y', does: 'Redo', editOnly: true },
  { command: 'rotate', keys: 'R', does: 'Rotate the selected parts a quarter turn', editOnly: true },
  { command: 'makeModule', keys: 'M', does: 'Make a module of the selected parts (an instance takes their place)', editOnly: true },
  { command: 'selectAll', keys: 'Ctrl+A', does: 'Select everything', editOnly: false },
  { command: 'cancel', keys: 'Esc', does: 'Drop the part picked in the tray; clear the selection', editOnly: false },
  { command: 'help', keys: '?', does: 'Show or hide this sheet', editOnly: false },
];

export interface KeyLike { key: string; ctrlKey: boolean; metaKey: boolean; shiftKey: boolean; altKey: boolean }

/** The command a key press means on the canvas, or null. Cmd counts as Ctrl (macOS). */
export function commandOf(e: KeyLike): CommandName | null {
  const mod = e.ctrlKey || e.metaKey;
  const k = e.key.length === 1 ? e.key.toLowerCase() : e.key;
  if (e.altKey) return null;
  if (mod) {
    if (k === 'c') return 'copy';
    if (k === 'v') return 'paste';
    if (k === 'd') return 'duplicate';
    if (k === 'a') return 'selectAll';
    if (k === 'z') return e.shiftKey ? 'redo' : 'undo';
    if (k === 'y') return 'redo';
    return null;
  }
  if (k === 'Delete' || k === 'Backspace') return 'delete';
  if (k === 'r') return 'rotate';
  if (k === 'm') return 'makeModule';
  if (k === '?') return 'help';
  if (k === 'Escape') return 'cancel';
  return null;
}
