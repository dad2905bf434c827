import { queryOptions } from '@tanstack/react-query';
import { reviewRequestListSchema } from '@shared/api/review.schema.js';
import { apiRequest } from '@/lib/api-client.js';

/** `GET /api/review/requests` (client reviewers): the shortlists sent to me. */
export const getReviewRequests = (signal?: AbortSignal) =>
  apiRequest('/review/requests', { schema: reviewRequestListSchema, signal });

export const reviewRequestsQueryOptions = () =>
  queryOptions({ queryKey: ['review', 'requests'] as const, queryFn: ({ signal }) => getReviewRequests(signal) });
