import { queryOptions } from '@tanstack/react-query';
import { auditListSchema, type AuditSummary } from '@shared/api/audits.schema.js';
import { apiRequest } from '@/lib/api-client.js';

/** `GET /api/projects/:projectId/audits`: newest first, with status and progress. */
export const getAudits = (projectId: number, signal?: AbortSignal) =>
  apiRequest(`/projects/${projectId}/audits`, { schema: auditListSchema, signal });

export const isActive = (a: Pick<AuditSummary, 'status'>) => a.status === 'queued' || a.status === 'running';

/** Polls every second while any audit of the project is queued or running, then stops. */
export const auditsQueryOptions = (projectId: number) =>
  queryOptions({
    queryKey: ['projects', projectId, 'audits'] as const,
    queryFn: ({ signal }) => getAudits(projectId, signal),
    refetchInterval: (query) => (query.state.data?.audits.some(isActive) ? 1000 : false),
  });
