/** Proposals (one-sixth rule, Deetz & Adams, USC&GS SP 68, from memory) and the optimiser. */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { optimise } from './optimise';
import type { RegionFeature, RegionInput } from './region/geojson';
import { prepareRegion } from './region/prepare';
import { regionSummary } from './region/summary';
import { MAP_PURPOSES, suggestCandidates } from './suggest';
import { minimise } from './nelder-mead';
import { resolveDefinition } from './definition';

const fixture = (name: string) => JSON.parse(readFileSync(new URL(`../../fixtures/regions/engine-${name}.geojson`, import.meta.url), 'utf8')) as RegionFeature;
const box = (w: number, s: number, e: number, n: number): RegionInput => ({ type: 'Polygon', coordinates: [[[w, s], [e, s], [e, n], [w, n], [w, s]]] });

describe('suggestCandidates', () => {
  it.each([
    ['mid-latitude east–west box', box(-125, 25, -65, 49)],
    ['Chile (long north–south)', fixture('chile')],
    ['Antarctica (polar)', fixture('antarctica')],
    ['Indonesia (equatorial)', fixture('indonesia')],
    ['the world', box(-180, -85, 180, 85)],
  ])('%s: 6–12 resolvable candidates with reasons, for every purpose', (_name, region) => {
    const summary = regionSummary(prepareRegion(region));
    for (const purpose of MAP_PURPOSES) {
      const list = suggestCandidates(summary, purpose);
      expect(list.length).toBeGreaterThanOrEqual(6);
      expect(list.length).toBeLessThanOrEqual(12);
      for (const c of list) {
        expect(c.reason.length).toBeGreaterThan(10);
        expect(resolveDefinition(c.definition).family.id).toBe(c.family);
      }
    }
  });
  it('puts conics with one-sixth-rule parallels first for an equal-area mid-latitude map', () => {
    const list = suggestCandidates(regionSummary(prepareRegion(box(-125, 25, -65, 49))), 'equal-area');
    expect(list[0].family).toBe('aea');
    expect(list[0].definition).toContain('+lat_1=29 +lat_2=45');
  });
  it('proposes polar aspects for polar regions and world maps for the world', () => {
    const polar = suggestCandidates(regionSummary(prepareRegion(fixture('antarctica'))), 'conformal');
    expect(polar[0].definition).toMatch(/\+proj=stere \+lat_0=-90/);
    const world = suggestCandidates(regionSummary(prepareRegion(box(-180, -85, 180, 85))), 'equal-area').map((c) => c.family);
    expect(world).toEqual(expect.arrayContaining(['eqearth', 'moll']));
    const chile = suggestCandidates(regionSummary(prepareRegion(fixture('chile'))), 'conformal');
    expect(chile.some((c) => c.family === 'tmerc' && /north to south/.test(c.reason))).toBe(true);
  });
});

describe('optimise', () => {
  it('Nelder–Mead finds a quadratic bowl inside bounds', () => {
    const r = minimise((x) => (x[0] - 1) ** 2 + 3 * (x[1] + 2) ** 2, [0, 0], [[-5, 5], [-5, 5]]);
    expect(r.x[0]).toBeCloseTo(1, 3);
    expect(r.x[1]).toBeCloseTo(-2, 3);
    const bounded = minimise((x) => (x[0] - 10) ** 2, [0], [[-5, 5]]);
    expect(bounded.x[0]).toBeCloseTo(5, 6);
  });
  it('improves a conic over the one-sixth rule and never reports a loss', () => {
    const r = optimise(box(-125, 25, -65, 49), 'lcc', 'airy-kavrayskiy', { samples: 1500 });
    expect(r.metric).toBeLessThanOrEqual(r.baseline.metric);
    expect(r.gainPct).toBeGreaterThanOrEqual(0);
    expect(r.params.lat_1).toBeGreaterThan(20);
    expect(r.params.lat_2).toBeLessThan(55);
    expect(resolveDefinition(r.definition).family.id).toBe('lcc');
  });
  it('moves an azimuthal centre and a transverse Mercator meridian towards the region', () => {
    const region = box(20, 40, 30, 50);
    const laea = optimise(region, 'laea', 'angular', { samples: 800 });
    expect(laea.params.lat_0).toBeGreaterThan(42);
    expect(laea.params.lat_0).toBeLessThan(48);
    const tm = optimise(region, 'tmerc', 'airy-kavrayskiy', { samples: 800 });
    expect(tm.params.k_0).toBeLessThan(1);
    expect(tm.gainPct).toBeGreaterThan(0);
    expect(() => optimise(region, 'robin', 'areal')).toThrow(/no parameter search/);
  });
});
