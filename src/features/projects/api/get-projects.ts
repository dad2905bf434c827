import { queryOptions } from '@tanstack/react-query';
import { projectListSchema, type ListProjectsQuery } from '@shared/api/projects.schema.js';
import { apiRequest } from '@/lib/api-client.js';

/** `GET /api/projects`: the projects the signed-in person may see, searched, filtered and sorted by the server. */
export const getProjects = (query: ListProjectsQuery, signal?: AbortSignal) => {
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(query)) if (v) params.set(k, String(v));
  const qs = params.toString();
  return apiRequest(`/projects${qs ? `?${qs}` : ''}`, { schema: projectListSchema, signal });
};

export const projectsQueryOptions = (query: ListProjectsQuery = {}) =>
  queryOptions({
    queryKey: ['projects', 'list', query] as const,
    queryFn: ({ signal }) => getProjects(query, signal),
    placeholderData: (previous) => previous,
  });

/** Key prefix of every project list, whatever its filters (for invalidation). */
export const projectListsKey = ['projects', 'list'] as const;
