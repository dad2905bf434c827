import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest, isApiError } from '@/lib/api-client.js';
import { getSession, storeSession } from './get-session.js';

export const signOut = () => apiRequest('/auth/sign-out', { method: 'POST' });

/** Signs out, then fetches the anonymous session so the next sign-in has a valid CSRF token. */
export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async () => {
      try {
        await signOut();
      } catch (err) {
        // 401: the session had already ended on the server, which is what was asked for.
        if (!isApiError(err) || err.status !== 401) throw err;
      }
      return getSession();
    },
    onSuccess: (session) => storeSession(queryClient, session),
  });
}
