import { queryOptions, type QueryClient } from '@tanstack/react-query';
import { sessionSchema, type SessionInfo } from '@shared/api/auth.schema.js';
import type { Role } from '@shared/api/roles.js';
import { apiRequest } from '@/lib/api-client.js';

/** `GET /api/auth/session`: who is signed in, and the CSRF token for this session's writes. */
export const getSession = (signal?: AbortSignal) => apiRequest('/auth/session', { schema: sessionSchema, signal });

export const sessionQueryOptions = () =>
  queryOptions({ queryKey: ['auth', 'session'] as const, queryFn: ({ signal }) => getSession(signal), staleTime: 5 * 60_000 });

/** A session with an active studio membership. */
export type MemberSession = SessionInfo & {
  user: NonNullable<SessionInfo['user']>;
  membership: NonNullable<SessionInfo['membership']>;
};

export const isMember = (s: SessionInfo | undefined): s is MemberSession => Boolean(s?.user && s.membership);

export const hasRole = (s: SessionInfo | undefined, roles: readonly Role[] | undefined) =>
  isMember(s) && (!roles || roles.includes(s.membership.role));

/**
 * Makes a session the one the client knows about. Sign-in, sign-up and accepting an invitation
 * answer with a new session (and a new CSRF token); everything cached for the previous visitor goes.
 */
export function storeSession(queryClient: QueryClient, session: SessionInfo) {
  queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== 'auth' || q.queryKey[1] !== 'session' });
  queryClient.setQueryData(sessionQueryOptions().queryKey, session);
}
