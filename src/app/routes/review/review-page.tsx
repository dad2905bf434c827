import { useSuspenseQuery } from '@tanstack/react-query';
import { useParams } from 'react-router';
import { PURPOSE_LABELS, type MapPurposeName } from '@shared/api/projects.schema.js';
import { PageHeader } from '@/components/layouts/page-header.js';
import { roundsQueryOptions } from '@/features/review/api/get-rounds.js';
import { signOffQueryOptions } from '@/features/review/api/get-signoff.js';
import { ReviewPanel } from '@/features/review/components/review-panel.js';
import type { MemberPage } from '../../route-types.js';

const projectIdOf = (raw: string | undefined) => {
  const id = Number(raw);
  // A malformed id is the same as an unknown one: the page answers "not found".
  if (!Number.isInteger(id) || id <= 0) throw new Response('Not found', { status: 404 });
  return id;
};

/** `/review/:projectId`: where the e-mailed link leads; the project's review tab on a page of its own. */
function ReviewPage() {
  const projectId = projectIdOf(useParams().projectId);
  const { data } = useSuspenseQuery(roundsQueryOptions(projectId));
  const purpose = PURPOSE_LABELS[data.project.purpose as MapPurposeName] ?? data.project.purpose;
  return (
    <>
      <PageHeader title={`Review: ${data.project.title}`} description={`For ${data.project.clientName} · ${purpose}`} />
      <ReviewPanel projectId={projectId} />
    </>
  );
}

export const reviewPage: MemberPage = {
  path: 'review/:projectId',
  Component: ReviewPage,
  load: async ({ params, queryClient }) => {
    const projectId = projectIdOf(params.projectId);
    await Promise.all([queryClient.ensureQueryData(roundsQueryOptions(projectId)), queryClient.prefetchQuery(signOffQueryOptions(projectId))]);
  },
};
