import { In, type DataSource, type EntityManager } from 'typeorm';
import type { ScorecardView } from '../../shared/api/audits.schema.js';
import type { RoundView } from '../../shared/api/review.schema.js';
import { ReviewRecipient, ReviewRound, SignOff, User } from '../entities/index.js';

type Db = DataSource | EntityManager;

/** Rounds as the API shows them, with names, recipients and sign-off ids filled in by batch queries. */
export async function roundViews(db: Db, rounds: ReviewRound[]): Promise<RoundView[]> {
  if (!rounds.length) return [];
  const ids = rounds.map((r) => r.id);
  const recipients = await db.getRepository(ReviewRecipient).find({ where: { roundId: In(ids) }, order: { id: 'ASC' } });
  const signOffs = await db.getRepository(SignOff).find({ where: { roundId: In(ids) }, select: { id: true, roundId: true } });
  const emails = [...new Set(recipients.map((r) => r.email))];
  const userIds = [...new Set(rounds.flatMap((r) => [r.requestedById, r.decidedById]).filter((x): x is number => x != null))];
  const users = await db.getRepository(User).find({
    where: [...(userIds.length ? [{ id: In(userIds) }] : []), ...(emails.length ? [{ email: In(emails) }] : [])],
    select: { id: true, name: true, email: true, passwordHash: true },
  });
  const byId = new Map(users.map((u) => [u.id, u]));
  const byEmail = new Map(users.map((u) => [u.email, u]));
  const person = (id: number | null) => (id == null ? null : { id, name: byId.get(id)?.name ?? 'Former member' });

  return rounds.map((r) => ({
    id: r.id,
    projectId: r.projectId,
    roundNumber: r.roundNumber,
    auditId: r.auditId,
    status: r.status,
    candidateIds: r.candidateIds,
    recommendation: r.recommendation,
    requestedBy: person(r.requestedById)!,
    createdAt: r.createdAt.toISOString(),
    recipients: recipients
      .filter((x) => x.roundId === r.id)
      .map((x) => {
        const u = byEmail.get(x.email);
        return { email: x.email, name: u?.name ?? null, hasAccount: Boolean(u?.passwordHash) };
      }),
    shortlist: r.shortlist as ScorecardView[],
    decidedBy: person(r.decidedById),
    decidedAt: r.decidedAt?.toISOString() ?? null,
    decisionComment: r.decisionComment,
    chosenCandidateId: r.chosenCandidateId,
    signOffId: signOffs.find((s) => s.roundId === r.id)?.id ?? null,
  }));
}

/** True when the round was sent to this person (by user id, or by address before they joined). */
export async function isRecipient(db: Db, roundId: number, user: { userId: number; email: string }): Promise<boolean> {
  return db.getRepository(ReviewRecipient).exists({
    where: [
      { roundId, userId: user.userId },
      { roundId, email: user.email.toLowerCase() },
    ],
  });
}
