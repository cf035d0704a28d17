// fast-check arbitraries derived from zod 4 schemas' shapes, for input fuzzing:
// values of the right shape (often valid), and mutations of them that a client
// could send by mistake or on purpose (wrong types, missing fields, huge or
// unusual strings, prototype-polluting keys).
import fc from 'fast-check';
import type { z } from 'zod';

type Def = { type: string; [key: string]: unknown };
const defOf = (schema: unknown): Def => (schema as { _zod: { def: Def } })._zod.def;

const unusualString = fc.oneof(
  fc.string({ maxLength: 40 }),
  fc.string({ unit: 'grapheme', maxLength: 20 }),
  fc.constantFrom('', ' ', '\u0000', '\u202e', '🧪🔩', 'δ = 0.38 mm', "'; DROP TABLE users; --", '<script>alert(1)</script>', '%s%n', '../../etc/passwd'),
  loneSurrogateString(),
);

/**
 * Ill-formed UTF-16: a high or low surrogate without its partner, alone, at an
 * end or in the middle ("\ud800", "a\udc00b", half an emoji). JSON.stringify
 * writes them as \uXXXX escapes, which JSON.parse turns back into lone surrogates.
 */
export function loneSurrogateString(): fc.Arbitrary<string> {
  const lone = fc.integer({ min: 0xd800, max: 0xdfff }).map((code) => String.fromCharCode(code));
  return fc
    .tuple(fc.string({ maxLength: 8 }), lone, fc.string({ maxLength: 8 }))
    .map(([before, surrogate, after]) => `${before}${surrogate}${after}`)
    .filter((text) => !(text as string & { isWellFormed(): boolean }).isWellFormed());
}

/** A value shaped like the schema (valid often enough to reach the service, not always). */
export function arbitraryFor(schema: unknown, depth = 0): fc.Arbitrary<unknown> {
  const def = defOf(schema);
  switch (def.type) {
    case 'object': {
      const shape = def.shape as Record<string, unknown>;
      const entries = Object.fromEntries(Object.entries(shape).map(([key, value]) => [key, arbitraryFor(value, depth + 1)]));
      return fc.record(entries, { requiredKeys: Object.keys(shape).filter((key) => !['optional', 'default'].includes(defOf(shape[key]).type)) });
    }
    case 'string':
      return fc.oneof(unusualString, fc.constantFrom('2026-12-31', 'someone@example.org', 'ABC-1', 'a reason that is long enough'));
    case 'number':
    case 'int':
      return fc.oneof(fc.integer({ min: -5, max: 1_000 }), fc.double({ noNaN: true, min: -1e6, max: 1e6 }), fc.constantFrom(0, 1, 2, 3));
    case 'boolean':
      return fc.boolean();
    case 'enum':
      return fc.constantFrom(...Object.values(def.entries as Record<string, unknown>));
    case 'literal':
      return fc.constantFrom(...(def.values as unknown[]));
    case 'array':
      return depth > 4 ? fc.constant([]) : fc.array(arbitraryFor(def.element, depth + 1), { maxLength: 3 });
    case 'optional':
    case 'nonoptional':
    case 'default':
    case 'prefault':
    case 'readonly':
    case 'catch':
      return arbitraryFor(def.innerType, depth);
    case 'nullable':
      return fc.oneof(fc.constant(null), arbitraryFor(def.innerType, depth));
    case 'union':
      return fc.oneof(...(def.options as unknown[]).map((option) => arbitraryFor(option, depth)));
    case 'pipe':
      return arbitraryFor(def.in, depth);
    case 'lazy':
      return fc.constant(null);
    case 'record':
      return fc.dictionary(fc.string({ maxLength: 8 }), arbitraryFor(def.valueType, depth + 1), { maxKeys: 3 });
    default:
      // unknown, any, transforms, dates: anything JSON can carry.
      return fc.jsonValue({ maxDepth: 2 });
  }
}

const wrongValue = fc.oneof(
  fc.constant(null),
  fc.integer(),
  fc.string({ maxLength: 5 }),
  fc.boolean(),
  fc.constant([]),
  fc.constant({}),
  fc.constant(1e308),
  fc.constant(-0),
);

export interface FuzzBody {
  kind: string;
  /** The raw request body text (JSON built by hand where JSON.stringify would drop a key). */
  text: string;
}

/** Shaped values and their mutations, as request body texts. */
export function fuzzBodies(schema: z.ZodType): fc.Arbitrary<FuzzBody> {
  const shaped = arbitraryFor(schema);
  const asObject = shaped.filter((value): value is Record<string, unknown> => typeof value === 'object' && value !== null && !Array.isArray(value));
  return fc.oneof(
    shaped.map((value) => ({ kind: 'shaped', text: JSON.stringify(value) })),
    fc.tuple(asObject, fc.nat()).map(([value, n]) => {
      const keys = Object.keys(value);
      const copy = { ...value };
      if (keys.length) delete copy[keys[n % keys.length]];
      return { kind: 'missing field', text: JSON.stringify(copy) };
    }),
    fc.tuple(asObject, fc.nat(), wrongValue).map(([value, n, wrong]) => {
      const keys = Object.keys(value);
      return { kind: 'wrong type', text: JSON.stringify(keys.length ? { ...value, [keys[n % keys.length]]: wrong } : { x: wrong }) };
    }),
    fc.tuple(asObject, fc.nat(), fc.integer({ min: 5_000, max: 150_000 })).map(([value, n, length]) => {
      const keys = Object.keys(value);
      return { kind: 'huge string', text: JSON.stringify({ ...value, [keys.length ? keys[n % keys.length] : 'x']: 'x'.repeat(length) }) };
    }),
    fc.tuple(asObject, fc.constantFrom('__proto__', 'constructor', 'prototype')).map(([value, key]) => ({
      kind: `${key} key`,
      text: `{"${key}":{"polluted":true,"admin":true},${JSON.stringify(value).slice(1)}`.replace(/,}$/, '}'),
    })),
    fc.tuple(asObject, fc.nat(), loneSurrogateString()).map(([value, n, text]) => {
      const keys = Object.keys(value);
      return { kind: 'lone surrogate', text: JSON.stringify({ ...value, [keys.length ? keys[n % keys.length] : 'x']: text }) };
    }),
    fc.oneof(fc.constant('[]'), fc.constant('null'), fc.constant('42'), fc.constant('"text"'), fc.constant('{"a":'), fc.constant('')).map((text) => ({
      kind: 'not an object',
      text,
    })),
  );
}
