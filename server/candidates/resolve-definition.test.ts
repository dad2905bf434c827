import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';
import { describe, expect, it } from 'vitest';
import { resolveDefinition as resolveWithWholeIndex } from '../../shared/engine/definition.js';
import { epsgWkt, lookupEpsgCode, resolveDefinition } from './resolve-definition.js';

// The reference is epsg-index's own all.json, read here as plain JSON.
const ALL: Record<string, unknown> = JSON.parse(readFileSync(createRequire(import.meta.url).resolve('epsg-index/all.json'), 'utf8'));
const root = (p: string) => fileURLToPath(new URL(`../../${p}`, import.meta.url));

describe('EPSG codes read one file at a time', () => {
  it('gives the same entries as the whole index (every 25th code, and the first and last)', () => {
    const codes = Object.keys(ALL);
    const picked = codes.filter((_, i) => i % 25 === 0 || i === codes.length - 1);
    expect(picked.length).toBeGreaterThan(300);
    for (const code of picked) expect(lookupEpsgCode(Number(code)), `EPSG:${code}`).toEqual(ALL[code]);
  });

  it('resolves definitions exactly as the engine does with its bundled index', () => {
    for (const def of ['EPSG:5070', 'EPSG:3035', 'epsg:32633', 'EPSG:3031', '+proj=robin +lon_0=10']) {
      expect(resolveDefinition(def), def).toEqual(resolveWithWholeIndex(def));
    }
  });

  it('answers "no such code" for codes the index lacks and for anything that is not a positive whole number', () => {
    expect(lookupEpsgCode(999_999)).toBeUndefined();
    for (const odd of [0, -3857, 3857.5, Number.NaN, Infinity, 2 ** 60]) expect(lookupEpsgCode(odd), String(odd)).toBeUndefined();
    expect(() => resolveDefinition('EPSG:999999')).toThrow(/unknown EPSG code 999999/);
    expect(() => resolveDefinition('EPSG:4326')).toThrow(/not a projected CRS/);
    // Asked again, the remembered answers are the same.
    expect(lookupEpsgCode(999_999)).toBeUndefined();
    expect(lookupEpsgCode(5070)?.name).toBe('NAD83 / Conus Albers');
  });

  it('gives the index’s own WKT for an EPSG definition, and null for anything else', () => {
    expect(epsgWkt('EPSG:5070')).toBe((ALL['5070'] as { wkt: string }).wkt);
    expect(epsgWkt('epsg: 3035')).toBe((ALL['3035'] as { wkt: string }).wkt);
    for (const other of ['EPSG:999999', '+proj=laea +lat_0=52 +lon_0=10', 'EPSG:5070 extra', '']) expect(epsgWkt(other), other).toBeNull();
  });

  it('leaves Object.prototype alone whatever keys a typed definition carries', () => {
    // proj4js/proj4js#414 reports prototype pollution (CVE-2022-37578) through crafted definitions,
    // with no fixed version named; definitions reach proj4 from what people type.
    const hostile = [
      '+proj=merc +__proto__=1 +lon_0=3',
      '+proj=tmerc +constructor=1 +prototype=2 +polluted=yes',
      'PROJCS["x",GEOGCS["g",DATUM["__proto__",SPHEROID["s",6378137,298.257]],PRIMEM["Greenwich",0],UNIT["degree",0.0174532925199433]],PROJECTION["Mercator_1SP"],PARAMETER["__proto__",5],PARAMETER["polluted",1],UNIT["metre",1]]',
      'PROJCS["__proto__",GEOGCS["constructor",DATUM["d",SPHEROID["prototype",6378137,298.257]],PRIMEM["Greenwich",0],UNIT["degree",0.0174532925199433]],PROJECTION["__proto__"],UNIT["metre",1]]',
    ];
    for (const def of hostile) {
      try {
        resolveDefinition(def);
      } catch {
        // Refusing is fine; changing every object in the process is not.
      }
      expect(Object.keys(Object.prototype), def).toEqual([]);
      expect(({} as Record<string, unknown>).polluted, def).toBeUndefined();
    }
  });

  it('keeps the whole index out of the web server, the audit worker and their threads', async () => {
    const entries = ['server/index.ts', 'server/jobs/worker-main.ts', 'server/engine-tasks/engine-task-worker.ts', 'server/engine-pool/factors-worker.ts'];
    const result = await build({
      entryPoints: entries.map(root),
      bundle: true,
      platform: 'node',
      format: 'esm',
      packages: 'external',
      metafile: true,
      write: false,
      outdir: '/nonexistent',
      logLevel: 'silent',
    });
    const inputs = Object.keys(result.metafile.inputs);
    // The check can see the engine at all: the server's modules and the engine's are among the inputs.
    expect(inputs).toContain('server/candidates/resolve-definition.ts');
    expect(inputs).toContain('shared/engine/definition-core.ts');
    expect(inputs.filter((f) => f === 'shared/engine/epsg.ts' || f === 'shared/engine/definition.ts' || f === 'shared/engine/index.ts')).toEqual([]);
    const externals = Object.values(result.metafile.outputs).flatMap((o) => o.imports.map((i) => i.path));
    expect(externals.filter((p) => p.startsWith('epsg-index'))).toEqual([]);
  });
});
