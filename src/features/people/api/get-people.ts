import { queryOptions } from '@tanstack/react-query';
import { peopleListSchema } from '@shared/api/people.schema.js';
import { apiRequest } from '@/lib/api-client.js';

/** `GET /api/people` (admin): members, pending invitations and seat usage. */
export const getPeople = (signal?: AbortSignal) => apiRequest('/people', { schema: peopleListSchema, signal });

export const peopleQueryOptions = () =>
  queryOptions({ queryKey: ['people'] as const, queryFn: ({ signal }) => getPeople(signal) });
