import { queryOptions } from '@tanstack/react-query';
import { candidateListSchema } from '@shared/api/candidates.schema.js';
import { apiRequest } from '@/lib/api-client.js';

/** `GET /api/projects/:projectId/candidates`: the candidates an audit can be run over. */
export const getProjectCandidates = (projectId: number, signal?: AbortSignal) =>
  apiRequest(`/projects/${projectId}/candidates`, { schema: candidateListSchema, signal });

export const projectCandidatesQueryOptions = (projectId: number) =>
  queryOptions({
    queryKey: ['projects', projectId, 'candidates'] as const,
    queryFn: ({ signal }) => getProjectCandidates(projectId, signal),
  });
