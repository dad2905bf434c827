import { queryOptions } from '@tanstack/react-query';
import { roundListSchema } from '@shared/api/review.schema.js';
import { apiRequest } from '@/lib/api-client.js';

/** `GET /api/projects/:projectId/rounds`: every review round (a reviewer: the rounds sent to them). */
export const getRounds = (projectId: number, signal?: AbortSignal) =>
  apiRequest(`/projects/${projectId}/rounds`, { schema: roundListSchema, signal });

export const roundsQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: ['projects', projectId, 'rounds'] as const, queryFn: ({ signal }) => getRounds(projectId, signal) });
