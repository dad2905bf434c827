import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router';
import type { RoundList } from '@shared/api/review.schema.js';
import { Alert } from '@/components/ui/alert.js';
import { buttonClasses } from '@/components/ui/button.js';
import { Card, CardBody, CardHeader } from '@/components/ui/card.js';
import { signOffQueryOptions } from '../api/get-signoff.js';
import { ApproveForm } from './approve-form.js';
import { CommentsThread } from './comments-thread.js';
import { compareHref } from './compare-link.js';
import { RecommendationText } from './recommendation-text.js';
import { RegionPreview } from './region-preview.js';
import { ReturnForm } from './return-form.js';
import { RoundCard } from './round-card.js';
import { ShortlistTable } from './shortlist-table.js';
import { SignOffRecord } from './signoff-record.js';

/**
 * What a client reviewer sees of a shared project, read-only: the open shortlist with the
 * studio's recommendation, the region, a way into the compare view, and the decision forms;
 * afterwards the sealed record. Earlier rounds stay below.
 */
export function ReviewerView({ data, reviewerName }: { data: RoundList; reviewerName: string }) {
  const signOff = useQuery(signOffQueryOptions(data.project.id));
  const current = data.rounds.find((r) => r.id === data.decidableRoundId);
  const earlier = data.rounds.filter((r) => r.id !== current?.id);
  return (
    <div className="flex flex-col gap-6">
      {signOff.data && (
        <>
          <Alert tone="success" title="Signed off">
            {signOff.data.reviewerName} approved “{signOff.data.candidate.label}”. The studio has been told.
          </Alert>
          <SignOffRecord signOff={signOff.data} />
        </>
      )}
      {current && (
        <>
          <Card aria-labelledby="shortlist-heading">
            <CardHeader
              id="shortlist-heading"
              title={`Shortlist, round ${current.roundNumber}`}
              description={`Sent by ${current.requestedBy.name}. Compare the candidates, then approve one or send the shortlist back.`}
              actions={
                <Link className={buttonClasses('primary', 'sm')} to={compareHref(data.project.id, current.auditId, current.candidateIds)}>
                  Open the compare view
                </Link>
              }
            />
            <CardBody className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_20rem]">
              <div className="flex flex-col gap-4">
                <h3 className="text-sm font-semibold text-ink-950">The studio’s recommendation</h3>
                <RecommendationText text={current.recommendation} />
                <ShortlistTable cards={current.shortlist} purpose={data.project.purpose} caption="Shortlisted candidates" />
              </div>
              <RegionPreview auditId={current.auditId} candidateId={current.candidateIds[0]} label={current.shortlist[0]?.label ?? 'the first candidate'} />
            </CardBody>
          </Card>
          <div className="grid gap-6 lg:grid-cols-2">
            <Card aria-labelledby="approve-heading">
              <CardHeader id="approve-heading" title="Approve one candidate" />
              <CardBody>
                <ApproveForm round={current} reviewerName={reviewerName} />
              </CardBody>
            </Card>
            <Card aria-labelledby="return-heading">
              <CardHeader id="return-heading" title="Or send it back" description="The project goes back to the studio with your comment." />
              <CardBody>
                <ReturnForm round={current} />
              </CardBody>
            </Card>
          </div>
        </>
      )}
      {!current && !signOff.data && <p className="text-sm text-ink-600">Nothing is waiting for your decision on this project right now.</p>}
      {earlier.length > 0 && (
        <section aria-labelledby="earlier-heading" className="flex flex-col gap-4">
          <h2 id="earlier-heading" className="text-lg font-semibold text-ink-950">
            Rounds so far
          </h2>
          {earlier.map((r) => (
            <RoundCard key={r.id} round={r} purpose={data.project.purpose} />
          ))}
        </section>
      )}
      <CommentsThread projectId={data.project.id} />
    </div>
  );
}
