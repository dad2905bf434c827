/** WARPMETER_DB_POOL: the pool size read from the environment. */
import { describe, expect, it } from 'vitest';
import { loadConfig, parseDbPool } from './config';

describe('parseDbPool', () => {
  it('defaults to twice the cores plus one, never below three', () => {
    expect(parseDbPool(undefined, 2)).toBe(5);
    expect(parseDbPool('', 8)).toBe(17);
    expect(parseDbPool(undefined, 1)).toBe(3);
  });
  it('takes a whole number from 1 to 200', () => {
    expect(parseDbPool('1', 2)).toBe(1);
    expect(parseDbPool(' 12 ', 2)).toBe(12);
    expect(parseDbPool('200', 2)).toBe(200);
  });
  it('refuses anything else with a message naming the variable', () => {
    for (const bad of ['0', '201', '-3', 'ten', '2.5', '5x', '1e2']) expect(() => parseDbPool(bad, 2)).toThrow(/WARPMETER_DB_POOL must be a whole number of connections from 1 to 200/);
  });
  it('is what loadConfig puts in db.poolSize', () => {
    expect(loadConfig({ WARPMETER_DB_POOL: '7' }).db.poolSize).toBe(7);
    expect(() => loadConfig({ WARPMETER_DB_POOL: 'lots' })).toThrow(/WARPMETER_DB_POOL/);
  });
});
