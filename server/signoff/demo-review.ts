import { rankForPurpose } from '../../shared/api/audit-metrics.js';
import { Audit, MapProject, ReviewRound, Scorecard } from '../entities/index.js';
import type { DemoContext } from '../seed/index.js';
import { recordActivity } from '../services/activity.service.js';
import { snapshotShortlist } from '../services/review.service.js';
import { addReviewers } from './reviewers.js';

const RECOMMENDATION = [
  'Of the candidates we audited, these two keep the distortion lowest for what this map is for.',
  '',
  '- the first is the best fit for the map’s purpose over the whole region',
  '- the second is the runner-up, if the client prefers its look',
  '',
  'Open the compare view to see both side by side, then approve one or send the shortlist back with your notes.',
].join('\n');

/**
 * Demo seeding step: the demo's first project with a finished audit gets an open review round,
 * its two best candidates shortlisted and sent to the demo client reviewer (no e-mail at seed
 * time), so the demo shows a pending sign-off. Idempotent: a project with any round is left alone.
 * Runs after the demo audits.
 */
export async function seedDemoReview(ctx: DemoContext): Promise<void> {
  const ds = ctx.ds;
  const projects = await ds.getRepository(MapProject).find({ where: { studioId: ctx.studioId }, order: { id: 'ASC' } });
  for (const project of projects) {
    if (await ds.getRepository(ReviewRound).existsBy({ studioId: ctx.studioId })) return;
    const audit = await ds.getRepository(Audit).findOne({ where: { projectId: project.id, status: 'done' }, order: { id: 'DESC' } });
    if (!audit) continue;
    const cards = await ds.getRepository(Scorecard).findBy({ auditId: audit.id });
    const best = rankForPurpose(project.purpose, cards.map((c) => ({ candidateId: c.candidateId, metrics: c.metrics as Record<string, unknown> }))).order.slice(0, 2);
    if (!best.length) continue;
    const editor = ctx.people.editor;
    await ds.transaction(async (m) => {
      const shortlist = await snapshotShortlist(m, audit, best);
      const rounds = m.getRepository(ReviewRound);
      const round = await rounds.save(
        rounds.create({
          projectId: project.id, studioId: ctx.studioId, auditId: audit.id, roundNumber: 1, candidateIds: best, shortlist,
          recommendation: RECOMMENDATION, requestedById: editor.userId, status: 'open',
        }),
      );
      await addReviewers(m, { studioId: ctx.studioId, projectId: project.id, roundId: round.id, grantedById: editor.userId, emails: [ctx.people.client.email] });
      await m.getRepository(MapProject).update(project.id, { status: 'in-review' });
      await recordActivity(m, {
        projectId: project.id, studioId: ctx.studioId, actor: { userId: editor.userId, name: editor.name, role: 'editor' }, kind: 'round.requested',
        summary: `Sent round 1 (${shortlist.map((s) => s.label).join(', ')}) to ${ctx.people.client.email}`,
        details: { roundId: round.id, auditId: audit.id, candidateIds: best },
      });
    });
    return;
  }
}
