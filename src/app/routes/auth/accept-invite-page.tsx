import { useQuery } from '@tanstack/react-query';
import { useNavigate, useSearchParams } from 'react-router';
import { Spinner } from '@/components/ui/spinner.js';
import { invitationQueryOptions } from '@/features/auth/api/get-invitation.js';
import { AcceptInviteForm } from '@/features/auth/components/accept-invite-form.js';
import { AuthCard } from '@/features/auth/components/auth-card.js';
import { ROLE_DESCRIPTIONS, ROLE_LABELS } from '@/lib/role-labels.js';
import type { PublicPage } from '../../route-types.js';
import { safeNext } from '../../safe-next.js';
import { LinkProblem } from './link-problem.js';

function AcceptInvitePage() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const navigate = useNavigate();
  const invitation = useQuery({ ...invitationQueryOptions(token), enabled: token.length > 0 });

  if (!token) {
    return (
      <AuthCard title="Join a studio">
        <LinkProblem what="invitation" />
      </AuthCard>
    );
  }
  if (invitation.isPending) return <Spinner label="Checking your invitation…" />;
  if (invitation.isError || invitation.data.kind !== 'invite') {
    return (
      <AuthCard title="Join a studio">
        <LinkProblem what="invitation" error={invitation.error} />
      </AuthCard>
    );
  }
  const inv = invitation.data;
  return (
    <AuthCard
      title={`Join ${inv.studioName ?? 'the studio'}`}
      intro={
        inv.role && (
          <>
            You are invited as <strong className="text-ink-950">{ROLE_LABELS[inv.role]}</strong>: {ROLE_DESCRIPTIONS[inv.role]}
          </>
        )
      }
    >
      <AcceptInviteForm token={token} invitation={inv} onAccepted={() => navigate(safeNext(params.get('next')), { replace: true })} />
    </AuthCard>
  );
}

export const acceptInvitePage: PublicPage = {
  path: 'accept-invite',
  Component: AcceptInvitePage,
  load: async ({ request, queryClient }) => {
    const token = new URL(request.url).searchParams.get('token');
    // prefetch never throws: a bad link is explained by the page itself.
    if (token) await queryClient.prefetchQuery(invitationQueryOptions(token));
  },
};
