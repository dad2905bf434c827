import { Link } from 'react-router';
import { ROUND_STATUS_LABELS, type RoundView } from '@shared/api/review.schema.js';
import { Badge, type BadgeTone } from '@/components/ui/badge.js';
import { buttonClasses } from '@/components/ui/button.js';
import { Card, CardBody, CardHeader } from '@/components/ui/card.js';
import { formatDateTime } from './format-time.js';
import { compareHref } from './compare-link.js';
import { RecommendationText } from './recommendation-text.js';
import { ShortlistTable } from './shortlist-table.js';

const TONE: Record<RoundView['status'], BadgeTone> = { open: 'warning', approved: 'success', returned: 'neutral' };

/** One round as sent, and what the client decided. */
export function RoundCard({ round, purpose, defaultOpen }: { round: RoundView; purpose: string; defaultOpen?: boolean }) {
  const headingId = `round-${round.id}-heading`;
  const chosen = round.shortlist.find((c) => c.candidateId === round.chosenCandidateId);
  return (
    <Card aria-labelledby={headingId}>
      <CardHeader
        id={headingId}
        as="h3"
        title={
          <span className="flex items-center gap-2">
            Round {round.roundNumber} <Badge tone={TONE[round.status]}>{ROUND_STATUS_LABELS[round.status]}</Badge>
          </span>
        }
        description={`Sent by ${round.requestedBy.name} on ${formatDateTime(round.createdAt)} to ${round.recipients.map((r) => r.name ?? r.email).join(', ')}`}
        actions={
          <Link className={buttonClasses('secondary', 'sm')} to={compareHref(round.projectId, round.auditId, round.candidateIds)}>
            Compare the shortlist
          </Link>
        }
      />
      <CardBody className="flex flex-col gap-4">
        {round.status !== 'open' && round.decidedBy && (
          <div className="rounded-md bg-paper px-4 py-3 text-sm" role="note">
            <p>
              <strong>{round.decidedBy.name}</strong> {round.status === 'approved' ? `approved “${chosen?.label ?? 'a candidate'}”` : 'returned the shortlist'} on{' '}
              {formatDateTime(round.decidedAt!)}.
            </p>
            {round.decisionComment && <p className="mt-1 whitespace-pre-line text-ink-800">“{round.decisionComment}”</p>}
          </div>
        )}
        <ShortlistTable cards={round.shortlist} purpose={purpose} chosenId={round.chosenCandidateId} caption={`Shortlist of round ${round.roundNumber}`} />
        <details open={defaultOpen}>
          <summary className="cursor-pointer text-sm font-medium text-mulberry-700">Recommendation</summary>
          <RecommendationText text={round.recommendation} className="mt-2" />
        </details>
      </CardBody>
    </Card>
  );
}
