import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startAuditJobs, stopAuditJobs } from '../../server/jobs/runner.js';
import { createStudioWithRoles, type StudioFixture } from '../support/studio-fixture.js';
import { createTestApp } from '../support/test-app.js';

/**
 * The whole path through the product's own routes — project, region upload, candidates, a
 * background audit, shortlist, approval, verify — and the project's history telling it back.
 */
type TestApp = Awaited<ReturnType<typeof createTestApp>>;
let t: TestApp;
let s: StudioFixture;

const REGION = {
  type: 'FeatureCollection',
  features: [
    {
      type: 'Feature',
      properties: { name: 'Loire valley' },
      geometry: { type: 'Polygon', coordinates: [[[-1, 46.5], [3, 46.5], [3, 48], [-1, 48], [-1, 46.5]]] },
    },
  ],
};

beforeAll(async () => {
  t = await createTestApp();
  await startAuditJobs(t.deps);
  s = await createStudioWithRoles(t);
});
afterAll(async () => {
  await stopAuditJobs(t.deps);
  await t?.close();
});

async function waitDone(auditId: number) {
  for (let i = 0; i < 300; i++) {
    const res = await s.editor.get(`/api/audits/${auditId}`);
    if (res.body.status === 'done' || res.body.status === 'failed') return res.body;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`audit ${auditId} did not finish`);
}

describe('project history', () => {
  it('records uploads, candidates, audits, the shortlist and the decision, newest first, with who and when', async () => {
    const project = await s.cartographer.post('/api/projects', { title: 'Loire atlas', clientName: 'River Press', purpose: 'conformal', scaleBand: 'province' });
    expect(project.status).toBe(201);
    const id: number = project.body.id;

    const upload = await s.cartographer.agent
      .post(`/api/projects/${id}/regions`)
      .set('x-csrf-token', s.cartographer.csrf)
      .field('features', 'all')
      .attach('file', Buffer.from(JSON.stringify(REGION)), 'loire.geojson');
    expect(upload.status, JSON.stringify(upload.body)).toBe(201);

    const ids: number[] = [];
    for (const definition of ['+proj=lcc +lat_1=46.75 +lat_2=47.75 +lat_0=47 +lon_0=1 +x_0=0 +y_0=0 +ellps=WGS84', '+proj=merc +lon_0=1 +ellps=WGS84']) {
      const c = await s.cartographer.post(`/api/projects/${id}/candidates`, { definition, origin: 'entered' });
      expect(c.status, JSON.stringify(c.body)).toBe(201);
      ids.push(c.body.id);
    }
    const spare = await s.cartographer.post(`/api/projects/${id}/candidates`, { definition: '+proj=laea +lat_0=47 +lon_0=1 +x_0=0 +y_0=0 +ellps=WGS84', origin: 'entered' });
    expect((await s.cartographer.patch(`/api/projects/${id}/candidates/${spare.body.id}`, { label: 'Spare LAEA' })).status).toBe(200);
    expect((await s.cartographer.delete(`/api/projects/${id}/candidates/${spare.body.id}`)).status).toBe(204);

    const started = await s.cartographer.post(`/api/projects/${id}/audits`, { candidateIds: ids, samples: 2000, seed: 11 });
    expect(started.status, JSON.stringify(started.body)).toBe(202);
    const audit = await waitDone(started.body.id);
    expect(audit.status).toBe('done');

    const round = await s.editor.post(`/api/projects/${id}/rounds`, { auditId: audit.id, candidateIds: ids, recommendation: 'Conformal conic.', reviewerEmails: [s.users.client.email] });
    expect(round.status, JSON.stringify(round.body)).toBe(201);
    const approved = await s.client.post(`/api/rounds/${round.body.id}/approve`, { candidateId: ids[0], signature: s.users.client.name });
    expect(approved.status).toBe(201);
    // The record made from a real audit re-runs to the same hash.
    const verified = await s.cartographer.post(`/api/signoffs/${approved.body.id}/verify`);
    expect(verified.body).toMatchObject({ hashMatches: true, metricsMatch: true });

    const events = (await s.editor.get(`/api/projects/${id}/activity`)).body.events as Array<{ kind: string; actorName: string; actorRole: string; summary: string; createdAt: string }>;
    const kinds = events.map((e) => e.kind).reverse();
    for (const kind of ['project.created', 'region.uploaded', 'candidate.added', 'candidate.relabelled', 'candidate.removed', 'audit.started', 'audit.finished', 'round.requested', 'round.approved', 'signoff.verified']) {
      expect(kinds, kind).toContain(kind);
    }
    // Oldest to newest, the story is in the order it happened.
    const order = ['project.created', 'region.uploaded', 'candidate.removed', 'audit.started', 'audit.finished', 'round.requested', 'round.approved', 'signoff.verified'];
    expect(order.map((k) => kinds.indexOf(k))).toEqual([...order.map((k) => kinds.indexOf(k))].sort((a, b) => a - b));
    const byKind = (k: string) => events.find((e) => e.kind === k)!;
    expect(byKind('region.uploaded')).toMatchObject({ actorName: s.users.cartographer.name, actorRole: 'cartographer' });
    expect(byKind('region.uploaded').summary).toContain('loire.geojson');
    expect(byKind('candidate.removed').summary).toContain('Spare LAEA');
    expect(byKind('audit.started')).toMatchObject({ actorRole: 'cartographer' });
    expect(byKind('audit.finished')).toMatchObject({ actorRole: 'system' });
    expect(byKind('round.approved')).toMatchObject({ actorName: s.users.client.name, actorRole: 'client' });
    expect(events.every((e) => !Number.isNaN(Date.parse(e.createdAt)))).toBe(true);
  });
});
