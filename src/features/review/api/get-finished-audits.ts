import { queryOptions } from '@tanstack/react-query';
import { auditDetailSchema, auditListSchema } from '@shared/api/audits.schema.js';
import { apiRequest } from '@/lib/api-client.js';

/**
 * The project's finished audits with their scorecards, for picking a shortlist:
 * `GET /api/projects/:projectId/audits`, then `GET /api/audits/:auditId` for each finished one.
 */
export async function getFinishedAudits(projectId: number, signal?: AbortSignal) {
  const { audits } = await apiRequest(`/projects/${projectId}/audits`, { schema: auditListSchema, signal });
  const done = audits.filter((a) => a.status === 'done');
  return Promise.all(done.map((a) => apiRequest(`/audits/${a.id}`, { schema: auditDetailSchema, signal })));
}

export const finishedAuditsQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: ['projects', projectId, 'audits', 'finished'] as const, queryFn: ({ signal }) => getFinishedAudits(projectId, signal) });
