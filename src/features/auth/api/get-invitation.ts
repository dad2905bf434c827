import { queryOptions } from '@tanstack/react-query';
import { invitationPreviewSchema } from '@shared/api/auth.schema.js';
import { apiRequest } from '@/lib/api-client.js';

/** `GET /api/invitations/:token` (public): what an invitation or password-reset link is for. */
export const getInvitation = (token: string, signal?: AbortSignal) =>
  apiRequest(`/invitations/${encodeURIComponent(token)}`, { schema: invitationPreviewSchema, signal });

export const invitationQueryOptions = (token: string) =>
  queryOptions({
    queryKey: ['invitations', token] as const,
    queryFn: ({ signal }) => getInvitation(token, signal),
    staleTime: 60_000,
  });
