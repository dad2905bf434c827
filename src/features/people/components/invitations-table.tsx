import type { PendingInvitation } from '@shared/api/people.schema.js';
import { Badge } from '@/components/ui/badge.js';
import { Button } from '@/components/ui/button.js';
import { DataTable, type Column } from '@/components/ui/data-table.js';
import { useToast } from '@/components/ui/toast.js';
import { isApiError } from '@/lib/api-client.js';
import { formatDate } from '@/lib/format.js';
import { ROLE_LABELS } from '@/lib/role-labels.js';
import { useRevokeInvitation } from '../api/revoke-invitation.js';

/** Invitations sent but not yet accepted; revoking one frees its seat at once. */
export function InvitationsTable({ invitations }: { invitations: readonly PendingInvitation[] }) {
  const revoke = useRevokeInvitation();
  const { notify } = useToast();
  const columns: Column<PendingInvitation>[] = [
    { key: 'email', header: 'E-mail', rowHeader: true, sortValue: (i) => i.email, cell: (i) => i.email },
    { key: 'role', header: 'Role', sortValue: (i) => ROLE_LABELS[i.role], cell: (i) => <Badge tone="highlight">{ROLE_LABELS[i.role]}</Badge> },
    { key: 'sent', header: 'Sent', sortValue: (i) => i.createdAt, cell: (i) => <span className="tabular">{formatDate(i.createdAt)}</span> },
    {
      key: 'expires',
      header: 'Expires',
      sortValue: (i) => i.expiresAt,
      cell: (i) => <span className="tabular">{formatDate(i.expiresAt)}</span>,
    },
    {
      key: 'actions',
      header: <span className="sr-only">Actions</span>,
      align: 'right',
      cell: (i) => (
        <Button
          variant="ghost"
          size="sm"
          loading={revoke.isPending && revoke.variables === i.id}
          aria-label={`Revoke the invitation to ${i.email}`}
          onClick={() =>
            revoke.mutate(i.id, {
              onSuccess: () => notify(`The invitation to ${i.email} was revoked.`),
              onError: (err) => notify(isApiError(err) ? err.message : 'The invitation was not revoked.', 'error'),
            })
          }
        >
          Revoke
        </Button>
      ),
    },
  ];
  return (
    <DataTable
      caption="Pending invitations"
      captionHidden
      rows={invitations}
      columns={columns}
      rowKey={(i) => i.id}
      initialSort={{ key: 'sent', direction: 'descending' }}
      empty="No invitations are waiting for an answer."
    />
  );
}
