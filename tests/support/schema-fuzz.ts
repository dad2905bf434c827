import fc from 'fast-check';
import { z, type ZodType } from 'zod';

/**
 * Malformed API payloads generated from a route's zod schema (through its JSON Schema, which zod
 * derives itself): mostly near-misses of a valid request — one field missing, of the wrong type,
 * a character too long, a number out of range, an unknown enum value, prototype-pollution keys —
 * mixed with valid requests and with arbitrary JSON.
 */
type Js = {
  type?: string | string[];
  properties?: Record<string, Js>;
  required?: string[];
  items?: Js;
  enum?: unknown[];
  const?: unknown;
  anyOf?: Js[];
  oneOf?: Js[];
  minLength?: number;
  maxLength?: number;
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  exclusiveMaximum?: number;
  minItems?: number;
  maxItems?: number;
  format?: string;
  pattern?: string;
};

export const toJsonSchema = (schema: ZodType): Js => z.toJSONSchema(schema, { unrepresentable: 'any', io: 'input' }) as Js;

/** Values of every JSON type and a few that break naive code (huge, deep, odd numbers). */
export const junk: fc.Arbitrary<unknown> = fc.oneof(
  fc.constantFrom(null, true, false, 0, -1, 1e308, -1e-308, 2 ** 53 + 1, '', ' ', '0', 'null', 'NaN', '1e999', '__proto__', '\u0000', '\uD800', '😀'.repeat(50)),
  fc.string({ maxLength: 40 }),
  fc.integer(),
  fc.double(),
  fc.array(fc.jsonValue({ maxDepth: 2 }), { maxLength: 5 }),
  fc.dictionary(fc.string({ maxLength: 8 }), fc.jsonValue({ maxDepth: 2 }), { maxKeys: 5 }),
  fc.constant('x'.repeat(100_000)),
  fc.integer({ min: 50, max: 400 }).map((depth) => nest(depth)),
  fc.constant({ __proto__: { admin: true }, constructor: { prototype: { admin: true } } }),
);

function nest(depth: number): unknown {
  let v: unknown = 1;
  for (let i = 0; i < depth; i++) v = i % 2 ? [v] : { a: v };
  return v;
}

const typeOf = (s: Js) => (Array.isArray(s.type) ? s.type[0] : s.type);

/** A value the schema accepts (as far as its JSON Schema tells). */
export function validValue(s: Js): fc.Arbitrary<unknown> {
  if (s.const !== undefined) return fc.constant(s.const);
  if (s.enum) return fc.constantFrom(...s.enum);
  if (s.anyOf ?? s.oneOf) return fc.oneof(...(s.anyOf ?? s.oneOf)!.map(validValue));
  switch (typeOf(s)) {
    case 'string':
      if (s.format === 'email') return fc.emailAddress().filter((e) => e.length <= (s.maxLength ?? 254));
      return fc.string({ minLength: s.minLength ?? 0, maxLength: Math.min(s.maxLength ?? 30, 60) }).map((v) => (s.minLength ? v.padEnd(s.minLength, 'a') : v));
    case 'integer':
      return fc.integer({ min: Math.ceil(s.minimum ?? s.exclusiveMinimum ?? -1000), max: Math.floor(s.maximum ?? s.exclusiveMaximum ?? 1_000_000) });
    case 'number':
      return fc.double({ min: s.minimum ?? -1e6, max: s.maximum ?? 1e6, noNaN: true });
    case 'boolean':
      return fc.boolean();
    case 'null':
      return fc.constant(null);
    case 'array':
      return fc.array(s.items ? validValue(s.items) : fc.jsonValue({ maxDepth: 1 }), { minLength: s.minItems ?? 0, maxLength: Math.min(s.maxItems ?? 4, 6) });
    case 'object': {
      const props = s.properties ?? {};
      const rec = Object.fromEntries(Object.entries(props).map(([k, v]) => [k, validValue(v)]));
      return fc.record(rec, { requiredKeys: (s.required ?? []).filter((k) => k in props) });
    }
    default:
      return fc.jsonValue({ maxDepth: 2 });
  }
}

/** A value that breaks exactly the schema's own rules (or is simply of another type). */
export function invalidValue(s: Js): fc.Arbitrary<unknown> {
  const near: fc.Arbitrary<unknown>[] = [];
  switch (typeOf(s)) {
    case 'string':
      if (s.maxLength !== undefined) near.push(fc.integer({ min: 1, max: 500 }).map((n) => 'y'.repeat(s.maxLength! + n)));
      if (s.minLength) near.push(fc.constant('y'.repeat(s.minLength - 1)), fc.constant(' '.repeat(s.minLength + 1)));
      if (s.enum) near.push(fc.string({ maxLength: 12 }).filter((v) => !s.enum!.includes(v)), fc.constantFrom(...s.enum.map((e) => String(e).toUpperCase() + ' ')));
      if (s.format || s.pattern) near.push(fc.constantFrom('a@', '@b.c', 'a@b', 'plain', 'a@b.c\n', '<script>@x.y'));
      near.push(fc.integer(), fc.constant(['a']), fc.constant({ $gt: '' }));
      break;
    case 'integer':
    case 'number':
      if (s.minimum !== undefined) near.push(fc.constant(s.minimum - 1), fc.constant(-1e12));
      if (s.maximum !== undefined) near.push(fc.constant(s.maximum + 1), fc.constant(1e15));
      if (typeOf(s) === 'integer') near.push(fc.constantFrom(1.5, 2 ** 53 + 2, 1e21));
      near.push(fc.constantFrom('12', '1e3', '0x10', '', 'Infinity'), fc.constant([1]));
      break;
    case 'array':
      if (s.maxItems !== undefined) near.push(fc.constant(Array.from({ length: s.maxItems + 1 }, (_, i) => i + 1)));
      if (s.minItems) near.push(fc.constant([]));
      if (s.items) near.push(fc.array(invalidValue(s.items), { minLength: 1, maxLength: 3 }));
      near.push(fc.constant(Array.from({ length: 10_000 }, () => 1)), fc.constant('1,2'));
      break;
    case 'object': {
      const props = Object.keys(s.properties ?? {});
      if (props.length) {
        const base = validValue(s) as fc.Arbitrary<Record<string, unknown>>;
        near.push(
          fc.tuple(base, fc.constantFrom(...props)).map(([v, k]) => {
            const out = { ...v };
            delete out[k];
            return out;
          }),
          fc.tuple(base, fc.constantFrom(...props)).chain(([v, k]) => invalidValue(s.properties![k]).map((bad) => ({ ...v, [k]: bad }))),
          fc.tuple(base, fc.constantFrom(...props), junk).map(([v, k, j]) => ({ ...v, [k]: j })),
          base.map((v) => JSON.parse(`{"__proto__":{"isAdmin":true},"constructor":{"prototype":{"x":1}},${JSON.stringify(v).slice(1)}`.replace(/,}$/, '}'))),
        );
      }
      near.push(fc.constantFrom([], 'object', 42));
      break;
    }
  }
  return near.length ? fc.oneof(...near, junk) : junk;
}

/** A request body for a route: mostly near-misses, some valid, some arbitrary JSON. */
export function bodyFor(schema: ZodType | undefined): fc.Arbitrary<unknown> {
  if (!schema) return fc.oneof(junk, fc.jsonValue({ maxDepth: 3 }));
  const js = toJsonSchema(schema);
  return fc.oneof({ arbitrary: invalidValue(js), weight: 4 }, { arbitrary: validValue(js), weight: 1 }, { arbitrary: junk, weight: 1 });
}

/** A query string for a route: schema-driven when known, always strings (repeated keys for arrays). */
export function queryFor(schema: ZodType | undefined): fc.Arbitrary<string> {
  const obj = schema
    ? bodyFor(schema)
    : fc.dictionary(fc.string({ maxLength: 10 }), fc.oneof(fc.string({ maxLength: 20 }), fc.array(fc.string({ maxLength: 5 }), { maxLength: 3 })), { maxKeys: 4 });
  return obj.map((o) => {
    const qs = new URLSearchParams();
    if (o && typeof o === 'object' && !Array.isArray(o)) {
      for (const [k, v] of Object.entries(o)) {
        for (const item of Array.isArray(v) ? v : [v]) qs.append(k, typeof item === 'string' ? item : JSON.stringify(item) ?? '');
      }
    } else qs.append('q', JSON.stringify(o) ?? '');
    const s = qs.toString();
    return s.length > 6000 ? s.slice(0, 6000) : s;
  });
}

/** Path parameter values: mostly garbage, sometimes the real id (so the body is reached too). */
export function paramFor(real: string | undefined): fc.Arbitrary<string> {
  const garbage = fc.oneof(
    fc.constantFrom('0', '-1', '1.5', '1e3', '0x1f', '9'.repeat(30), '2147483648', '4294967296', ' 1', '1 ', 'null', 'undefined', '..', '%2e%2e', '..%2f..%2fetc', 'NaN', '[]', '{}', '$where', "1' OR '1'='1", '1;DROP TABLE users'),
    fc.string({ minLength: 1, maxLength: 30 }),
    fc.integer().map(String),
  );
  // Most values are sent %-encoded; a few raw escapes test the decoding itself.
  const encoded = fc.oneof(
    { arbitrary: garbage.map((v) => (/%2[ef]/i.test(v) ? v : encodeURIComponent(v))), weight: 5 },
    { arbitrary: fc.constantFrom('%', '%E0%A4%A', '%00', '%C0%AF', '%FF'), weight: 1 },
  );
  return real ? fc.oneof({ arbitrary: fc.constant(real), weight: 2 }, { arbitrary: encoded, weight: 3 }) : encoded;
}
