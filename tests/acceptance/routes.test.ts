import geographiclib from 'geographiclib-geodesic';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { processAudit } from '../../server/jobs/audit-processor.js';
import { sharedAuditEngine } from '../../server/jobs/engine-instance.js';
import { stopAuditJobs } from '../../server/jobs/runner.js';
import { createAuditProject, worldCountry, type AuditProject } from '../support/audit-fixture.js';
import { createStudioWithRoles, type StudioFixture } from '../support/studio-fixture.js';
import { createTestApp } from '../support/test-app.js';

const MERCATOR = '+proj=merc +lon_0=-30 +ellps=WGS84';
const GNOMONIC = '+proj=gnom +lat_0=50 +lon_0=-30 +x_0=0 +y_0=0 +R=6371000';
const NEW_YORK: [number, number] = [-74.006, 40.7128];
const LONDON: [number, number] = [-0.1276, 51.5072];
const geod = geographiclib.Geodesic.WGS84;

type XY = [number, number];
/** Largest distance of any point from the chord through the first and last, over the chord's length. */
function deviationFromChord(points: XY[]): number {
  const [x0, y0] = points[0], [x1, y1] = points[points.length - 1];
  const len = Math.hypot(x1 - x0, y1 - y0);
  let worst = 0;
  for (const [x, y] of points) worst = Math.max(worst, Math.abs((x1 - x0) * (y0 - y) - (x0 - x) * (y1 - y0)) / len);
  return worst / len;
}
const polylineLength = (points: XY[]) => points.slice(1).reduce((sum, p, i) => sum + Math.hypot(p[0] - points[i][0], p[1] - points[i][1]), 0);

describe('great-circle and rhumb routes drawn on candidates', () => {
  let t: Awaited<ReturnType<typeof createTestApp>>;
  let s: StudioFixture;
  let p: AuditProject;
  let auditId: number;
  const route = async (candidate: number) => {
    const res = await s.editor.get(`/api/audits/${auditId}/candidates/${candidate}/route?from=${NEW_YORK.join(',')}&to=${LONDON.join(',')}`);
    expect(res.status).toBe(200);
    const byKind = Object.fromEntries(res.body.lines.map((l: { kind: string }) => [l.kind, l]));
    return { body: res.body, gc: byKind['great-circle'], rhumb: byKind.rhumb };
  };

  beforeAll(async () => {
    t = await createTestApp();
    s = await createStudioWithRoles(t);
    p = await createAuditProject(t.deps, s, { geometry: worldCountry('Iceland', '50m'), definitions: [MERCATOR, GNOMONIC] });
    const res = await s.cartographer.post(`/api/projects/${p.projectId}/audits`, { samples: 3000 });
    auditId = res.body.id;
    const engine = await sharedAuditEngine();
    await processAudit({ dataSource: t.deps.dataSource, logger: t.deps.logger, engine }, auditId);
  });
  afterAll(async () => {
    await stopAuditJobs(t.deps);
    await t.close();
  });

  it('draws the rhumb line straight on Mercator and the great circle curved', async () => {
    const { gc, rhumb } = await route(p.candidateIds[0]);
    expect(rhumb.pointsM.length).toBeGreaterThan(50);
    // A loxodrome is a straight line on Mercator (Snyder 1987, ch. 7).
    expect(deviationFromChord(rhumb.pointsM)).toBeLessThan(1e-9);
    expect(deviationFromChord(gc.pointsM)).toBeGreaterThan(1e-2);
  });

  it('draws the great circle straight on the gnomonic and the rhumb line curved', async () => {
    const { gc, rhumb } = await route(p.candidateIds[1]);
    // Every great circle is a straight line on the gnomonic projection (Snyder 1987, ch. 22).
    expect(deviationFromChord(gc.pointsM)).toBeLessThan(1e-9);
    expect(deviationFromChord(rhumb.pointsM)).toBeGreaterThan(1e-2);
  });

  it('reports distance errors as GeographicLib ground length against the projected length after the best scale', async () => {
    // The best uniform scale, recomputed from the exported samples: ln c = −½ mean(ln a + ln b).
    const samples = JSON.parse((await s.editor.get(`/api/audits/${auditId}/candidates/${p.candidateIds[0]}/samples.geojson`)).text);
    const lnAb = samples.features.map((f: { properties: { a: number; b: number } }) => Math.log(f.properties.a) + Math.log(f.properties.b));
    const c = Math.exp(-lnAb.reduce((x: number, y: number) => x + y, 0) / (2 * lnAb.length));

    for (const candidate of p.candidateIds) {
      const { body, gc, rhumb } = await route(candidate);
      if (candidate === p.candidateIds[0]) expect(body.bestScale).toBeCloseTo(c, 6);
      const geodesicM = geod.Inverse(NEW_YORK[1], NEW_YORK[0], LONDON[1], LONDON[0]).s12!;
      // Karney's GeographicLib gives 5 570 km for this pair; the rhumb line is longer.
      expect(gc.groundLengthM).toBeCloseTo(geodesicM, 3);
      let rhumbM = 0;
      for (let i = 1; i < rhumb.pointsLonLat.length; i++) {
        const [a, b] = [rhumb.pointsLonLat[i - 1], rhumb.pointsLonLat[i]];
        rhumbM += geod.Inverse(a[1], a[0], b[1], b[0]).s12!;
      }
      expect(rhumb.groundLengthM).toBeCloseTo(rhumbM, 3);
      expect(rhumb.groundLengthM).toBeGreaterThan(gc.groundLengthM);
      for (const line of [gc, rhumb]) {
        const projectedM = polylineLength(line.pointsM);
        expect(line.projectedLengthM).toBeCloseTo(projectedM, 3);
        expect(line.scaledLengthM).toBeCloseTo(projectedM * body.bestScale, 3);
        expect(line.relativeError).toBeCloseTo((projectedM * body.bestScale) / line.groundLengthM - 1, 9);
        expect(line.continuous).toBe(true);
      }
    }
  });

  it('explains places it cannot use', async () => {
    const base = `/api/audits/${auditId}/candidates/${p.candidateIds[0]}/route`;
    const garbled = await s.editor.get(`${base}?from=New%20York&to=0,51`);
    expect(garbled.status).toBe(422);
    expect(garbled.body.error.fields.from).toMatch(/longitude,latitude/);
    const north = await s.editor.get(`${base}?from=0,95&to=0,51`);
    expect(north.status).toBe(422);
    expect(north.body.error.fields.from).toMatch(/Latitude 95/);
    const antipodes = await s.editor.get(`${base}?from=0,10&to=180,-10`);
    expect(antipodes.status).toBe(400);
    expect(antipodes.body.error.message).toMatch(/antipodal/);
  });
});
