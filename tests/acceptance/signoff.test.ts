import { createHash, randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Invitation, MapProject, ProjectAccess, ReviewRecipient, ReviewRound, SignOff } from '../../server/entities/index.js';
import { seedDemoReview } from '../../server/signoff/demo-review.js';
import { engineScore, seedAuditedProject, type AuditedProject } from '../support/signoff-fixture.js';
import { createStudioWithRoles, type StudioFixture } from '../support/studio-fixture.js';
import { caughtMail, Client, createTestApp, mailTo } from '../support/test-app.js';

type TestApp = Awaited<ReturnType<typeof createTestApp>>;
let t: TestApp;
let s: StudioFixture;
let other: StudioFixture;

const tag = () => randomBytes(4).toString('hex');
const sha256 = (text: string) => createHash('sha256').update(text, 'utf8').digest('hex');
/** The fake SMTP server keeps subjects as sent: decode RFC 2047 "Q" encoded words. */
const subjectOf = (m: { subject: string }) =>
  m.subject.replace(/=\?UTF-8\?Q\?([^?]*)\?=\s*/gi, (_, q: string) =>
    Buffer.from(q.replace(/_/g, ' ').replace(/=([0-9A-F]{2})/gi, (_x, h: string) => String.fromCharCode(parseInt(h, 16))), 'latin1').toString('utf8'),
  );
const RECOMMENDATION = 'We recommend the Albers projection for this atlas.\n\n- least areal error over the region\n- familiar look for a national map';

beforeAll(async () => {
  t = await createTestApp();
  [s, other] = await Promise.all([createStudioWithRoles(t), createStudioWithRoles(t)]);
});
afterAll(async () => t?.close());

async function sendRound(p: AuditedProject, reviewerEmails: string[], candidateIds = p.candidateIds.slice(0, 2)) {
  const res = await s.editor.post(`/api/projects/${p.projectId}/rounds`, { auditId: p.auditId, candidateIds, recommendation: RECOMMENDATION, reviewerEmails });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as { id: number; roundNumber: number; status: string };
}

/** Follows the one-time link of an invitation e-mail: sets name and password, ends signed in. */
async function acceptFromMail(email: string, name: string): Promise<{ client: Client; link: string }> {
  const mail = await mailTo(email);
  const link = /https?:\/\/\S+\/accept-invite\?token=\S+/.exec(mail.text)?.[0];
  expect(link, mail.text).toBeTruthy();
  const token = decodeURIComponent(new URL(link!).searchParams.get('token')!);
  const client = await s.anonymous();
  const preview = await client.get(`/api/invitations/${encodeURIComponent(token)}`);
  expect(preview.body).toMatchObject({ kind: 'invite', role: 'client', email, hasAccount: false });
  const res = await client.post('/api/invitations/accept', { token, name, password: `pw-${tag()}-long-enough` });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  client.csrf = res.body.csrfToken;
  return { client, link: link! };
}

describe('sign-off round trip', () => {
  it('shortlist → request → invitation mail → reviewer sets a password → approves; the record is sealed and mailed', async () => {
    const p = await seedAuditedProject(t.deps, s);
    const newEmail = `reviewer.${tag()}@client.example.test`;
    const round = await sendRound(p, [newEmail, s.users.client.email]);
    expect(round).toMatchObject({ roundNumber: 1, status: 'open' });
    expect((await s.editor.get(`/api/projects/${p.projectId}`)).body.status).toBe('in-review');

    // The existing client reviewer gets a plain request; the new one an invitation that leads to the review.
    const plain = await mailTo(s.users.client.email);
    expect(plain.text).toContain(`/review/${p.projectId}`);
    expect(plain.text).toContain('least areal error over the region');
    const { client: reviewer, link } = await acceptFromMail(newEmail, 'Rosa Reviewer');
    expect(new URL(link).searchParams.get('next')).toBe(`/review/${p.projectId}`);

    const list = await reviewer.get(`/api/projects/${p.projectId}/rounds`);
    expect(list.status).toBe(200);
    expect(list.body.decidableRoundId).toBe(round.id);
    expect(list.body.rounds[0].shortlist.map((c: { candidateId: number }) => c.candidateId)).toEqual(p.candidateIds.slice(0, 2));
    expect(list.body.rounds[0].shortlist[0].metrics).toEqual(p.metricsById.get(p.candidateIds[0]));
    expect((await reviewer.get(`/api/projects/${p.projectId}`)).status).toBe(200);
    // Reviewers take no staff seat: the studio's three seats stay as they were.
    expect((await s.admin.get('/api/people')).body.seats).toEqual({ used: 3, total: 3 });
    expect((await reviewer.get('/api/review/requests')).body.requests.map((r: { roundId: number }) => r.roundId)).toEqual([round.id]);

    // Wrong signature and an off-list candidate are refused, with nothing stored.
    const badSig = await reviewer.post(`/api/rounds/${round.id}/approve`, { candidateId: p.candidateIds[0], signature: 'Someone Else' });
    expect(badSig.status).toBe(422);
    expect(badSig.body.error.fields.signature).toMatch(/Rosa Reviewer/);
    const offList = await reviewer.post(`/api/rounds/${round.id}/approve`, { candidateId: p.candidateIds[2], signature: 'Rosa Reviewer' });
    expect(offList.status).toBe(422);
    expect(offList.body.error.fields.candidateId).toMatch(/shortlisted/);
    expect(await t.deps.dataSource.getRepository(SignOff).countBy({ projectId: p.projectId })).toBe(0);

    const approve = await reviewer.post(`/api/rounds/${round.id}/approve`, { candidateId: p.candidateIds[1], signature: '  rosa   REVIEWER ', comment: 'Fine by us.' });
    expect(approve.status, JSON.stringify(approve.body)).toBe(201);
    const signOff = approve.body;
    expect(signOff.recordHash).toMatch(/^[0-9a-f]{64}$/);
    expect(sha256(signOff.recordJson)).toBe(signOff.recordHash);
    const record = JSON.parse(signOff.recordJson);
    expect(record.region.sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(record.region.geometry).toEqual(p.geometry);
    expect(record.candidate).toMatchObject({ id: p.candidateIds[1], definition: expect.stringContaining('+proj=lcc'), resolved: expect.stringContaining('+no_defs') });
    expect(record.audit).toMatchObject({ id: p.auditId, engineVersion: 'test-seed', settings: { samples: 2000, seed: 20261202 } });
    expect(record.scorecard).toEqual(p.metricsById.get(p.candidateIds[1]));
    expect(record.reviewer).toMatchObject({ name: 'Rosa Reviewer', email: newEmail, signature: 'rosa   REVIEWER', comment: 'Fine by us.' });
    expect(record.approvedAt).toBe(signOff.approvedAt);

    // The studio sees the same record, and the project is signed off; both editor and cartographer were told.
    const seen = await s.editor.get(`/api/projects/${p.projectId}/signoff`);
    expect(seen.status).toBe(200);
    expect(seen.body.recordHash).toBe(signOff.recordHash);
    expect((await s.cartographer.get(`/api/projects/${p.projectId}`)).body.status).toBe('signed-off');
    for (const email of [s.users.editor.email, s.users.cartographer.email]) {
      const m = await mailTo(email);
      expect(subjectOf(m)).toMatch(/^Approved: “Rivers of central France”$/);
      expect(m.text).toContain(signOff.recordHash);
    }

    // Deciding twice, or a different way, is refused.
    expect((await reviewer.post(`/api/rounds/${round.id}/approve`, { candidateId: p.candidateIds[0], signature: 'Rosa Reviewer' })).status).toBe(409);
    expect((await reviewer.post(`/api/rounds/${round.id}/return`, { comment: 'changed my mind' })).status).toBe(409);
    expect((await s.client.post(`/api/rounds/${round.id}/approve`, { candidateId: p.candidateIds[0], signature: s.users.client.name })).status).toBe(409);
    expect(await t.deps.dataSource.getRepository(SignOff).countBy({ projectId: p.projectId })).toBe(1);
    // A signed-off project takes no new shortlist.
    const again = await s.editor.post(`/api/projects/${p.projectId}/rounds`, { auditId: p.auditId, candidateIds: [p.candidateIds[0]], recommendation: 'x', reviewerEmails: [newEmail] });
    expect(again.status).toBe(409);

    const kinds = (await s.editor.get(`/api/projects/${p.projectId}/activity`)).body.events.map((e: { kind: string }) => e.kind);
    expect(kinds.slice(0, 2)).toEqual(['round.approved', 'round.requested']);
  });

  it('the return path: a comment is required, the project goes back to work, a new round is sent and every round is kept', async () => {
    const p = await seedAuditedProject(t.deps, s, { title: 'Return path atlas' });
    const first = await sendRound(p, [s.users.client.email]);
    const empty = await s.client.post(`/api/rounds/${first.id}/return`, { comment: '   ' });
    expect(empty.status).toBe(422);
    expect(empty.body.error.fields.comment).toBeTruthy();
    const before = (await caughtMail()).length;
    const ret = await s.client.post(`/api/rounds/${first.id}/return`, { comment: 'Please try a conformal option too.' });
    expect(ret.status).toBe(200);
    expect(ret.body).toMatchObject({ status: 'returned', decisionComment: 'Please try a conformal option too.', decidedBy: { name: s.users.client.name } });
    expect((await s.editor.get(`/api/projects/${p.projectId}`)).body.status).toBe('returned');
    const editorMail = await mailTo(s.users.editor.email);
    expect(subjectOf(editorMail)).toMatch(/^Returned for changes: “Return path atlas”$/);
    expect(editorMail.text).toContain('Please try a conformal option too.');
    expect(subjectOf(await mailTo(s.users.cartographer.email))).toMatch(/^Returned/);
    expect((await caughtMail()).length).toBeGreaterThanOrEqual(before + 2);

    const second = await sendRound(p, [s.users.client.email], [p.candidateIds[1], p.candidateIds[2]]);
    expect(second.roundNumber).toBe(2);
    expect((await s.client.post(`/api/rounds/${first.id}/approve`, { candidateId: p.candidateIds[0], signature: s.users.client.name })).status).toBe(409);
    const ok = await s.client.post(`/api/rounds/${second.id}/approve`, { candidateId: p.candidateIds[2], signature: s.users.client.name });
    expect(ok.status).toBe(201);

    const rounds = (await s.editor.get(`/api/projects/${p.projectId}/rounds`)).body.rounds;
    expect(rounds.map((r: { roundNumber: number; status: string }) => [r.roundNumber, r.status])).toEqual([[2, 'approved'], [1, 'returned']]);
    expect(rounds[1].decisionComment).toBe('Please try a conformal option too.');
    expect(rounds[0].signOffId).toBe(ok.body.id);
    expect(rounds[0].chosenCandidateId).toBe(p.candidateIds[2]);
  });
});

describe('who may do what', () => {
  it('studio staff cannot forge a client decision', async () => {
    const p = await seedAuditedProject(t.deps, s, { title: 'Forgery check' });
    const round = await sendRound(p, [s.users.client.email]);
    for (const role of ['admin', 'cartographer', 'editor'] as const) {
      const res = await s[role].post(`/api/rounds/${round.id}/approve`, { candidateId: p.candidateIds[0], signature: s.users[role].name });
      expect(res.status, role).toBe(403);
      expect((await s[role].post(`/api/rounds/${round.id}/return`, { comment: 'no' })).status, role).toBe(403);
    }
    // Only editors and admins send shortlists.
    const byCartographer = await s.cartographer.post(`/api/projects/${p.projectId}/rounds`, { auditId: p.auditId, candidateIds: [p.candidateIds[0]], recommendation: 'x', reviewerEmails: [s.users.client.email] });
    expect(byCartographer.status).toBe(403);
    expect((await t.deps.dataSource.getRepository(ReviewRound).findOneByOrFail({ id: round.id })).status).toBe('open');
  });

  it('a reviewer sees only projects shared with them, and only their own rounds', async () => {
    const shared = await seedAuditedProject(t.deps, s, { title: 'Shared one' });
    const hidden = await seedAuditedProject(t.deps, s, { title: 'Not shared' });
    const outsiderEmail = `second.${tag()}@client.example.test`;
    const hiddenRound = await sendRound(hidden, [outsiderEmail]);
    await sendRound(shared, [s.users.client.email]);

    expect((await s.client.get(`/api/projects/${hidden.projectId}/rounds`)).status).toBe(404);
    expect((await s.client.get(`/api/projects/${hidden.projectId}`)).status).toBe(404);
    expect((await s.client.get(`/api/rounds/${hiddenRound.id}`)).status).toBe(404);
    expect((await s.client.post(`/api/rounds/${hiddenRound.id}/approve`, { candidateId: hidden.candidateIds[0], signature: s.users.client.name })).status).toBe(404);
    expect((await s.client.get(`/api/projects/${hidden.projectId}/comments`)).status).toBe(404);
    const mine = (await s.client.get('/api/review/requests')).body.requests.map((r: { projectId: number }) => r.projectId);
    expect(mine).toContain(shared.projectId);
    expect(mine).not.toContain(hidden.projectId);

    // Once the outsider joins, the project is shared with them but its later rounds belong to whoever they were sent to.
    const { client: outsider } = await acceptFromMail(outsiderEmail, 'Otto Outsider');
    expect((await outsider.get(`/api/projects/${hidden.projectId}/rounds`)).body.decidableRoundId).toBe(hiddenRound.id);
    expect((await outsider.post(`/api/rounds/${hiddenRound.id}/return`, { comment: 'Needs a legend.' })).status).toBe(200);
    const next = await sendRound(hidden, [s.users.client.email]);
    expect((await outsider.post(`/api/rounds/${next.id}/approve`, { candidateId: hidden.candidateIds[0], signature: 'Otto Outsider' })).status).toBe(403);
  });

  it('another studio sees none of it', async () => {
    const p = await seedAuditedProject(t.deps, s, { title: 'Tenancy' });
    const round = await sendRound(p, [s.users.client.email]);
    for (const c of [other.editor, other.client, other.admin]) {
      expect((await c.get(`/api/projects/${p.projectId}/rounds`)).status).toBe(404);
      expect((await c.get(`/api/rounds/${round.id}`)).status).toBe(404);
      expect((await c.get(`/api/projects/${p.projectId}/comments`)).status).toBe(404);
    }
    expect((await other.client.post(`/api/rounds/${round.id}/approve`, { candidateId: p.candidateIds[0], signature: other.users.client.name })).status).toBe(404);
    expect((await other.editor.get(`/api/projects/${p.projectId}/activity`)).status).toBe(404);
  });

  it('a bad shortlist or reviewer list is refused with a reason, and nothing is stored or sent', async () => {
    const p = await seedAuditedProject(t.deps, s, { title: 'Bad requests' });
    const post = (body: Record<string, unknown>) =>
      s.editor.post(`/api/projects/${p.projectId}/rounds`, { auditId: p.auditId, candidateIds: [p.candidateIds[0]], recommendation: RECOMMENDATION, reviewerEmails: [s.users.client.email], ...body });
    const mailsBefore = (await caughtMail()).length;
    const five = await post({ candidateIds: [1, 2, 3, 4, 5] });
    expect(five.status).toBe(422);
    expect(five.body.error.fields.candidateIds).toMatch(/at most 4/);
    expect((await post({ candidateIds: [] })).status).toBe(422);
    const foreign = await post({ candidateIds: [p.candidateIds[0], 99_999_999] });
    expect(foreign.status).toBe(422);
    expect(foreign.body.error.fields.candidateIds).toMatch(/99999999/);
    expect((await post({ auditId: 99_999_999 })).status).toBe(422);
    expect((await post({ recommendation: '  ' })).status).toBe(422);
    expect((await post({ reviewerEmails: ['not-an-address'] })).status).toBe(422);
    const staff = await post({ reviewerEmails: [s.users.cartographer.email] });
    expect(staff.status).toBe(422);
    expect(staff.body.error.message).toMatch(/staff/);
    expect(await t.deps.dataSource.getRepository(ReviewRound).countBy({ projectId: p.projectId })).toBe(0);
    expect((await s.editor.get(`/api/projects/${p.projectId}`)).body.status).not.toBe('in-review');
    expect((await caughtMail()).length).toBe(mailsBefore);

    await sendRound(p, [s.users.client.email]);
    expect((await post({})).status).toBe(409);
  });
});

describe('all or nothing', () => {
  it('a failed e-mail leaves no round, recipient, invitation or access behind', async () => {
    const p = await seedAuditedProject(t.deps, s, { title: 'Mail outage' });
    const email = `unlucky.${tag()}@client.example.test`;
    const real = t.deps.mailer.send;
    t.deps.mailer.send = async () => Promise.reject(new Error('SMTP is down'));
    try {
      const res = await s.editor.post(`/api/projects/${p.projectId}/rounds`, { auditId: p.auditId, candidateIds: [p.candidateIds[0]], recommendation: RECOMMENDATION, reviewerEmails: [s.users.client.email, email] });
      expect(res.status).toBe(502);
      expect(res.body.error.message).toMatch(/could not be sent/);
    } finally {
      t.deps.mailer.send = real;
    }
    const ds = t.deps.dataSource;
    expect(await ds.getRepository(ReviewRound).countBy({ projectId: p.projectId })).toBe(0);
    expect(await ds.getRepository(ReviewRecipient).countBy({ projectId: p.projectId })).toBe(0);
    expect(await ds.getRepository(ProjectAccess).countBy({ projectId: p.projectId })).toBe(0);
    expect(await ds.getRepository(Invitation).countBy({ email })).toBe(0);
    expect((await ds.getRepository(MapProject).findOneByOrFail({ id: p.projectId })).status).toBe('draft');
  });

  it('two approvals at the same moment give one record and one 409', async () => {
    const p = await seedAuditedProject(t.deps, s, { title: 'Race' });
    const round = await sendRound(p, [s.users.client.email]);
    const [a, b] = await Promise.all(
      p.candidateIds.slice(0, 2).map((candidateId) => s.client.post(`/api/rounds/${round.id}/approve`, { candidateId, signature: s.users.client.name })),
    );
    expect([a.status, b.status].sort()).toEqual([201, 409]);
    expect(await t.deps.dataSource.getRepository(SignOff).countBy({ roundId: round.id })).toBe(1);
  });
});

describe('the sign-off record cannot change', () => {
  let signOffId: number;
  let hash: string;
  beforeAll(async () => {
    const p = await seedAuditedProject(t.deps, s, { title: 'Immutable' });
    const round = await sendRound(p, [s.users.client.email]);
    const res = await s.client.post(`/api/rounds/${round.id}/approve`, { candidateId: p.candidateIds[0], signature: s.users.client.name });
    expect(res.status).toBe(201);
    signOffId = res.body.id;
    hash = res.body.recordHash;
  });

  it('answers 405 to PUT, PATCH and DELETE from anyone', async () => {
    for (const c of [s.editor, s.admin, s.client]) {
      for (const res of [await c.put(`/api/signoffs/${signOffId}`, { recordHash: '0'.repeat(64) }), await c.patch(`/api/signoffs/${signOffId}`, { comment: 'x' }), await c.delete(`/api/signoffs/${signOffId}`)]) {
        expect(res.status).toBe(405);
        expect(res.body.error.message).toMatch(/cannot be changed or deleted/);
        expect(res.headers.allow).toBe('GET');
      }
    }
    expect((await s.editor.get(`/api/signoffs/${signOffId}`)).body.recordHash).toBe(hash);
  });

  it('the database refuses an SQL UPDATE or DELETE of the record', async () => {
    const ds = t.deps.dataSource;
    await expect(ds.query('UPDATE sign_offs SET recordHash = ? WHERE id = ?', ['0'.repeat(64), signOffId])).rejects.toThrow(/immutable/);
    await expect(ds.query('UPDATE sign_offs SET comment = NULL')).rejects.toThrow(/immutable/);
    await expect(ds.query('DELETE FROM sign_offs WHERE id = ?', [signOffId])).rejects.toThrow(/immutable/);
    const row = await ds.getRepository(SignOff).findOneByOrFail({ id: signOffId });
    expect(row.recordHash).toBe(hash);
    expect(sha256(row.recordJson)).toBe(hash);
  });
});

describe('comments and history', () => {
  it('a thread shared by the studio and the project’s reviewers, with author, role and time', async () => {
    const p = await seedAuditedProject(t.deps, s, { title: 'Thread' });
    await sendRound(p, [s.users.client.email]);
    expect((await s.client.post(`/api/projects/${p.projectId}/comments`, { body: '' })).status).toBe(422);
    const c1 = await s.client.post(`/api/projects/${p.projectId}/comments`, { body: 'Could the legend say “areal scale”?' });
    expect(c1.status).toBe(201);
    const c2 = await s.editor.post(`/api/projects/${p.projectId}/comments`, { body: 'Yes — next round.' });
    expect(c2.status).toBe(201);
    const thread = (await s.cartographer.get(`/api/projects/${p.projectId}/comments`)).body.comments;
    expect(thread.map((c: { authorName: string; authorRole: string; body: string }) => [c.authorName, c.authorRole, c.body])).toEqual([
      [s.users.client.name, 'client', 'Could the legend say “areal scale”?'],
      [s.users.editor.name, 'editor', 'Yes — next round.'],
    ]);
    expect(Number.isNaN(Date.parse(thread[0].createdAt))).toBe(false);
    expect((await s.client.get(`/api/projects/${p.projectId}/comments`)).body.comments).toHaveLength(2);

    const history = (await s.admin.get(`/api/projects/${p.projectId}/activity`)).body.events;
    expect(history.map((e: { kind: string }) => e.kind)).toEqual(['comment.added', 'comment.added', 'round.requested', 'project.created']);
    expect(history[2]).toMatchObject({ actorName: s.users.editor.name, actorRole: 'editor' });
    expect((await s.client.get(`/api/projects/${p.projectId}/activity`)).status).toBe(403);
  });
});

describe('verify re-runs the audit from the stored inputs', () => {
  it('reproduces the same numbers and the same hash, for staff and for the reviewer', async () => {
    const p = await seedAuditedProject(t.deps, s, { title: 'Verify', score: engineScore, samples: 3000, seed: 4242 });
    const round = await sendRound(p, [s.users.client.email], [p.candidateIds[0], p.candidateIds[2]]);
    const approved = await s.client.post(`/api/rounds/${round.id}/approve`, { candidateId: p.candidateIds[2], signature: s.users.client.name });
    expect(approved.status).toBe(201);
    for (const c of [s.editor, s.client]) {
      const res = await c.post(`/api/signoffs/${approved.body.id}/verify`);
      expect(res.status, JSON.stringify(res.body)).toBe(200);
      expect(res.body).toMatchObject({ recordIntact: true, regionHashMatches: true, metricsMatch: true, hashMatches: true, differences: [] });
      expect(res.body.recomputedHash).toBe(approved.body.recordHash);
    }
    const events = (await s.editor.get(`/api/projects/${p.projectId}/activity`)).body.events;
    expect(events[0]).toMatchObject({ kind: 'signoff.verified', actorRole: 'client' });
  });

  it('reports the differences when the stored scorecard is not what the engine gives', async () => {
    // Scorecards with made-up numbers stand for a record whose figures were not produced by this engine.
    const p = await seedAuditedProject(t.deps, s, { title: 'Verify mismatch', samples: 2000 });
    const round = await sendRound(p, [s.users.client.email]);
    const approved = await s.client.post(`/api/rounds/${round.id}/approve`, { candidateId: p.candidateIds[0], signature: s.users.client.name });
    const res = await s.editor.post(`/api/signoffs/${approved.body.id}/verify`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ recordIntact: true, metricsMatch: false, hashMatches: false });
    expect(res.body.recomputedHash).not.toBe(approved.body.recordHash);
    expect(res.body.differences.map((d: { metric: string }) => d.metric)).toContain('arealScale.ratio');
    expect((await other.editor.post(`/api/signoffs/${approved.body.id}/verify`)).status).toBe(404);
  });
});

describe('demo seeding', () => {
  it('sends the first finished audit’s two best candidates to the reviewer, once', async () => {
    const demo = await createStudioWithRoles(t);
    const p = await seedAuditedProject(t.deps, demo, { title: 'Demo-like project' });
    const ctx = { ds: t.deps.dataSource, studioId: demo.studioId, people: demo.users };
    await seedDemoReview(ctx);
    await seedDemoReview(ctx);
    const rounds = await t.deps.dataSource.getRepository(ReviewRound).findBy({ studioId: demo.studioId });
    expect(rounds).toHaveLength(1);
    expect(rounds[0]).toMatchObject({ projectId: p.projectId, status: 'open', roundNumber: 1, requestedById: demo.users.editor.userId });
    // The fixture's made-up area spread grows with each candidate, so an equal-area map ranks the first two best.
    expect(rounds[0].candidateIds).toEqual(p.candidateIds.slice(0, 2));
    const seen = await demo.client.get(`/api/projects/${p.projectId}/rounds`);
    expect(seen.body.decidableRoundId).toBe(rounds[0].id);
  });
});
