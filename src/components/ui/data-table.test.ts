import { describe, expect, it } from 'vitest';
import { compareSortValues, sortRows } from './data-table.js';

const rows = [
  { name: 'Ortelius', seats: 3, since: '2024-05-01' },
  { name: 'mercator', seats: null, since: '2021-01-10' },
  { name: 'Cassini', seats: 12, since: '2023-11-30' },
  { name: 'P10 studio', seats: 2, since: '2022-02-02' },
  { name: 'P2 studio', seats: 2, since: '2020-07-07' },
];

describe('sortRows', () => {
  it('orders text case-insensitively and numbers inside text naturally', () => {
    expect(sortRows(rows, (r) => r.name, 'ascending').map((r) => r.name)).toEqual([
      'Cassini',
      'mercator',
      'Ortelius',
      'P2 studio',
      'P10 studio',
    ]);
  });

  it('orders numbers by size, keeps missing values last in both directions and ties stable', () => {
    expect(sortRows(rows, (r) => r.seats, 'ascending').map((r) => r.name)).toEqual([
      'P10 studio',
      'P2 studio',
      'Ortelius',
      'Cassini',
      'mercator',
    ]);
    expect(sortRows(rows, (r) => r.seats, 'descending').map((r) => r.name)).toEqual([
      'Cassini',
      'Ortelius',
      'P10 studio',
      'P2 studio',
      'mercator',
    ]);
  });

  it('orders ISO dates as text chronologically and leaves the input untouched', () => {
    const copy = rows.slice();
    expect(sortRows(rows, (r) => r.since, 'descending')[0].name).toBe('Ortelius');
    expect(rows).toEqual(copy);
  });
});

describe('compareSortValues', () => {
  it('treats NaN like a missing value and compares dates by time', () => {
    expect(compareSortValues(Number.NaN, 1)).toBeGreaterThan(0);
    expect(compareSortValues(new Date('2020-01-01'), new Date('2019-01-01'))).toBeGreaterThan(0);
  });
});
