import { useSuspenseQuery } from '@tanstack/react-query';
import { Link } from 'react-router';
import { ROUND_STATUS_LABELS, type ReviewRequestList } from '@shared/api/review.schema.js';
import { PageHeader } from '@/components/layouts/page-header.js';
import { Badge } from '@/components/ui/badge.js';
import { Card } from '@/components/ui/card.js';
import { DataTable, type Column } from '@/components/ui/data-table.js';
import { EmptyState } from '@/components/ui/empty-state.js';
import { formatDate } from '@/lib/format.js';
import { reviewRequestsQueryOptions } from '@/features/review/api/get-review-requests.js';
import type { MemberPage } from '../../route-types.js';

type Row = ReviewRequestList['requests'][number];

const columns: Column<Row>[] = [
  {
    key: 'project',
    header: 'Project',
    rowHeader: true,
    sortValue: (r) => r.projectTitle,
    cell: (r) => (
      <Link className="font-medium text-mulberry-700 hover:underline" to={`/review/${r.projectId}`}>
        {r.projectTitle}
      </Link>
    ),
  },
  { key: 'round', header: 'Round', align: 'right', sortValue: (r) => r.roundNumber, cell: (r) => r.roundNumber },
  { key: 'from', header: 'Sent by', sortValue: (r) => r.requestedByName, cell: (r) => r.requestedByName },
  { key: 'sent', header: 'Sent', sortValue: (r) => new Date(r.createdAt), cell: (r) => formatDate(r.createdAt) },
  {
    key: 'status',
    header: 'Status',
    sortValue: (r) => r.status,
    cell: (r) => <Badge tone={r.status === 'open' ? 'warning' : r.status === 'approved' ? 'success' : 'neutral'}>{ROUND_STATUS_LABELS[r.status]}</Badge>,
  },
];

/** `/review` (client reviewers): every shortlist sent to me, waiting ones first. */
function ReviewRequestsPage() {
  const { data } = useSuspenseQuery(reviewRequestsQueryOptions());
  const rows = [...data.requests].sort((a, b) => Number(b.status === 'open') - Number(a.status === 'open'));
  return (
    <>
      <PageHeader title="Reviews" description="Shortlists the studio has asked you to decide on." />
      <Card>
        {rows.length ? (
          <DataTable rows={rows} columns={columns} rowKey={(r) => r.roundId} caption="Review requests" captionHidden />
        ) : (
          <EmptyState title="Nothing to review yet" description="When a studio sends you a shortlist, it appears here and in your e-mail." />
        )}
      </Card>
    </>
  );
}

export const reviewRequestsPage: MemberPage = {
  path: 'review',
  Component: ReviewRequestsPage,
  roles: ['client'],
  load: ({ queryClient }) => queryClient.ensureQueryData(reviewRequestsQueryOptions()),
};
