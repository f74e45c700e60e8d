import { describe, expect, it } from 'vitest';
import { PART_KINDS, type PartKind } from '../../../../shared/board';
import { PartSchema } from '../../../../shared/board';
import { COMMON_FIELDS, ROTATIONS, inspectorFields, operatedFields, parsePeriod } from './inspector-fields';

/** The schema's own fields of `kind` (what PartSchema accepts beyond id, kind and position). */
function schemaFields(kind: PartKind): string[] {
  const option = PartSchema.options.find((o) => o.shape.kind.value === kind);
  if (!option) throw new Error(`PartSchema has no ${kind}`);
  return Object.keys(option.shape).filter((k) => !['id', 'kind', 'x', 'y', ...COMMON_FIELDS].includes(k)).sort();
}

/** A minimal valid part of `kind` (a constant needs its value). */
function base(kind: PartKind): Record<string, unknown> {
  return kind === 'const' ? { id: 'p1', kind, value: 0 } : { id: 'p1', kind };
}
const accepts = (kind: PartKind, field: string, value: unknown) => PartSchema.safeParse({ ...base(kind), [field]: value }).success;

describe('inspectorFields', () => {
  it('covers every field PartSchema gives each kind, except the live state worked on the symbol', () => {
    for (const kind of PART_KINDS) {
      const offered = [...inspectorFields(kind).map((f) => f.field), ...operatedFields(kind)].sort();
      expect(offered, kind).toEqual(schemaFields(kind));
    }
  });

  it('offers only the values PartSchema accepts, and all of them', () => {
    for (const kind of PART_KINDS) {
      for (const f of inspectorFields(kind)) {
        switch (f.control) {
          case 'count':
            for (let n = f.min; n <= f.max; n++) expect(accepts(kind, f.field, n), `${kind}.${f.field}=${n}`).toBe(true);
            expect(accepts(kind, f.field, f.min - 1)).toBe(false);
            expect(accepts(kind, f.field, f.max + 1)).toBe(false);
            break;
          case 'bit':
            expect(accepts(kind, f.field, 0) && accepts(kind, f.field, 1)).toBe(true);
            expect(accepts(kind, f.field, 2)).toBe(false);
            break;
          case 'check':
            expect(accepts(kind, f.field, true) && accepts(kind, f.field, false)).toBe(true);
            break;
          case 'number':
          case 'text':
            expect(accepts(kind, f.field, f.control === 'number' ? 40 : 'D flip-flop fed by the debounced step button')).toBe(true);
            break;
          default: {
            const never: never = f;
            throw new Error(`unknown control ${String(never)}`);
          }
        }
      }
    }
  });

  it('gives gates the 2–8 inputs of CONTRACTS §1 and storage parts a power-on Q', () => {
    expect(inspectorFields('nand')).toEqual([expect.objectContaining({ field: 'inputs', min: 2, max: 8 })]);
    expect(inspectorFields('dff').map((f) => f.field)).toEqual(['init']);
    expect(inspectorFields('mux4')).toEqual([]);
  });

  it('lists exactly the rotations PartSchema accepts', () => {
    for (const r of [...ROTATIONS, 45, 360]) expect(accepts('and', 'rotation', r)).toBe((ROTATIONS as readonly number[]).includes(r));
  });
});

describe('parsePeriod', () => {
  it('reads a positive number, treats an empty box as the default and refuses the rest', () => {
    expect(parsePeriod(' 40 ')).toEqual({ ok: true, value: 40 });
    expect(parsePeriod('')).toEqual({ ok: true, value: undefined });
    for (const bad of ['0', '-3', 'fast', 'Infinity']) {
      const r = parsePeriod(bad);
      expect(r.ok, bad).toBe(false);
      if (!r.ok) expect(r.reason).toContain(bad);
    }
    const good = parsePeriod('12.5');
    expect(good.ok && accepts('clock', 'period', good.value)).toBe(true);
  });
});
