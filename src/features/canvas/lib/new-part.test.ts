import { describe, expect, it } from 'vitest';
import { PartSchema } from '../../../../shared/board';
import { PART_KINDS } from '../../../../shared/board';
import { TRAY_ITEMS, searchTray } from '../tray/tray-items';
import { newPart, nextLabel } from './new-part';

describe('newPart', () => {
  it('makes a valid board-file part for every tray entry', () => {
    for (const item of TRAY_ITEMS) {
      const part = newPart(item, 40, 60, []);
      const parsed = PartSchema.safeParse({ ...part, id: 'x1' });
      expect(parsed.success, item.key).toBe(true);
      expect([part.x, part.y]).toEqual([40, 60]);
    }
  });

  it('offers every part kind of a top-level board in the tray (ports belong inside a module; instances come from the board\u2019s modules)', () => {
    expect(new Set(TRAY_ITEMS.map((i) => i.kind))).toEqual(new Set(PART_KINDS.filter((k) => k !== 'module' && k !== 'port')));
  });

  it('keeps a gate\u2019s input count within 2–8', () => {
    expect(newPart({ kind: 'nor', inputs: 5 }, 0, 0, [])).toMatchObject({ kind: 'nor', inputs: 5 });
    expect(newPart({ kind: 'nor', inputs: 12 }, 0, 0, [])).toMatchObject({ inputs: 8 });
  });

  it('labels inputs A, B, … and lamps L1, L2, … skipping labels in use', () => {
    const parts = [newPart({ kind: 'switch' }, 0, 0, [])];
    expect(parts[0].label).toBe('A');
    parts.push(newPart({ kind: 'button' }, 0, 0, parts));
    expect(parts[1].label).toBe('B');
    expect(nextLabel('lamp', new Set(['L1']))).toBe('L2');
    expect(nextLabel('clock', new Set(['CLK']))).toBe('CLK1');
    expect(nextLabel('and', new Set())).toBeUndefined();
  });
});

describe('searchTray', () => {
  it('finds parts by any word of their name or trade terms', () => {
    expect(searchTray('flip').map((i) => i.kind)).toEqual(['dff']);
    expect(searchTray('mux').map((i) => i.kind)).toEqual(['mux2', 'mux4']);
    expect(searchTray('inverter').map((i) => i.kind)).toEqual(['not']);
    expect(searchTray('')).toHaveLength(TRAY_ITEMS.length);
    expect(searchTray('zzz')).toEqual([]);
  });
});
