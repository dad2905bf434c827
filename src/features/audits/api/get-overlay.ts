import { queryOptions } from '@tanstack/react-query';
import { overlaySchema } from '@shared/api/audits.schema.js';
import { apiRequest } from '@/lib/api-client.js';

/** `GET …/overlay`: outline, graticule, Tissot ellipses and worst points in the heatmap's frame. */
export const getOverlay = (auditId: number, candidateId: number, signal?: AbortSignal) =>
  apiRequest(`/audits/${auditId}/candidates/${candidateId}/overlay`, { schema: overlaySchema, signal });

export const overlayQueryOptions = (auditId: number, candidateId: number) =>
  queryOptions({
    queryKey: ['audits', auditId, 'candidates', candidateId, 'overlay'] as const,
    queryFn: ({ signal }) => getOverlay(auditId, candidateId, signal),
    staleTime: Infinity,
  });
