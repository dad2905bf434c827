import { queryOptions } from '@tanstack/react-query';
import { regionListSchema } from '@shared/api/regions.schema.js';
import { apiRequest } from '@/lib/api-client.js';

/** `GET /api/projects/:projectId/regions`: every upload, newest first. */
export const getRegions = (projectId: number, signal?: AbortSignal) =>
  apiRequest(`/projects/${projectId}/regions`, { schema: regionListSchema, signal });

export const regionsQueryOptions = (projectId: number) =>
  queryOptions({
    queryKey: ['projects', projectId, 'regions'] as const,
    queryFn: ({ signal }) => getRegions(projectId, signal),
  });
