import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { resolveDefinition } from '../../shared/engine/definition.js';
import { prepareRegion } from '../../shared/engine/region/prepare.js';
import { sampleRegion } from '../../shared/engine/sampling.js';
import { scoreCandidate } from '../../shared/engine/scorecard.js';
import { Audit, Candidate, MapProject, ProjectAccess, Region, Scorecard } from '../../server/entities/index.js';
import { canonicalSha256 } from '../../server/regions/canonical-json.js';
import { ENGINE_VERSION } from '../../shared/engine/version.js';
import { seedDemoAudits } from '../../server/jobs/demo-audits.js';
import { recoverAudits } from '../../server/jobs/recover.js';
import { createAuditRow } from '../../server/services/audits.service.js';
import { auditJobs, startAuditJobs, stopAuditJobs } from '../../server/jobs/runner.js';
import { createAuditProject, waitForAudit, type AuditProject } from '../support/audit-fixture.js';
import { createStudioWithRoles, type StudioFixture } from '../support/studio-fixture.js';
import { createTestApp } from '../support/test-app.js';

const DEFS = [
  '+proj=tmerc +lat_0=0 +lon_0=-71 +k_0=0.9996 +x_0=500000 +y_0=10000000 +ellps=WGS84',
  '+proj=laea +lat_0=-37 +lon_0=-71 +x_0=0 +y_0=0 +ellps=WGS84',
  '+proj=merc +lon_0=-71 +ellps=WGS84',
];

/** The same audit computed here in one thread by the engine's own scoreCandidate, without queue or pool. */
function directScorecards(p: AuditProject, samples: number, seed: number) {
  const region = prepareRegion(p.geometry);
  const points = sampleRegion(region, { count: samples, seed });
  return DEFS.map((def) => JSON.parse(JSON.stringify(scoreCandidate(resolveDefinition(def), points, region))));
}

describe('audits as background jobs', () => {
  let t: Awaited<ReturnType<typeof createTestApp>>;
  let s: StudioFixture;
  let other: StudioFixture;
  let p: AuditProject;
  let doneAuditId: number;

  beforeAll(async () => {
    t = await createTestApp();
    await startAuditJobs(t.deps);
    s = await createStudioWithRoles(t);
    other = await createStudioWithRoles(t);
    p = await createAuditProject(t.deps, s, { definitions: DEFS, purpose: 'conformal' });
  });
  afterAll(async () => {
    await stopAuditJobs(t.deps);
    await t.close();
  });

  it('runs an audit through the queue to scorecards equal to the engine’s direct result', async () => {
    const res = await s.cartographer.post(`/api/projects/${p.projectId}/audits`, { samples: 5000, seed: 7 });
    expect(res.status).toBe(202);
    expect(res.body.status).toBe('queued');
    // Anyone holding the inputs can recompute the hash: canonical JSON (RFC 8785 style) of region hash,
    // definitions, settings and engine version.
    const region = await t.deps.dataSource.getRepository(Region).findOneByOrFail({ id: p.regionId });
    const candidates = await t.deps.dataSource.getRepository(Candidate).findBy({ projectId: p.projectId });
    expect(res.body.inputHash).toBe(
      canonicalSha256({
        region: region.sha256,
        definitions: candidates.sort((x, y) => x.id - y.id).map((c) => ({ definition: c.definition, resolved: c.resolved })),
        settings: { samples: 5000, seed: 7 },
        engineVersion: ENGINE_VERSION,
      }),
    );
    const { audit } = await waitForAudit((u) => s.cartographer.get(u), res.body.id);
    expect(audit.status).toBe('done');
    expect(audit.progress).toBe(1);
    expect(audit.scorecards.map((c: { candidateId: number }) => c.candidateId)).toEqual(p.candidateIds);
    const direct = directScorecards(p, 5000, 7);
    audit.scorecards.forEach((card: { metrics: unknown }, i: number) => expect(card.metrics).toEqual(direct[i]));
    // Transverse Mercator is conformal: ω ≈ 0 (Snyder 1987, ch. 8), so it ranks first for a conformal map.
    expect((audit.scorecards[0].metrics as { angularDeformationDeg: { max: number } }).angularDeformationDeg.max).toBeLessThan(1e-6);
    doneAuditId = audit.id;

    const list = await s.editor.get(`/api/projects/${p.projectId}/audits`);
    expect(list.status).toBe(200);
    expect(list.body.audits[0]).toMatchObject({ id: doneAuditId, status: 'done' });
  });

  it('shows progress between 0 and 1 while a larger audit runs, then finishes once', async () => {
    const res = await s.cartographer.post(`/api/projects/${p.projectId}/audits`, { samples: 400_000, seed: 3 });
    expect(res.status).toBe(202);
    const seen: number[] = [];
    const { audit } = await waitForAudit(async (u) => {
      const r = await s.editor.get(u);
      if (r.body.status === 'running') seen.push(r.body.progress);
      return r;
    }, res.body.id, 120_000);
    expect(audit.status).toBe('done');
    expect(seen.some((v) => v > 0 && v < 1)).toBe(true);
    for (let i = 1; i < seen.length; i++) expect(seen[i]).toBeGreaterThanOrEqual(seen[i - 1]);
    expect(await t.deps.dataSource.getRepository(Scorecard).countBy({ auditId: audit.id })).toBe(DEFS.length);
  });

  it('stores a plain message when an audit fails', async () => {
    // A gnomonic map centred on the far side of the Earth cannot show Chile at all.
    const far = await createAuditProject(t.deps, s, { definitions: ['+proj=gnom +lat_0=37 +lon_0=109 +x_0=0 +y_0=0 +R=6371000'] });
    const res = await s.cartographer.post(`/api/projects/${far.projectId}/audits`, { samples: 2000 });
    expect(res.status).toBe(202);
    const { audit } = await waitForAudit((u) => s.cartographer.get(u), res.body.id);
    expect(audit.status).toBe('failed');
    expect(audit.error).toMatch(/^The audit could not finish: .*undefined over the whole region/);
    expect(audit.scorecards).toEqual([]);
  });

  it('refuses bad input with a clear message and stores nothing', async () => {
    const before = await t.deps.dataSource.getRepository(Audit).countBy({ projectId: p.projectId });
    const small = await s.cartographer.post(`/api/projects/${p.projectId}/audits`, { samples: 10 });
    expect(small.status).toBe(422);
    expect(small.body.error.fields.samples).toMatch(/at least 1000/);
    const stranger = await s.cartographer.post(`/api/projects/${p.projectId}/audits`, { candidateIds: [999999] });
    expect(stranger.status).toBe(422);
    expect(stranger.body.error.fields.candidateIds).toMatch(/999999/);
    const empty = await createAuditProject(t.deps, s, { definitions: [] });
    const none = await s.cartographer.post(`/api/projects/${empty.projectId}/audits`, {});
    expect(none.status).toBe(409);
    expect(none.body.error.message).toMatch(/at least one candidate/);
    expect(await t.deps.dataSource.getRepository(Audit).countBy({ projectId: p.projectId })).toBe(before);
    expect(await t.deps.dataSource.getRepository(Audit).countBy({ projectId: empty.projectId })).toBe(0);
  });

  it('exports scorecards as CSV and JSON with the purpose’s ranking', async () => {
    const json = await s.editor.get(`/api/audits/${doneAuditId}/scorecards.json`);
    expect(json.status).toBe(200);
    expect(json.body.ranking.metric).toBe('angularDeformationDeg.mean');
    expect(json.body.scorecards).toHaveLength(DEFS.length);
    const omega = json.body.scorecards.map((c: { candidateId: number; metrics: { angularDeformationDeg: { mean: number } } }) => [c.candidateId, c.metrics.angularDeformationDeg.mean]);
    const expectedOrder = [...omega].sort((a, b) => a[1] - b[1]).map((x) => x[0]);
    expect(json.body.ranking.order).toEqual(expectedOrder);

    const csv = await s.editor.get(`/api/audits/${doneAuditId}/scorecards.csv`);
    expect(csv.status).toBe(200);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    const lines = csv.text.trim().split('\r\n');
    expect(lines).toHaveLength(DEFS.length + 1);
    expect(lines[0]).toContain('angularDeformationDeg.mean (°)');
    expect(lines[0]).toContain('rank_for_conformal');
    const header = lines[0].split(',');
    const row = lines[1].split(',');
    expect(Number(row[header.indexOf('angularDeformationDeg.mean (°)')])).toBeCloseTo(json.body.scorecards[0].metrics.angularDeformationDeg.mean, 12);
    // Logarithmic errors are shown as percentages: 100·(e^x − 1).
    const lnMean = json.body.scorecards[0].metrics.scaleError.mean;
    expect(Number(row[header.indexOf('scaleError.mean (%)')])).toBeCloseTo(100 * (Math.exp(lnMean) - 1), 10);
  });

  it('lets cartographers and admins start audits, everyone in the studio read them, shared clients read only', async () => {
    expect((await s.editor.post(`/api/projects/${p.projectId}/audits`, {})).status).toBe(403);
    expect((await s.client.post(`/api/projects/${p.projectId}/audits`, {})).status).toBe(403);
    const reads = [
      `/api/projects/${p.projectId}/audits`,
      `/api/audits/${doneAuditId}`,
      `/api/audits/${doneAuditId}/scorecards.json`,
      `/api/audits/${doneAuditId}/scorecards.csv`,
    ];
    for (const url of reads) {
      expect((await s.admin.get(url)).status, url).toBe(200);
      expect((await s.editor.get(url)).status, url).toBe(200);
      expect((await s.client.get(url)).status, `${url} unshared`).toBe(404);
      expect((await other.admin.get(url)).status, `${url} other studio`).toBe(404);
      expect((await other.cartographer.get(url)).status, `${url} other studio`).toBe(404);
    }
    expect((await other.cartographer.post(`/api/projects/${p.projectId}/audits`, {})).status).toBe(404);
    await t.deps.dataSource.getRepository(ProjectAccess).insert({ projectId: p.projectId, studioId: s.studioId, userId: s.users.client.userId, grantedById: s.users.admin.userId });
    for (const url of reads) expect((await s.client.get(url)).status, `${url} shared`).toBe(200);
    expect((await s.client.post(`/api/projects/${p.projectId}/audits`, {})).status).toBe(403);
    const admin = await s.admin.post(`/api/projects/${p.projectId}/audits`, { samples: 1000 });
    expect(admin.status).toBe(202);
    await waitForAudit((u) => s.admin.get(u), admin.body.id);
  });

  it('computes an audit for each seeded project at start, once', async () => {
    const demo = await createStudioWithRoles(t);
    const a = await createAuditProject(t.deps, demo, { definitions: DEFS.slice(0, 2) });
    const b = await createAuditProject(t.deps, demo, { definitions: [] });
    const person = { email: '', name: '', userId: demo.users.cartographer.userId, membershipId: demo.users.cartographer.membershipId };
    const ctx = { ds: t.deps.dataSource, studioId: demo.studioId, people: { admin: person, cartographer: person, editor: person, client: person } };
    await seedDemoAudits(ctx);
    await seedDemoAudits(ctx);
    const audits = await t.deps.dataSource.getRepository(Audit).findBy({ projectId: a.projectId });
    expect(audits.map((x) => x.status)).toEqual(['done']);
    expect(await t.deps.dataSource.getRepository(Scorecard).countBy({ auditId: audits[0].id })).toBe(2);
    expect(await t.deps.dataSource.getRepository(Audit).countBy({ projectId: b.projectId })).toBe(0);
  });

  it('enqueues again, once, an audit whose job was lost (e.g. with Redis’s data)', async () => {
    const project = await t.deps.dataSource.getRepository(MapProject).findOneByOrFail({ id: p.projectId });
    // A queued audit that never reached the queue.
    const lost = await createAuditRow(t.deps.dataSource, project, s.users.cartographer.userId, { samples: 1000, seed: 99 });
    const queue = auditJobs(t.deps).queue;
    expect(await queue.getJob(`audit-${lost.id}`)).toBeUndefined();
    const [first, second] = await Promise.all([
      recoverAudits(t.deps.dataSource, queue, t.deps.logger),
      recoverAudits(t.deps.dataSource, queue, t.deps.logger),
    ]);
    expect(first + second).toBeGreaterThanOrEqual(1);
    const { audit } = await waitForAudit((u) => s.cartographer.get(u), lost.id);
    expect(audit.status).toBe('done');
    expect(await t.deps.dataSource.getRepository(Scorecard).countBy({ auditId: lost.id })).toBe(DEFS.length);
    expect(await recoverAudits(t.deps.dataSource, queue, t.deps.logger)).toBe(0);
  });
});
