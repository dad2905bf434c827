import { queryOptions } from '@tanstack/react-query';
import { legendSchema, type HeatmapField } from '@shared/api/audits.schema.js';
import { apiRequest } from '@/lib/api-client.js';

/** `GET …/heatmap/:field/legend`: colour stops, domain, units and label of a heatmap. */
export const getLegend = (auditId: number, candidateId: number, field: HeatmapField, signal?: AbortSignal) =>
  apiRequest(`/audits/${auditId}/candidates/${candidateId}/heatmap/${field}/legend`, { schema: legendSchema, signal });

export const legendQueryOptions = (auditId: number, candidateId: number, field: HeatmapField) =>
  queryOptions({
    queryKey: ['audits', auditId, 'candidates', candidateId, 'legend', field] as const,
    queryFn: ({ signal }) => getLegend(auditId, candidateId, field, signal),
    staleTime: Infinity,
  });
