import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import proj4 from 'proj4';
import sharp from 'sharp';
import { booleanPointInPolygon } from '@turf/turf';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { resolveDefinition } from '../../shared/engine/definition.js';
import { createFactorEvaluator } from '../../shared/engine/evaluator.js';
import { processAudit } from '../../server/jobs/audit-processor.js';
import { sharedAuditEngine } from '../../server/jobs/engine-instance.js';
import { stopAuditJobs } from '../../server/jobs/runner.js';
import { createAuditProject, worldCountry, type AuditProject } from '../support/audit-fixture.js';
import { createStudioWithRoles, type StudioFixture } from '../support/studio-fixture.js';
import { createTestApp } from '../support/test-app.js';

const LAEA = '+proj=laea +lat_0=40 +lon_0=-4 +x_0=0 +y_0=0 +ellps=WGS84';
const MERC = '+proj=merc +lon_0=-4 +ellps=WGS84';

describe('heatmaps, overlays and exports', () => {
  let t: Awaited<ReturnType<typeof createTestApp>>;
  let s: StudioFixture;
  let other: StudioFixture;
  let p: AuditProject;
  let auditId: number;
  let base: string;

  const dataDirBefore = process.env.WARPMETER_DATA_DIR;
  // Pictures are cached on disk: this file's own directory, so "first request renders" holds.
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'wm-heatmaps-'));

  beforeAll(async () => {
    process.env.WARPMETER_DATA_DIR = dataDir;
    t = await createTestApp();
    s = await createStudioWithRoles(t);
    other = await createStudioWithRoles(t);
    p = await createAuditProject(t.deps, s, { geometry: worldCountry('Spain', '50m'), definitions: [LAEA, MERC], purpose: 'equal-area' });
    const res = await s.cartographer.post(`/api/projects/${p.projectId}/audits`, { samples: 4000, seed: 5 });
    expect(res.status).toBe(202);
    auditId = res.body.id;
    // Run the job here rather than waiting for a worker: this file tests what is drawn from the result.
    const engine = await sharedAuditEngine();
    // Another test file's worker on this run's queue may finish it first: either way it ends done, once.
    expect(['done', 'already-done']).toContain(await processAudit({ dataSource: t.deps.dataSource, logger: t.deps.logger, engine }, auditId));
    expect((await s.editor.get(`/api/audits/${auditId}`)).body.status).toBe('done');
    base = `/api/audits/${auditId}/candidates/${p.candidateIds[0]}`;
  });
  afterAll(async () => {
    await stopAuditJobs(t.deps);
    await t.close();
    if (dataDirBefore === undefined) delete process.env.WARPMETER_DATA_DIR;
    else process.env.WARPMETER_DATA_DIR = dataDirBefore;
    fs.rmSync(dataDir, { recursive: true, force: true });
  });

  it('renders a PNG of the requested size, transparent exactly outside the region', async () => {
    const SIZE = 160;
    const res = await s.editor.get(`${base}/heatmap/areal-scale.png?size=${SIZE}`).buffer(true);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('image/png');
    const { data, info } = await sharp(res.body).raw().toBuffer({ resolveWithObject: true });
    expect([info.width, info.height, info.channels]).toEqual([SIZE, SIZE, 4]);

    // Classify each pixel centre independently: proj4's own inverse, then turf's point-in-polygon on the region.
    const { frame } = (await s.editor.get(`${base}/overlay`)).body;
    const inv = proj4(LAEA);
    const inside = new Uint8Array(SIZE * SIZE);
    for (let py = 0; py < SIZE; py++) {
      for (let px = 0; px < SIZE; px++) {
        const x = frame.cx + ((px + 0.5) / SIZE - 0.5) * frame.span, y = frame.cy + (0.5 - (py + 0.5) / SIZE) * frame.span;
        const ll = inv.inverse([x, y]);
        inside[py * SIZE + px] = Number.isFinite(ll[0]) && booleanPointInPolygon(ll, { type: 'Feature', properties: {}, geometry: p.geometry }) ? 1 : 0;
      }
    }
    let checked = 0, insideCount = 0;
    const wrong: string[] = [];
    for (let py = 1; py < SIZE - 1; py++) {
      for (let px = 1; px < SIZE - 1; px++) {
        const i = py * SIZE + px;
        // Pixels next to the boundary may fall either way (the outline is drawn with straight projected segments).
        const edge = [-1, 0, 1].some((dy) => [-1, 0, 1].some((dx) => inside[i + dy * SIZE + dx] !== inside[i]));
        if (edge) continue;
        checked++;
        const alpha = data[i * 4 + 3];
        if (inside[i]) insideCount++;
        if (inside[i] ? alpha === 0 : alpha !== 0) wrong.push(`${px},${py} inside=${inside[i]} alpha=${alpha}`);
      }
    }
    expect(wrong.slice(0, 5)).toEqual([]);
    expect(insideCount).toBeGreaterThan(2000);
    expect(checked - insideCount).toBeGreaterThan(2000);
  });

  it('serves the cached picture the second time, with an ETag', async () => {
    const url = `${base}/heatmap/angular-deformation.png?size=200`;
    const first = await s.cartographer.get(url).buffer(true);
    expect(first.status).toBe(200);
    expect(first.headers['x-heatmap-cache']).toBe('miss');
    const second = await s.editor.get(url).buffer(true);
    expect(second.headers['x-heatmap-cache']).toBe('hit');
    expect(Buffer.compare(first.body, second.body)).toBe(0);
    expect(second.headers.etag).toBe(first.headers.etag);
    expect(second.headers['cache-control']).toMatch(/max-age=\d+/);
    expect(fs.readdirSync(path.join(dataDir, 'heatmaps', String(auditId))).filter((f) => f.includes('angular-deformation-200'))).toHaveLength(1);
    const notModified = await s.editor.get(url).set('If-None-Match', first.headers.etag);
    expect(notModified.status).toBe(304);
  });

  it('refuses sizes and fields it does not draw', async () => {
    for (const q of ['size=32', 'size=4096', 'size=abc']) {
      const res = await s.editor.get(`${base}/heatmap/areal-scale.png?${q}`);
      expect(res.status, q).toBe(422);
      expect(res.body.error.fields.size).toBeTruthy();
    }
    const bad = await s.editor.get(`${base}/heatmap/colour.png`);
    expect(bad.status).toBe(422);
  });

  it('gives each field a legend centred where it should be', async () => {
    const areal = (await s.editor.get(`${base}/heatmap/areal-scale/legend`)).body;
    expect(areal.scale).toBe('log');
    expect(areal.stops).toHaveLength(9);
    expect(areal.domain[0]).toBeLessThan(1);
    expect(areal.domain[1]).toBeGreaterThan(1);
    // Symmetric in ln s about 1: the middle stop is s = 1.
    expect(areal.stops[4].value).toBeCloseTo(1, 12);
    expect(areal.domain[0] * areal.domain[1]).toBeCloseTo(1, 12);
    const omega = (await s.editor.get(`${base}/heatmap/angular-deformation/legend`)).body;
    expect(omega.units).toBe('degrees');
    expect(omega.domain[0]).toBe(0);
  });

  it('draws the overlay in the heatmap’s frame: outline, graticule, Tissot ellipses and worst points', async () => {
    const o = (await s.editor.get(`${base}/overlay`)).body;
    const pts = o.outline.flat();
    expect(pts.length).toBeGreaterThan(50);
    for (const [x, y] of pts) {
      expect(x).toBeGreaterThanOrEqual(0);
      expect(x).toBeLessThanOrEqual(1000);
      expect(y).toBeGreaterThanOrEqual(0);
      expect(y).toBeLessThanOrEqual(1000);
    }
    expect(o.graticule.lines.length).toBeGreaterThan(4);
    expect(o.tissot.length).toBeGreaterThan(5);
    // Lambert azimuthal equal-area: s = ab = 1 everywhere (Snyder 1987, ch. 24).
    for (const e of o.tissot) expect(e.a * e.b).toBeCloseTo(1, 9);
    expect(o.worst.map((w: { kind: string }) => w.kind)).toContain('angular-deformation');
  });

  it('exports the samples as GeoJSON with the engine’s factors at each point', async () => {
    const res = await s.editor.get(`${base}/samples.geojson`);
    expect(res.status).toBe(200);
    const fc = JSON.parse(res.text);
    expect(fc.type).toBe('FeatureCollection');
    expect(fc.features.length).toBeGreaterThan(3000);
    const ev = createFactorEvaluator(resolveDefinition(LAEA));
    const out = new Float64Array(8);
    for (const f of fc.features.slice(0, 50)) {
      const [lon, lat] = f.geometry.coordinates;
      expect(ev.factorsRad((lon * Math.PI) / 180, (lat * Math.PI) / 180, out)).toBe(true);
      expect(f.properties.omega).toBeCloseTo(out[3], 4);
      expect(f.properties.s).toBeCloseTo(out[2], 6);
      expect(f.properties.a * f.properties.b).toBeCloseTo(f.properties.s, 5);
    }
  });

  it('exports the definition as PROJ string and as WKT that reads back to the same projection', async () => {
    const projTxt = await s.client.get(`/api/projects/${p.projectId}/candidates/${p.candidateIds[1]}/definition.proj`);
    expect(projTxt.status).toBe(404);
    const proj = await s.editor.get(`/api/projects/${p.projectId}/candidates/${p.candidateIds[1]}/definition.proj`);
    expect(proj.status).toBe(200);
    expect(proj.text.trim()).toBe(resolveDefinition(MERC).resolved);
    const wkt = await s.editor.get(`/api/projects/${p.projectId}/candidates/${p.candidateIds[0]}/definition.wkt`);
    expect(wkt.status).toBe(200);
    expect(wkt.text).toMatch(/^PROJCS\[.*PROJECTION\["Lambert_Azimuthal_Equal_Area"\]/);
    const a = proj4(LAEA).forward([2.2, 41.4]);
    const b = proj4(wkt.text.trim()).forward([2.2, 41.4]);
    expect(Math.hypot(a[0] - b[0], a[1] - b[1])).toBeLessThan(1e-6);
  });

  it('keeps every picture and export inside the studio', async () => {
    const urls = [
      `${base}/heatmap/areal-scale.png`,
      `${base}/heatmap/areal-scale/legend`,
      `${base}/overlay`,
      `${base}/route?from=-8,43&to=3,42`,
      `${base}/samples.geojson`,
      `/api/projects/${p.projectId}/candidates/${p.candidateIds[0]}/definition.proj`,
      `/api/projects/${p.projectId}/candidates/${p.candidateIds[0]}/definition.wkt`,
    ];
    for (const url of urls) {
      expect((await s.cartographer.get(url)).status, url).toBe(200);
      expect((await s.client.get(url)).status, `${url} as unshared client`).toBe(404);
      expect((await other.admin.get(url)).status, `${url} from another studio`).toBe(404);
    }
    expect((await s.editor.get(`/api/audits/${auditId}/candidates/999999/overlay`)).status).toBe(404);
  });
});
