import { queryOptions } from '@tanstack/react-query';
import { auditDetailSchema } from '@shared/api/audits.schema.js';
import { apiRequest } from '@/lib/api-client.js';
import { isActive } from './get-audits.js';

/** `GET /api/audits/:auditId`: status, progress, error, settings and scorecards. */
export const getAudit = (auditId: number, signal?: AbortSignal) => apiRequest(`/audits/${auditId}`, { schema: auditDetailSchema, signal });

export const auditQueryOptions = (auditId: number) =>
  queryOptions({
    queryKey: ['audits', auditId] as const,
    queryFn: ({ signal }) => getAudit(auditId, signal),
    refetchInterval: (query) => (query.state.data && isActive(query.state.data) ? 1000 : false),
  });
