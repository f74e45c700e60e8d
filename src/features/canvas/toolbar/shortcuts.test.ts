import { describe, expect, it } from 'vitest';
import { SHORTCUTS, commandOf } from './shortcuts';

const key = (k: string, mods: Partial<{ ctrlKey: boolean; metaKey: boolean; shiftKey: boolean; altKey: boolean }> = {}) =>
  commandOf({ key: k, ctrlKey: false, metaKey: false, shiftKey: false, altKey: false, ...mods });

describe('commandOf', () => {
  it('reads the canvas shortcuts, with Cmd standing in for Ctrl', () => {
    expect(key('Delete')).toBe('delete');
    expect(key('Backspace')).toBe('delete');
    expect(key('c', { ctrlKey: true })).toBe('copy');
    expect(key('v', { metaKey: true })).toBe('paste');
    expect(key('d', { ctrlKey: true })).toBe('duplicate');
    expect(key('z', { ctrlKey: true })).toBe('undo');
    expect(key('Z', { ctrlKey: true, shiftKey: true })).toBe('redo');
    expect(key('y', { ctrlKey: true })).toBe('redo');
    expect(key('r')).toBe('rotate');
    expect(key('R', { shiftKey: true })).toBe('rotate');
    expect(key('?', { shiftKey: true })).toBe('help');
    expect(key('Escape')).toBe('cancel');
    expect(key('m')).toBe('makeModule');
    expect(key('M', { shiftKey: true })).toBe('makeModule');
  });

  it('ignores other keys and Alt combinations', () => {
    expect(key('x')).toBeNull();
    expect(key('c')).toBeNull();
    expect(key('z', { ctrlKey: true, altKey: true })).toBeNull();
  });

  it('has a help-sheet line for every command it can return', () => {
    const listed = new Set(SHORTCUTS.map((s) => s.command));
    for (const k of ['Delete', 'r', 'm', '?', 'Escape']) expect(listed.has(key(k)!)).toBe(true);
    for (const k of ['c', 'v', 'd', 'z', 'y', 'a']) expect(listed.has(key(k, { ctrlKey: true })!)).toBe(true);
  });
});
