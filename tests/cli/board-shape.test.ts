/**
 * The command line's quick check of a board file (server/cli/shape.ts, described from BoardFileSchema)
 * against zod's own parse of the same schema: whenever the quick check answers, zod accepts the file and
 * returns the same value, keys in the same order; the example boards take the quick path. Mutations of the
 * examples (every field replaced by a value of another type, out of range, left out, added) are checked
 * the same way. The reference is zod itself (the schema's library), not a copy of its rules.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { BoardFileSchema, parseBoardFile } from '../../shared/board';
import { BOARD_SHAPE } from '../../server/cli/board-spec';
import { conform, describeSchema, DOUBT, UnsupportedSchema } from '../../server/cli/shape';

const root = join(import.meta.dirname, '..', '..');
const files = [
  ...readdirSync(join(root, 'examples')).filter((f) => f.endsWith('.json')).map((f) => join(root, 'examples', f)),
  ...readdirSync(join(root, 'tests/fixtures')).filter((f) => f.endsWith('.json')).map((f) => join(root, 'tests/fixtures', f)),
];
const boards = files.map((f) => ({ name: f.slice(root.length + 1), raw: JSON.parse(readFileSync(f, 'utf8')) as unknown }));

/** The quick check agrees with zod on `raw`: DOUBT, or zod's success with the same value. */
function agrees(raw: unknown): 'quick' | 'zod' {
  const quick = conform(BOARD_SHAPE!, raw);
  if (quick === DOUBT) return 'zod';
  const parsed = BoardFileSchema.safeParse(raw);
  expect(parsed.success).toBe(true);
  // same keys in the same order, same values (JSON: the parse of a JSON file holds nothing else)
  expect(JSON.stringify(quick)).toBe(JSON.stringify(parsed.data));
  expect(quick).toStrictEqual(parsed.data);
  return 'quick';
}

/** A small deterministic generator (mulberry32), so a failure names a reproducible case. */
function random(seed: number): () => number {
  let a = seed;
  return () => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const REPLACEMENTS: unknown[] = [
  null, 0, -0, 1, 2, 3, 8, 9, -1, 2.5, 1e21, 2 ** 53, 90, 45, 270, '', 'a', 'ab', 'a.out', 'x'.repeat(64), 'x'.repeat(65),
  'x'.repeat(200), 'x'.repeat(201), '😀', '😀'.repeat(33), '😀'.repeat(64), '😀'.repeat(65), '\uD800', 'ideal', 'relay', 'switch',
  'lamp', 'and', 'module', 'port', 'in', 'triode', 'gatefold-board', true, false, [], {}, [1], { id: 'q' },
];

type Json = Record<string, unknown> | unknown[];

/** Every (container, key) pair in the value, depth first. */
function slots(value: unknown, out: [Json, string | number][] = []): [Json, string | number][] {
  if (Array.isArray(value)) value.forEach((v, i) => { out.push([value, i]); slots(v, out); });
  else if (value && typeof value === 'object') for (const [k, v] of Object.entries(value)) { out.push([value as Json, k]); slots(v, out); }
  return out;
}

function mutate(raw: unknown, rnd: () => number): unknown {
  const copy = structuredClone(raw);
  const all = slots(copy);
  for (let n = 1 + Math.floor(rnd() * 2); n > 0; n--) {
    const [container, key] = all[Math.floor(rnd() * all.length)];
    const what = rnd();
    if (what < 0.2 && !Array.isArray(container)) delete (container as Record<string, unknown>)[key as string];
    else if (what < 0.3 && !Array.isArray(container)) (container as Record<string, unknown>)[`extra${key}`] = 1;
    else (container as Record<string | number, unknown>)[key] = REPLACEMENTS[Math.floor(rnd() * REPLACEMENTS.length)];
  }
  return copy;
}

describe('board file quick check', () => {
  it('is described from the board schema', () => {
    expect(BOARD_SHAPE).not.toBeNull();
    expect(() => describeSchema({})).toThrow(UnsupportedSchema);
  });

  it('takes the quick path for every example board and returns what zod returns', () => {
    expect(boards.length).toBeGreaterThan(3);
    for (const { raw } of boards) expect(agrees(raw)).toBe('quick');
  });

  it('fills in defaults and leaves unknown keys out as zod does', () => {
    const raw = {
      extra: 1, format: 'gatefold-board', version: 1,
      parts: [{ kind: 'and', id: 'g', note: 'x' }, { id: 's', kind: 'switch', label: 'A', rotation: 90 }, { id: 'n', kind: 'note' }],
      wires: [{ to: 'g.in0', id: 'w', from: 's.out', colour: 'red' }],
    };
    expect(agrees(raw)).toBe('quick');
    expect(parseBoardFile(raw).ok).toBe(true);
  });

  it('never answers differently from zod on mutated examples', () => {
    const rnd = random(16);
    const seen = { quick: 0, zod: 0 };
    for (let i = 0; i < 1500; i++) {
      const { raw } = boards[i % boards.length];
      seen[agrees(mutate(raw, rnd))]++;
    }
    // both paths were exercised
    expect(seen.quick).toBeGreaterThan(100);
    expect(seen.zod).toBeGreaterThan(100);
  });

  it('leaves non-objects, strings near a bound in code points and wrong discriminators to zod', () => {
    for (const raw of [null, [], 'x', 1]) expect(conform(BOARD_SHAPE!, raw)).toBe(DOUBT);
    const base = boards.find((b) => b.name.endsWith('half-adder.gatefold.json'))!.raw as { parts: Record<string, unknown>[] };
    const long = structuredClone(base);
    long.parts[0].id = '😀'.repeat(40); // 80 UTF-16 units, 40 code points: valid for zod (at most 64)
    expect(conform(BOARD_SHAPE!, long)).toBe(DOUBT);
    expect(BoardFileSchema.safeParse(long).success).toBe(true);
    const tag = structuredClone(base);
    tag.parts[0].kind = 'triode';
    expect(conform(BOARD_SHAPE!, tag)).toBe(DOUBT);
  });
});
