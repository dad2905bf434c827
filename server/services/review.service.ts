import { In, type DataSource } from 'typeorm';
import type { ScorecardView } from '../../shared/api/audits.schema.js';
import type { RequestSignOffInput, ReviewRequestList, RoundList, RoundView } from '../../shared/api/review.schema.js';
import { isStaffRole } from '../../shared/api/roles.js';
import type { AppDeps } from '../deps.js';
import { Audit, Candidate, MapProject, ReviewRecipient, ReviewRound, Scorecard, SignOff } from '../entities/index.js';
import type { Actor } from '../http/actor.js';
import { conflict, HttpError, notFound, validationFailed } from '../http/errors.js';
import { reviewerInviteMail, reviewRequestMail } from '../signoff/mail.js';
import { addReviewers, type ReviewerContact } from '../signoff/reviewers.js';
import { isRecipient, roundViews } from '../signoff/round-view.js';
import { recordActivity } from './activity.service.js';
import { loadProjectFor } from './project-guard.js';
import { lockStudio } from './seats.service.js';

/** The shortlisted scorecards as they are now, in the given order; every id must be a done result of the audit. */
export async function snapshotShortlist(db: DataSource['manager'], audit: Audit, candidateIds: number[]): Promise<ScorecardView[]> {
  const cards = await db.getRepository(Scorecard).findBy({ auditId: audit.id, candidateId: In(candidateIds) });
  const candidates = await db.getRepository(Candidate).findBy({ id: In(candidateIds), projectId: audit.projectId });
  const missing = candidateIds.filter((id) => !cards.some((c) => c.candidateId === id) || !candidates.some((c) => c.id === id));
  if (missing.length) {
    throw validationFailed('Every shortlisted candidate must have a result in the chosen audit.', {
      candidateIds: `Candidate${missing.length > 1 ? 's' : ''} ${missing.join(', ')} ${missing.length > 1 ? 'have' : 'has'} no result in audit ${audit.id}.`,
    });
  }
  return candidateIds.map((id) => {
    const c = candidates.find((x) => x.id === id)!;
    const card = cards.find((x) => x.candidateId === id)!;
    return { candidateId: id, label: c.label, family: c.family, definition: c.definition, resolved: c.resolved, metrics: card.metrics as Record<string, unknown> };
  });
}

/**
 * Sends a shortlist for sign-off (editor or admin): checks the audit and the shortlist, opens round
 * n + 1, shares the project with the reviewers and e-mails them. All in one transaction, mails
 * included, so a refused address or a failed send leaves nothing behind.
 */
export async function createRound(deps: AppDeps, actor: Actor, projectId: number, input: RequestSignOffInput): Promise<RoundView> {
  return deps.dataSource.transaction(async (m) => {
    const studio = await lockStudio(m, actor.studioId);
    await loadProjectFor(m, actor, projectId, 'read');
    const project = await m.getRepository(MapProject).findOne({ where: { id: projectId }, lock: { mode: 'pessimistic_write' } });
    if (!project) throw notFound('That project');
    if (project.status === 'signed-off') throw conflict('This project is already signed off; its record cannot be reopened.');
    const open = await m.getRepository(ReviewRound).findOneBy({ projectId, status: 'open' });
    if (open) throw conflict(`Round ${open.roundNumber} is still waiting for the client’s decision.`);

    const audit = await m.getRepository(Audit).findOneBy({ id: input.auditId, projectId, studioId: actor.studioId });
    if (!audit) throw validationFailed('That audit is not part of this project.', { auditId: 'Choose an audit of this project.' });
    if (audit.status !== 'done') {
      throw validationFailed('Only a finished audit can be shortlisted from.', { auditId: `Audit ${audit.id} is ${audit.status}, not finished.` });
    }
    const shortlist = await snapshotShortlist(m, audit, input.candidateIds);

    const last = await m.getRepository(ReviewRound).findOne({ where: { projectId }, order: { roundNumber: 'DESC' } });
    const roundNumber = (last?.roundNumber ?? 0) + 1;
    const rounds = m.getRepository(ReviewRound);
    const round = await rounds.save(
      rounds.create({
        projectId, studioId: actor.studioId, auditId: audit.id, roundNumber, candidateIds: input.candidateIds, shortlist,
        recommendation: input.recommendation, requestedById: actor.userId, status: 'open',
      }),
    );
    const contacts = await addReviewers(m, { studioId: actor.studioId, projectId, roundId: round.id, grantedById: actor.userId, emails: input.reviewerEmails });
    await m.getRepository(MapProject).update(projectId, { status: 'in-review' });
    await recordActivity(m, {
      projectId, studioId: actor.studioId, actor, kind: 'round.requested',
      summary: `Sent round ${roundNumber} (${shortlist.map((s) => s.label).join(', ')}) to ${input.reviewerEmails.join(', ')}`,
      details: { roundId: round.id, auditId: audit.id, candidateIds: input.candidateIds, reviewerEmails: input.reviewerEmails },
    });
    await sendRequests(deps, contacts, {
      studioId: actor.studioId, studioName: studio.name, editorName: actor.name, projectTitle: project.title, projectId,
      roundNumber, shortlistCount: shortlist.length, recommendation: input.recommendation,
    });
    return (await roundViews(m, [(await rounds.findOneByOrFail({ id: round.id }))]))[0];
  });
}

async function sendRequests(
  deps: AppDeps,
  contacts: ReviewerContact[],
  o: { studioId: number; studioName: string; editorName: string; projectTitle: string; projectId: number; roundNumber: number; shortlistCount: number; recommendation: string },
) {
  const reviewPath = `/review/${o.projectId}`;
  for (const c of contacts) {
    const mail =
      c.kind === 'request'
        ? reviewRequestMail({ ...o, link: `${deps.config.publicUrl}${reviewPath}` })
        : reviewerInviteMail({
            ...o, expiresAt: c.expiresAt, hasAccount: c.hasAccount,
            link: `${deps.config.publicUrl}/accept-invite?token=${encodeURIComponent(c.token)}&next=${encodeURIComponent(reviewPath)}`,
          });
    try {
      await deps.mailer.send({ to: c.email, ...mail, template: c.kind === 'request' ? 'signoff-request' : 'signoff-invite', studioId: o.studioId });
    } catch {
      throw new HttpError(502, 'mail_failed', `The e-mail to ${c.email} could not be sent, so the shortlist was not sent. Please try again.`);
    }
  }
}

/**
 * Every round of a project, newest first. Staff see all of them; a reviewer sees the rounds sent
 * to them. `decidableRoundId` is the open round the signed-in reviewer may approve or return.
 */
export async function listRounds(ds: DataSource, actor: Actor, projectId: number): Promise<RoundList> {
  const project = await loadProjectFor(ds, actor, projectId, 'read');
  let rounds = await ds.getRepository(ReviewRound).find({ where: { projectId, studioId: actor.studioId }, order: { roundNumber: 'DESC' } });
  if (!isStaffRole(actor.role)) {
    const mine = await ds.getRepository(ReviewRecipient).find({
      where: [{ projectId, userId: actor.userId }, { projectId, email: actor.email.toLowerCase() }],
    });
    rounds = rounds.filter((r) => mine.some((x) => x.roundId === r.id));
  }
  const open = rounds.find((r) => r.status === 'open');
  const decidable = actor.role === 'client' && open && (await isRecipient(ds, open.id, actor)) ? open.id : null;
  const signOff = await ds.getRepository(SignOff).findOne({ where: { projectId, studioId: actor.studioId }, select: { id: true } });
  return {
    project: { id: project.id, title: project.title, clientName: project.clientName, purpose: project.purpose, status: project.status },
    rounds: await roundViews(ds, rounds),
    decidableRoundId: decidable,
    signOffId: signOff?.id ?? null,
  };
}

/** One round (staff of the studio, or a reviewer it was sent to). */
export async function getRound(ds: DataSource, actor: Actor, roundId: number): Promise<RoundView> {
  const round = await ds.getRepository(ReviewRound).findOneBy({ id: roundId, studioId: actor.studioId });
  if (!round) throw notFound('That review round');
  await loadProjectFor(ds, actor, round.projectId, 'read');
  if (!isStaffRole(actor.role) && !(await isRecipient(ds, round.id, actor))) throw notFound('That review round');
  return (await roundViews(ds, [round]))[0];
}

/** The rounds sent to the signed-in reviewer, newest first, for their start page. */
export async function listReviewRequests(ds: DataSource, actor: Actor): Promise<ReviewRequestList> {
  const mine = await ds.getRepository(ReviewRecipient).find({
    where: [{ studioId: actor.studioId, userId: actor.userId }, { studioId: actor.studioId, email: actor.email.toLowerCase() }],
  });
  const roundIds = [...new Set(mine.map((x) => x.roundId))];
  if (!roundIds.length) return { requests: [] };
  const rounds = await roundViews(ds, await ds.getRepository(ReviewRound).find({ where: { id: In(roundIds), studioId: actor.studioId }, order: { createdAt: 'DESC' } }));
  const projects = await ds.getRepository(MapProject).findBy({ id: In([...new Set(rounds.map((r) => r.projectId))]), studioId: actor.studioId });
  return {
    requests: rounds.flatMap((r) => {
      const p = projects.find((x) => x.id === r.projectId);
      return p
        ? [{ roundId: r.id, projectId: p.id, projectTitle: p.title, clientName: p.clientName, roundNumber: r.roundNumber, status: r.status, requestedByName: r.requestedBy.name, createdAt: r.createdAt }]
        : [];
    }),
  };
}
