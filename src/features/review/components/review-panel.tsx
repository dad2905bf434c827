import { useQuery } from '@tanstack/react-query';
import { Alert } from '@/components/ui/alert.js';
import { Card, CardBody, CardHeader } from '@/components/ui/card.js';
import { Spinner } from '@/components/ui/spinner.js';
import { hasRole, isMember, sessionQueryOptions } from '@/features/auth/api/get-session.js';
import { finishedAuditsQueryOptions } from '../api/get-finished-audits.js';
import { roundsQueryOptions } from '../api/get-rounds.js';
import { signOffQueryOptions } from '../api/get-signoff.js';
import { CommentsThread } from './comments-thread.js';
import { RequestForm } from './request-form.js';
import { ReviewerView } from './reviewer-view.js';
import { RoundCard } from './round-card.js';
import { SignOffRecord } from './signoff-record.js';

/**
 * The project's review tab. For the studio: the sealed record once there is one, the form that
 * sends a shortlist for sign-off (editors and admins, when no round is waiting), every round so
 * far, and the comment thread shared with the reviewers. For a client reviewer: ReviewerView.
 */
export function ReviewPanel({ projectId }: { projectId: number }) {
  const session = useQuery(sessionQueryOptions());
  const rounds = useQuery(roundsQueryOptions(projectId));
  const signOff = useQuery(signOffQueryOptions(projectId));
  const canRequest = hasRole(session.data, ['editor', 'admin']);
  const open = rounds.data?.rounds.find((r) => r.status === 'open');
  const signedOff = rounds.data?.project.status === 'signed-off' || Boolean(signOff.data);
  const audits = useQuery({ ...finishedAuditsQueryOptions(projectId), enabled: canRequest && !open && !signedOff && rounds.isSuccess });

  if (rounds.isPending) return <Spinner label="Loading the review…" />;
  if (rounds.isError) return <Alert tone="error">The review rounds could not be loaded.</Alert>;
  // A client reviewer decides here; the studio's tools below are not theirs.
  if (isMember(session.data) && session.data.membership.role === 'client') {
    return <ReviewerView data={rounds.data} reviewerName={session.data.user.name} />;
  }
  const { project } = rounds.data;
  return (
    <div className="flex flex-col gap-6">
      {signOff.data && <SignOffRecord signOff={signOff.data} />}
      {open && (
        <Alert tone="info" title={`Round ${open.roundNumber} is with the client`}>
          Sent to {open.recipients.map((r) => r.name ?? r.email).join(', ')}. You will get an e-mail when they decide.
        </Alert>
      )}
      {canRequest && !open && !signedOff && (
        <Card aria-labelledby="request-heading">
          <CardHeader
            id="request-heading"
            title={rounds.data.rounds.length ? 'Send a new shortlist' : 'Request sign-off'}
            description="Shortlist up to four candidates of a finished audit, explain your recommendation, and ask the client to decide."
          />
          <CardBody>
            {audits.isPending && <Spinner label="Loading finished audits…" />}
            {audits.isError && <Alert tone="error">The audits could not be loaded.</Alert>}
            {audits.data && audits.data.length === 0 && <p className="text-sm text-ink-600">Run an audit first; its candidates can then be shortlisted here.</p>}
            {audits.data && audits.data.length > 0 && <RequestForm projectId={projectId} audits={audits.data} />}
          </CardBody>
        </Card>
      )}
      {!canRequest && !open && !signedOff && (
        <p className="text-sm text-ink-600">An editor or admin sends the shortlist to the client for sign-off.</p>
      )}
      <section aria-labelledby="rounds-heading" className="flex flex-col gap-4">
        <h2 id="rounds-heading" className="text-lg font-semibold text-ink-950">
          Review rounds
        </h2>
        {rounds.data.rounds.length === 0 && <p className="text-sm text-ink-600">No shortlist has been sent yet.</p>}
        {rounds.data.rounds.map((r, i) => (
          <RoundCard key={r.id} round={r} purpose={project.purpose} defaultOpen={i === 0} />
        ))}
      </section>
      <CommentsThread projectId={projectId} />
    </div>
  );
}
