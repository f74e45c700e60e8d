/**
 * The command line's quick check of a board file's shape, derived from the zod schema (never written by
 * hand): `describeSchema` turns a schema into a plain description (JSON), which the build stores in the
 * bundle so that a call neither loads zod nor builds the schemas; `conform` checks a value against the
 * description and returns exactly what the schema's parse would return (defaults filled in, unknown keys
 * left out, keys in the schema's order) — or DOUBT whenever it is not certain, and then the caller asks
 * zod itself (which also words the error). So the quick check may only ever say "yes, and this is the
 * parsed value" when zod would say the same; tests/cli/board-shape.test.ts compares the two.
 */

/** A schema reduced to what `conform` understands. */
export type Shape =
  | { t: 'object'; keys: [string, Shape][] }
  | { t: 'array'; el: Shape; min?: number; max?: number }
  | { t: 'string'; min?: number; max?: number }
  | { t: 'number'; int?: boolean; gt?: [number, boolean]; lt?: [number, boolean] }
  | { t: 'boolean' }
  | { t: 'values'; values: (string | number | boolean | null)[] }
  | { t: 'default'; value: unknown; inner: Shape }
  | { t: 'optional'; inner: Shape }
  | { t: 'tagged'; key: string; options: Record<string, Shape> };

/** `conform`'s answer when only zod can tell (a value that may be invalid, or a case it does not model). */
export const DOUBT: unique symbol = Symbol('doubt');

interface ZodLike { _zod: { def: Record<string, unknown> & { type: string; checks?: ZodLike[] } } }

/** Thrown by describeSchema for a construct it does not model; the caller then always asks zod. */
export class UnsupportedSchema extends Error {}

function checksOf(def: ZodLike['_zod']['def']): Record<string, unknown>[] {
  return (def.checks ?? []).map((c) => c._zod.def);
}

function lengthBounds(def: ZodLike['_zod']['def']): { min?: number; max?: number } {
  const out: { min?: number; max?: number } = {};
  for (const c of checksOf(def)) {
    if (c.check === 'min_length') out.min = Math.max(out.min ?? 0, c.minimum as number);
    else if (c.check === 'max_length') out.max = Math.min(out.max ?? Infinity, c.maximum as number);
    else throw new UnsupportedSchema(`check ${String(c.check)} on ${def.type}`);
  }
  return out;
}

/** Literal values of a literal, an enum, or a union of those (else undefined). */
function valuesOf(s: ZodLike): Shape & { t: 'values' } | undefined {
  const { def } = s._zod;
  if (def.checks?.length) return undefined;
  if (def.type === 'literal') return { t: 'values', values: [...(def.values as (string | number | boolean | null)[])] };
  if (def.type === 'enum') return { t: 'values', values: Object.values(def.entries as Record<string, string | number>) };
  if (def.type === 'union' && def.discriminator === undefined) {
    const parts = (def.options as ZodLike[]).map(valuesOf);
    if (parts.every(Boolean)) return { t: 'values', values: parts.flatMap((p) => p!.values) };
  }
  return undefined;
}

/** The description of a zod (v4) schema; throws UnsupportedSchema for anything it does not model. */
export function describeSchema(schema: unknown): Shape {
  const s = schema as ZodLike;
  const def = s?._zod?.def;
  if (!def) throw new UnsupportedSchema('not a zod schema');
  const literal = valuesOf(s);
  if (literal) return literal;
  switch (def.type) {
    case 'object': {
      if (def.catchall !== undefined) throw new UnsupportedSchema('object with catchall');
      if (def.checks?.length) throw new UnsupportedSchema('checks on an object');
      const shape = def.shape as Record<string, ZodLike>;
      if (Object.getOwnPropertySymbols(shape).length) throw new UnsupportedSchema('symbol keys');
      return { t: 'object', keys: Object.keys(shape).filter((k) => k !== '__proto__').map((k) => [k, describeSchema(shape[k])]) };
    }
    case 'array':
      return { t: 'array', el: describeSchema(def.element), ...lengthBounds(def) };
    case 'string':
      if (def.coerce || def.format !== undefined) throw new UnsupportedSchema('string format or coercion');
      return { t: 'string', ...lengthBounds(def) };
    case 'boolean':
      if (def.coerce || def.checks?.length) throw new UnsupportedSchema('boolean coercion or checks');
      return { t: 'boolean' };
    case 'number': {
      if (def.coerce || (def.format !== undefined && def.format !== 'safeint')) throw new UnsupportedSchema('number format or coercion');
      const out: Shape & { t: 'number' } = { t: 'number' };
      if (def.format === 'safeint') out.int = true;
      for (const c of checksOf(def)) {
        if (c.check === 'number_format' && c.format === 'safeint') out.int = true;
        else if (c.check === 'greater_than' && typeof c.value === 'number' && out.gt === undefined) out.gt = [c.value, c.inclusive === true];
        else if (c.check === 'less_than' && typeof c.value === 'number' && out.lt === undefined) out.lt = [c.value, c.inclusive === true];
        else throw new UnsupportedSchema(`check ${String(c.check)} on number`);
      }
      return out;
    }
    case 'default': {
      if (def.checks?.length) throw new UnsupportedSchema('checks on a default');
      const value = def.defaultValue;
      if (value !== null && typeof value === 'object') throw new UnsupportedSchema('default of an object'); // zod hands out its own copy
      return { t: 'default', value, inner: describeSchema(def.innerType) };
    }
    case 'optional': {
      if (def.checks?.length) throw new UnsupportedSchema('checks on an optional');
      const inner = describeSchema(def.innerType);
      if (inner.t === 'default') throw new UnsupportedSchema('optional of a default');
      return { t: 'optional', inner };
    }
    case 'union': {
      const key = def.discriminator;
      if (typeof key !== 'string' || def.unionFallback || def.checks?.length) throw new UnsupportedSchema('union');
      const options: Record<string, Shape> = {};
      for (const option of def.options as ZodLike[]) {
        const described = describeSchema(option);
        const tag = described.t === 'object' ? described.keys.find(([k]) => k === key)?.[1] : undefined;
        if (!tag || tag.t !== 'values') throw new UnsupportedSchema('discriminator that is not a literal');
        for (const v of tag.values) {
          if (typeof v !== 'string' || Object.hasOwn(options, v)) throw new UnsupportedSchema('discriminator value');
          options[v] = described;
        }
      }
      return { t: 'tagged', key, options };
    }
    default:
      throw new UnsupportedSchema(`type ${def.type}`);
  }
}

const HIGH_SURROGATE = /[\uD800-\uDBFF]/;

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/**
 * The value zod's parse of `value` would return, or DOUBT. Lengths of strings: zod counts code points;
 * a string whose count could differ from its UTF-16 length near a bound is left to zod.
 */
export function conform(shape: Shape, value: unknown): unknown {
  switch (shape.t) {
    case 'object': {
      if (!isObject(value)) return DOUBT;
      const out: Record<string, unknown> = {};
      const { keys } = shape;
      // an index loop: this runs mostly before V8 optimises it, where iterators and destructuring cost
      for (let i = 0; i < keys.length; i++) {
        const key = keys[i][0];
        const inner = keys[i][1];
        const present = key in value;
        const v = value[key];
        if (inner.t === 'optional') {
          if (!present) continue;
          const r = v === undefined ? undefined : conform(inner.inner, v);
          if (r === DOUBT) return DOUBT;
          out[key] = r;
        } else if (inner.t === 'default') {
          const r = v === undefined ? inner.value : conform(inner.inner, v);
          if (r === DOUBT) return DOUBT;
          out[key] = r;
        } else {
          if (!present) return DOUBT;
          const r = conform(inner, v);
          if (r === DOUBT) return DOUBT;
          out[key] = r;
        }
      }
      return out;
    }
    case 'array': {
      if (!Array.isArray(value)) return DOUBT;
      const n = value.length;
      if ((shape.min !== undefined && n < shape.min) || (shape.max !== undefined && n > shape.max)) return DOUBT;
      const out = new Array<unknown>(n);
      for (let i = 0; i < n; i++) {
        const r = conform(shape.el, value[i]);
        if (r === DOUBT) return DOUBT;
        out[i] = r;
      }
      return out;
    }
    case 'string': {
      if (typeof value !== 'string') return DOUBT;
      const n = value.length;
      if (shape.max !== undefined && n > shape.max) return DOUBT;
      // n units hold between n/2 and n code points
      if (shape.min !== undefined && n < 2 * shape.min && (n < shape.min || HIGH_SURROGATE.test(value))) return DOUBT;
      return value;
    }
    case 'number': {
      if (typeof value !== 'number' || !Number.isFinite(value)) return DOUBT;
      if (shape.int && !Number.isSafeInteger(value)) return DOUBT;
      if (shape.gt && !(shape.gt[1] ? value >= shape.gt[0] : value > shape.gt[0])) return DOUBT;
      if (shape.lt && !(shape.lt[1] ? value <= shape.lt[0] : value < shape.lt[0])) return DOUBT;
      return value;
    }
    case 'boolean':
      return typeof value === 'boolean' ? value : DOUBT;
    case 'values':
      return shape.values.includes(value as string) ? value : DOUBT;
    case 'default':
      return value === undefined ? shape.value : conform(shape.inner, value);
    case 'optional':
      return value === undefined ? undefined : conform(shape.inner, value);
    case 'tagged': {
      if (!isObject(value)) return DOUBT;
      const tag = value[shape.key];
      return typeof tag === 'string' && Object.hasOwn(shape.options, tag) ? conform(shape.options[tag], value) : DOUBT;
    }
  }
}
