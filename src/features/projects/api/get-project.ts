import { queryOptions } from '@tanstack/react-query';
import { projectSchema } from '@shared/api/projects.schema.js';
import { apiRequest } from '@/lib/api-client.js';

/** `GET /api/projects/:projectId`: one project with its current region and counts. */
export const getProject = (projectId: number, signal?: AbortSignal) =>
  apiRequest(`/projects/${projectId}`, { schema: projectSchema, signal });

/** The key is also the prefix of everything scoped to the project (region, candidates, audits). */
export const projectQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: ['projects', projectId] as const, queryFn: ({ signal }) => getProject(projectId, signal) });
