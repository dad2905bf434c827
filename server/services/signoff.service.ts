import { In, type DataSource, type EntityManager } from 'typeorm';
import type { ApproveRoundInput, ReturnRoundInput, RoundView, SignOffView, VerifyResult } from '../../shared/api/review.schema.js';
import type { AppDeps } from '../deps.js';
import { Audit, Candidate, MapProject, Region, ReviewRound, Scorecard, SignOff, User } from '../entities/index.js';
import type { Actor } from '../http/actor.js';
import { conflict, forbidden, notFound, validationFailed } from '../http/errors.js';
import { ENGINE_VERSION, sharedAuditEngine } from '../jobs/engine-instance.js';
import { decisionMail } from '../signoff/mail.js';
import { buildRecord, sealRecord } from '../signoff/record.js';
import { isRecipient, roundViews } from '../signoff/round-view.js';
import { sheetDataFor } from '../signoff/sheet-data.js';
import { verifyRecord } from '../signoff/verify.js';
import { recordActivity } from './activity.service.js';
import { loadProjectFor } from './project-guard.js';

/** Trimmed, inner spaces collapsed, case-folded: how a typed signature is compared with the account name. */
const normaliseName = (s: string) => s.trim().replace(/\s+/g, ' ').toLocaleLowerCase('und');

/**
 * Locks the round and checks that the actor may decide it now: the project is visible to them, the
 * round was sent to them, and nobody has decided it yet. Route access already limits this to clients.
 */
async function lockDecidableRound(m: EntityManager, actor: Actor, roundId: number) {
  const round = await m.getRepository(ReviewRound).findOne({ where: { id: roundId, studioId: actor.studioId }, lock: { mode: 'pessimistic_write' } });
  if (!round) throw notFound('That review round');
  const project = await loadProjectFor(m, actor, round.projectId, 'read');
  if (!(await isRecipient(m, round.id, actor))) {
    throw forbidden('This shortlist was sent to other reviewers; only they can decide it.');
  }
  if (round.status !== 'open') {
    const when = round.decidedAt?.toISOString().slice(0, 16).replace('T', ' ') ?? '';
    throw conflict(`Round ${round.roundNumber} was already ${round.status} (${when} UTC). A decision cannot be changed.`);
  }
  return { round, project };
}

/** Mails the editor who asked and the project's creator, after the decision is committed. A failed send is logged, not undone. */
async function tellStudio(deps: AppDeps, project: MapProject, round: ReviewRound, mail: ReturnType<typeof decisionMail>) {
  const people = await deps.dataSource.getRepository(User).findBy({ id: In([...new Set([round.requestedById, project.createdById])]) });
  for (const p of people) {
    await deps.mailer
      .send({ to: p.email, ...mail, template: `signoff-${round.status}`, studioId: project.studioId })
      .catch((err) => deps.logger.warn({ err, roundId: round.id }, 'decision e-mail not sent'));
  }
}

/**
 * The reviewer approves one shortlisted candidate, signing with their name. In one transaction:
 * the immutable SignOff (canonical JSON of every input and its SHA-256), the round's decision,
 * the project's status and the history line.
 */
export async function approveRound(deps: AppDeps, actor: Actor, roundId: number, input: ApproveRoundInput): Promise<SignOffView> {
  const done = await deps.dataSource.transaction(async (m) => {
    const { round, project } = await lockDecidableRound(m, actor, roundId);
    if (!round.candidateIds.includes(input.candidateId)) {
      throw validationFailed('You can only approve a candidate on the shortlist.', { candidateId: 'Choose one of the shortlisted candidates.' });
    }
    if (normaliseName(input.signature) !== normaliseName(actor.name)) {
      throw validationFailed('The signature must be your name as it appears on your account.', {
        signature: `Type your name exactly as on your account: ${actor.name}.`,
      });
    }
    const audit = await m.getRepository(Audit).findOneByOrFail({ id: round.auditId, studioId: actor.studioId });
    const scorecard = await m.getRepository(Scorecard).findOneBy({ auditId: audit.id, candidateId: input.candidateId });
    const candidate = await m.getRepository(Candidate).findOneBy({ id: input.candidateId, studioId: actor.studioId });
    const region = await m.getRepository(Region).findOneBy({ id: audit.regionId, studioId: actor.studioId });
    if (!scorecard || !candidate || !region) {
      throw conflict('This candidate’s audit result is no longer complete, so it cannot be signed off. Ask the studio to send a new shortlist.');
    }
    const approvedAt = new Date();
    const comment = input.comment?.trim() || null;
    const record = buildRecord({
      project, region, candidate, audit, scorecard, round, approvedAt,
      reviewer: { userId: actor.userId, name: actor.name, email: actor.email, signature: input.signature.trim(), comment },
    });
    const { json, hash } = sealRecord(record);
    const signOffs = m.getRepository(SignOff);
    const saved = await signOffs.save(
      signOffs.create({
        projectId: project.id, studioId: actor.studioId, roundId: round.id, auditId: audit.id, candidateId: candidate.id,
        recordJson: json, recordHash: hash, reviewerUserId: actor.userId, reviewerName: actor.name, reviewerEmail: actor.email,
        signature: input.signature.trim(), comment, approvedAt,
      }),
    );
    await m.getRepository(ReviewRound).update(round.id, {
      status: 'approved', decidedById: actor.userId, decidedAt: approvedAt, decisionComment: comment, chosenCandidateId: candidate.id,
    });
    await m.getRepository(MapProject).update(project.id, { status: 'signed-off' });
    await recordActivity(m, {
      projectId: project.id, studioId: actor.studioId, actor, kind: 'round.approved',
      summary: `Approved “${candidate.label}” in round ${round.roundNumber} (record ${hash.slice(0, 12)}…)`,
      details: { roundId: round.id, signOffId: saved.id, candidateId: candidate.id, recordHash: hash },
    });
    return { round: { ...round, status: 'approved' as const }, project, candidate, signOff: saved };
  });
  await tellStudio(
    deps, done.project, done.round,
    decisionMail({
      projectTitle: done.project.title, roundNumber: done.round.roundNumber, reviewerName: actor.name, decision: 'approved',
      candidateLabel: done.candidate.label, comment: done.signOff.comment, recordHash: done.signOff.recordHash,
      link: `${deps.config.publicUrl}/projects/${done.project.id}`,
    }),
  );
  return toSignOffView(done.signOff, done.candidate);
}

/** The reviewer sends the shortlist back with a required comment; the project goes back to work. */
export async function returnRound(deps: AppDeps, actor: Actor, roundId: number, input: ReturnRoundInput): Promise<RoundView> {
  const done = await deps.dataSource.transaction(async (m) => {
    const { round, project } = await lockDecidableRound(m, actor, roundId);
    const decidedAt = new Date();
    await m.getRepository(ReviewRound).update(round.id, { status: 'returned', decidedById: actor.userId, decidedAt, decisionComment: input.comment });
    await m.getRepository(MapProject).update(project.id, { status: 'returned' });
    await recordActivity(m, {
      projectId: project.id, studioId: actor.studioId, actor, kind: 'round.returned',
      summary: `Returned round ${round.roundNumber} with a comment`,
      details: { roundId: round.id, comment: input.comment },
    });
    const updated = await m.getRepository(ReviewRound).findOneByOrFail({ id: round.id });
    return { round: updated, project, view: (await roundViews(m, [updated]))[0] };
  });
  await tellStudio(
    deps, done.project, done.round,
    decisionMail({
      projectTitle: done.project.title, roundNumber: done.round.roundNumber, reviewerName: actor.name, decision: 'returned',
      comment: input.comment, link: `${deps.config.publicUrl}/projects/${done.project.id}`,
    }),
  );
  return done.view;
}

export function toSignOffView(s: SignOff, c: Candidate | null): SignOffView {
  return {
    id: s.id, projectId: s.projectId, roundId: s.roundId, auditId: s.auditId, candidateId: s.candidateId,
    recordHash: s.recordHash, recordJson: s.recordJson, reviewerName: s.reviewerName, reviewerEmail: s.reviewerEmail,
    signature: s.signature, comment: s.comment, approvedAt: s.approvedAt.toISOString(),
    candidate: candidateOf(s, c),
  };
}

/** The candidate as recorded (the record is the authority, even if the candidate row changed or went). */
function candidateOf(s: SignOff, c: Candidate | null) {
  const rec = JSON.parse(s.recordJson) as { candidate?: { label: string; definition: string; resolved: string; family: string } };
  const r = rec.candidate;
  return r ? { label: r.label, definition: r.definition, resolved: r.resolved, family: r.family } : { label: c?.label ?? '', definition: c?.definition ?? '', resolved: c?.resolved ?? '', family: c?.family ?? '' };
}

/** A sign-off the actor may see (staff of the studio, or a reviewer of the project). */
export async function loadSignOff(ds: DataSource, actor: Actor, signOffId: number): Promise<SignOff> {
  const s = await ds.getRepository(SignOff).findOneBy({ id: signOffId, studioId: actor.studioId });
  if (!s) throw notFound('That sign-off record');
  await loadProjectFor(ds, actor, s.projectId, 'read');
  return s;
}

export async function getSignOff(ds: DataSource, actor: Actor, signOffId: number): Promise<SignOffView> {
  return toSignOffView(await loadSignOff(ds, actor, signOffId), null);
}

/** The project's sign-off, or 404 when it has none yet. */
export async function getProjectSignOff(ds: DataSource, actor: Actor, projectId: number): Promise<SignOffView> {
  await loadProjectFor(ds, actor, projectId, 'read');
  const s = await ds.getRepository(SignOff).findOneBy({ projectId, studioId: actor.studioId });
  if (!s) throw notFound('A sign-off for this project');
  return toSignOffView(s, null);
}

/**
 * Re-runs the approved candidate's audit from the record alone (on this process's engine) and
 * reports whether the numbers and the hash come out the same. Writes one history line.
 */
export async function verifySignOff(deps: AppDeps, actor: Actor, signOffId: number): Promise<VerifyResult> {
  const s = await loadSignOff(deps.dataSource, actor, signOffId);
  const result = await verifyRecord(s, await sharedAuditEngine(), ENGINE_VERSION);
  await recordActivity(deps.dataSource, {
    projectId: s.projectId, studioId: s.studioId, actor, kind: 'signoff.verified',
    summary: result.hashMatches
      ? `Verified the sign-off record: re-run gives the same hash`
      : `Verified the sign-off record: ${result.differences.length} metric(s) differ, hash does not match`,
    details: { signOffId: s.id, hashMatches: result.hashMatches, metricsMatch: result.metricsMatch, recomputedHash: result.recomputedHash },
  });
  return result;
}

/** The A4 sign-off sheet as PDF bytes, with a file name for the download. */
export async function signOffSheet(deps: AppDeps, actor: Actor, signOffId: number): Promise<{ pdf: Buffer; fileName: string }> {
  const s = await loadSignOff(deps.dataSource, actor, signOffId);
  // PDFKit and its fonts load with the first sheet asked for, not with every server process.
  const { renderSheetPdf } = await import('../signoff/sheet-pdf.js');
  const pdf = await renderSheetPdf(await sheetDataFor(deps, actor, s));
  return { pdf, fileName: `sign-off-${s.projectId}-${s.recordHash.slice(0, 12)}.pdf` };
}
