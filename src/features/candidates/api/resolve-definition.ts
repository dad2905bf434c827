import { queryOptions } from '@tanstack/react-query';
import { resolvedDefinitionSchema } from '@shared/api/candidates.schema.js';
import { apiRequest } from '@/lib/api-client.js';

/** `POST /api/definitions/resolve`: what a definition resolves to, or a 422 saying what is wrong. */
export const resolveDefinition = (definition: string, signal?: AbortSignal) =>
  apiRequest('/definitions/resolve', { method: 'POST', body: { definition }, schema: resolvedDefinitionSchema, signal });

/** A read, though sent by POST (WKT is too long for a URL): cached per text for live validation. */
export const resolveDefinitionQueryOptions = (definition: string) =>
  queryOptions({
    queryKey: ['definitions', 'resolve', definition] as const,
    queryFn: ({ signal }) => resolveDefinition(definition, signal),
    staleTime: Infinity,
    enabled: definition.trim().length > 0,
  });
