import { queryOptions } from '@tanstack/react-query';
import { activityListSchema } from '@shared/api/review.schema.js';
import { apiRequest } from '@/lib/api-client.js';

/** `GET /api/projects/:projectId/activity` (studio staff): the project's history, newest first. */
export const getActivity = (projectId: number, signal?: AbortSignal) =>
  apiRequest(`/projects/${projectId}/activity`, { schema: activityListSchema, signal });

export const activityQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: ['projects', projectId, 'activity'] as const, queryFn: ({ signal }) => getActivity(projectId, signal) });
