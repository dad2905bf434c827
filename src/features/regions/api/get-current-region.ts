import { queryOptions } from '@tanstack/react-query';
import { currentRegionSchema } from '@shared/api/regions.schema.js';
import { apiRequest } from '@/lib/api-client.js';

/** `GET /api/projects/:projectId/region`: the current region with its geometry, or null. */
export const getCurrentRegion = (projectId: number, signal?: AbortSignal) =>
  apiRequest(`/projects/${projectId}/region`, { schema: currentRegionSchema, signal });

export const currentRegionQueryOptions = (projectId: number) =>
  queryOptions({
    queryKey: ['projects', projectId, 'region'] as const,
    queryFn: ({ signal }) => getCurrentRegion(projectId, signal),
  });
