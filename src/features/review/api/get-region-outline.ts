import { queryOptions } from '@tanstack/react-query';
import { overlaySchema } from '@shared/api/audits.schema.js';
import { apiRequest } from '@/lib/api-client.js';

/** `GET /api/audits/:auditId/candidates/:candidateId/overlay`: the region outline and graticule as one candidate draws them. */
export const getRegionOutline = (auditId: number, candidateId: number, signal?: AbortSignal) =>
  apiRequest(`/audits/${auditId}/candidates/${candidateId}/overlay`, { schema: overlaySchema, signal });

export const regionOutlineQueryOptions = (auditId: number, candidateId: number) =>
  queryOptions({
    queryKey: ['audits', auditId, 'candidates', candidateId, 'overlay'] as const,
    queryFn: ({ signal }) => getRegionOutline(auditId, candidateId, signal),
    staleTime: Infinity,
  });
