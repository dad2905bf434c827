import { createHash } from 'node:crypto';

/**
 * One byte-exact JSON text per value, so a hash of it identifies the value and anyone can
 * recompute it: object keys sorted by UTF-16 code units, no whitespace, numbers in ECMAScript's
 * shortest round-trip form (Number::toString, ECMA-262 §6.1.6.1.20) with −0 written as 0, and
 * strings as JSON.stringify escapes them. This follows the JSON Canonicalization Scheme
 * (RFC 8785) for the values we hash (finite numbers, strings, booleans, null, arrays, objects).
 *
 * canonicalJson({ b: [1, -0, 0.1], a: 'x' }) === '{"a":"x","b":[1,0,0.1]}'
 */
export function canonicalJson(value: unknown): string {
  return write(value, '$');
}

function write(v: unknown, at: string): string {
  if (v === null) return 'null';
  switch (typeof v) {
    case 'boolean':
      return v ? 'true' : 'false';
    case 'string':
      return JSON.stringify(v);
    case 'number':
      if (!Number.isFinite(v)) throw new Error(`canonical JSON cannot hold ${v} (at ${at})`);
      return Object.is(v, -0) ? '0' : String(v);
    case 'object': {
      if (Array.isArray(v)) return `[${v.map((x, i) => write(x, `${at}[${i}]`)).join(',')}]`;
      const keys = Object.keys(v as object)
        .filter((k) => (v as Record<string, unknown>)[k] !== undefined)
        .sort();
      return `{${keys.map((k) => `${JSON.stringify(k)}:${write((v as Record<string, unknown>)[k], `${at}.${k}`)}`).join(',')}}`;
    }
    default:
      throw new Error(`canonical JSON cannot hold a ${typeof v} (at ${at})`);
  }
}

/** SHA-256 (hex) of the canonical JSON of a value. */
export function canonicalSha256(value: unknown): string {
  return createHash('sha256').update(canonicalJson(value), 'utf8').digest('hex');
}
