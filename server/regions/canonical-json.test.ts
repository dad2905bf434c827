import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { canonicalJson, canonicalSha256 } from './canonical-json.js';

describe('canonicalJson', () => {
  it('sorts keys at every depth, drops undefined members and writes no whitespace', () => {
    expect(canonicalJson({ b: { d: 1, c: [true, null] }, a: 'x', u: undefined })).toBe('{"a":"x","b":{"c":[true,null],"d":1}}');
  });

  it('writes the same text for equal values built in a different key order', () => {
    const one = { type: 'Polygon', coordinates: [[[0, 0], [1, 0], [1, 1], [0, 0]]] };
    const two = { coordinates: one.coordinates, type: 'Polygon' };
    expect(canonicalJson(two)).toBe(canonicalJson(one));
  });

  it('formats numbers in the shortest round-trip form, −0 as 0 (RFC 8785, serialization of numbers)', () => {
    expect(canonicalJson([-0, 0.1, 0.1 + 0.2, 1e21, 1e-7, -122.4194])).toBe('[0,0.1,0.30000000000000004,1e+21,1e-7,-122.4194]');
  });

  it('refuses values JSON cannot hold exactly', () => {
    expect(() => canonicalJson({ a: [1, NaN] })).toThrow(/NaN \(at \$\.a\[1\]\)/);
    expect(() => canonicalJson({ a: Infinity })).toThrow(/Infinity/);
    expect(() => canonicalJson({ f: () => 1 })).toThrow(/function/);
  });

  it('hashes the canonical text with SHA-256 (checked against coreutils sha256sum)', () => {
    const text = canonicalJson({ z: 1, a: [0.5, 'é'] });
    const reference = execFileSync('sha256sum', { input: Buffer.from(text, 'utf8') }).toString().split(' ')[0];
    expect(canonicalSha256({ a: [0.5, 'é'], z: 1 })).toBe(reference);
  });
});
