import { queryOptions } from '@tanstack/react-query';
import { commentListSchema } from '@shared/api/review.schema.js';
import { apiRequest } from '@/lib/api-client.js';

/** `GET /api/projects/:projectId/comments`: the project's thread, oldest first. */
export const getComments = (projectId: number, signal?: AbortSignal) =>
  apiRequest(`/projects/${projectId}/comments`, { schema: commentListSchema, signal });

export const commentsQueryOptions = (projectId: number) =>
  queryOptions({
    queryKey: ['projects', projectId, 'comments'] as const,
    queryFn: ({ signal }) => getComments(projectId, signal),
    // A thread is a conversation: look for new replies now and then while it is on screen.
    refetchInterval: 30_000,
  });
