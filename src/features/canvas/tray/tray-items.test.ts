import { describe, expect, it } from 'vitest';
import { newPart } from '../lib/new-part';
import { TRAY_ITEMS, trayItemsFor } from './tray-items';
import type { Part } from '../../../../shared/board';

describe('trayItemsFor', () => {
  it('offers no port on the top level', () => {
    expect(trayItemsFor(false).some((it) => it.kind === 'port')).toBe(false);
    expect(trayItemsFor(false)).toBe(TRAY_ITEMS);
  });

  it('inside a module offers ports in and out and no switch, button or clock', () => {
    const kinds = trayItemsFor(true).map((it) => `${it.kind}${it.dir ? `:${it.dir}` : ''}`);
    expect(kinds).toEqual(expect.arrayContaining(['port:in', 'port:out', 'nand', 'lamp']));
    for (const k of ['switch', 'button', 'clock']) expect(kinds).not.toContain(k);
  });
});

describe('newPart for a port', () => {
  it('labels ports in1, in2… and out1… by direction, skipping labels the module has', () => {
    const have: Part[] = [{ id: 'p1', kind: 'port', dir: 'in', label: 'in1', x: 0, y: 0 }];
    expect(newPart({ kind: 'port', dir: 'in' }, 0, 0, have)).toMatchObject({ kind: 'port', dir: 'in', label: 'in2' });
    expect(newPart({ kind: 'port', dir: 'out' }, 0, 0, have)).toMatchObject({ kind: 'port', dir: 'out', label: 'out1' });
  });
});
