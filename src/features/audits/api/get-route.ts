import { queryOptions } from '@tanstack/react-query';
import { routeSchema } from '@shared/api/audits.schema.js';
import { apiRequest } from '@/lib/api-client.js';

/** `GET …/route?from=lon,lat&to=lon,lat`: great circle and rhumb line with their distance errors. */
export const getRoute = (auditId: number, candidateId: number, from: string, to: string, signal?: AbortSignal) =>
  apiRequest(`/audits/${auditId}/candidates/${candidateId}/route?from=${encodeURIComponent(from)}&to=${encodeURIComponent(to)}`, {
    schema: routeSchema,
    signal,
  });

export const routeQueryOptions = (auditId: number, candidateId: number, from: string, to: string) =>
  queryOptions({
    queryKey: ['audits', auditId, 'candidates', candidateId, 'route', from, to] as const,
    queryFn: ({ signal }) => getRoute(auditId, candidateId, from, to, signal),
    staleTime: Infinity,
  });
