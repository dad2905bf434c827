import { useQuery, useSuspenseQuery } from '@tanstack/react-query';
import { PageHeader } from '@/components/layouts/page-header.js';
import { Card, CardBody, CardHeader } from '@/components/ui/card.js';
import { isMember, sessionQueryOptions } from '@/features/auth/api/get-session.js';
import { peopleQueryOptions } from '@/features/people/api/get-people.js';
import { InvitationsTable } from '@/features/people/components/invitations-table.js';
import { InviteForm } from '@/features/people/components/invite-form.js';
import { MembersTable } from '@/features/people/components/members-table.js';
import { SeatUsage } from '@/features/people/components/seat-usage.js';
import type { MemberPage } from '../../route-types.js';

function PeoplePage() {
  const { data: people } = useSuspenseQuery(peopleQueryOptions());
  const { data: session } = useQuery(sessionQueryOptions());
  const selfId = isMember(session) ? session.membership.id : -1;
  return (
    <>
      <PageHeader
        title="People"
        description="Who works in your studio, in which role, and who has been invited."
        actions={<SeatUsage seats={people.seats} />}
      />
      <div className="flex flex-col gap-6">
        <Card aria-labelledby="invite-heading">
          <CardHeader id="invite-heading" title="Invite someone" description="They get an e-mail with a link to join your studio." />
          <CardBody>
            <InviteForm />
          </CardBody>
        </Card>
        <Card aria-labelledby="members-heading">
          <CardHeader id="members-heading" title="Members" description={`${people.members.length} in your studio`} />
          <MembersTable members={people.members} selfMembershipId={selfId} />
        </Card>
        <Card aria-labelledby="invitations-heading">
          <CardHeader id="invitations-heading" title="Pending invitations" />
          <InvitationsTable invitations={people.invitations} />
        </Card>
      </div>
    </>
  );
}

export const peoplePage: MemberPage = {
  path: 'studio/people',
  Component: PeoplePage,
  roles: ['admin'],
  load: ({ queryClient }) => queryClient.ensureQueryData(peopleQueryOptions()),
};
