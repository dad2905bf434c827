import { queryOptions } from '@tanstack/react-query';
import { candidateListSchema } from '@shared/api/candidates.schema.js';
import { apiRequest } from '@/lib/api-client.js';

/** `GET /api/projects/:projectId/candidates`. The key is shared with the audits tab's candidate list. */
export const getCandidates = (projectId: number, signal?: AbortSignal) =>
  apiRequest(`/projects/${projectId}/candidates`, { schema: candidateListSchema, signal });

export const candidatesQueryOptions = (projectId: number) =>
  queryOptions({
    queryKey: ['projects', projectId, 'candidates'] as const,
    queryFn: ({ signal }) => getCandidates(projectId, signal),
  });
