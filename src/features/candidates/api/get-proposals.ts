import { queryOptions } from '@tanstack/react-query';
import { proposalListSchema } from '@shared/api/candidates.schema.js';
import { apiRequest } from '@/lib/api-client.js';

/** `GET /api/projects/:projectId/proposals`: the engine's proposals for the current region and purpose. */
export const getProposals = (projectId: number, signal?: AbortSignal) =>
  apiRequest(`/projects/${projectId}/proposals`, { schema: proposalListSchema, signal });

export const proposalsQueryOptions = (projectId: number) =>
  queryOptions({
    queryKey: ['projects', projectId, 'proposals'] as const,
    queryFn: ({ signal }) => getProposals(projectId, signal),
    staleTime: 5 * 60_000,
  });
