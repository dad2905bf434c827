import type { Member } from '@shared/api/people.schema.js';
import type { Role } from '@shared/api/roles.js';
import { Badge } from '@/components/ui/badge.js';
import { Button } from '@/components/ui/button.js';
import { DataTable, type Column } from '@/components/ui/data-table.js';
import { Select } from '@/components/ui/select.js';
import { useToast } from '@/components/ui/toast.js';
import { isApiError } from '@/lib/api-client.js';
import { formatDate } from '@/lib/format.js';
import { ROLE_LABELS, ROLE_OPTIONS } from '@/lib/role-labels.js';
import { useUpdateMember } from '../api/update-member.js';

/**
 * The studio's members with their role and status. Admins change roles in place and
 * deactivate or reactivate people; their own row is read-only so nobody locks themselves out.
 */
export function MembersTable({ members, selfMembershipId }: { members: readonly Member[]; selfMembershipId: number }) {
  const update = useUpdateMember();
  const { notify } = useToast();
  const busyId = update.isPending ? update.variables?.membershipId : undefined;

  const change = (m: Member, patch: { role?: Role; status?: Member['status'] }, done: string) =>
    update.mutate(
      { membershipId: m.membershipId, ...patch },
      {
        onSuccess: () => notify(done),
        onError: (err) => notify(isApiError(err) ? err.message : `The change for ${m.name} was not saved.`, 'error'),
      },
    );

  const columns: Column<Member>[] = [
    {
      key: 'name',
      header: 'Name',
      rowHeader: true,
      sortValue: (m) => m.name,
      cell: (m) => (
        <span>
          {m.name}
          {m.membershipId === selfMembershipId && <span className="ml-1.5 text-xs font-normal text-ink-600">(you)</span>}
        </span>
      ),
    },
    { key: 'email', header: 'E-mail', sortValue: (m) => m.email, cell: (m) => <span className="text-ink-800">{m.email}</span> },
    {
      key: 'role',
      header: 'Role',
      sortValue: (m) => ROLE_LABELS[m.role],
      cell: (m) =>
        m.membershipId === selfMembershipId ? (
          ROLE_LABELS[m.role]
        ) : (
          <Select
            aria-label={`Role of ${m.name}`}
            className="w-44"
            value={m.role}
            disabled={busyId === m.membershipId}
            options={ROLE_OPTIONS}
            onChange={(e) => {
              const role = e.target.value as Role;
              change(m, { role }, `${m.name} is now ${ROLE_LABELS[role]}.`);
            }}
          />
        ),
    },
    {
      key: 'status',
      header: 'Status',
      sortValue: (m) => m.status,
      cell: (m) => <Badge tone={m.status === 'active' ? 'success' : 'neutral'}>{m.status === 'active' ? 'Active' : 'Deactivated'}</Badge>,
    },
    { key: 'joined', header: 'Joined', sortValue: (m) => m.createdAt, cell: (m) => <span className="tabular">{formatDate(m.createdAt)}</span> },
    {
      key: 'actions',
      header: <span className="sr-only">Actions</span>,
      align: 'right',
      cell: (m) =>
        m.membershipId === selfMembershipId ? null : m.status === 'active' ? (
          <Button
            variant="danger"
            size="sm"
            loading={busyId === m.membershipId && update.variables?.status === 'deactivated'}
            onClick={() => change(m, { status: 'deactivated' }, `${m.name} was deactivated and can no longer sign in.`)}
            aria-label={`Deactivate ${m.name}`}
          >
            Deactivate
          </Button>
        ) : (
          <Button
            variant="secondary"
            size="sm"
            loading={busyId === m.membershipId && update.variables?.status === 'active'}
            onClick={() => change(m, { status: 'active' }, `${m.name} was reactivated.`)}
            aria-label={`Reactivate ${m.name}`}
          >
            Reactivate
          </Button>
        ),
    },
  ];

  return (
    <DataTable
      caption="Studio members"
      captionHidden
      rows={members}
      columns={columns}
      rowKey={(m) => m.membershipId}
      initialSort={{ key: 'name', direction: 'ascending' }}
    />
  );
}
