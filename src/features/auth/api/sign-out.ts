import { useMutation } from '@tanstack/react-query';
import { apiRequest, isApiError } from '@/lib/api-client.js';

export const signOut = () => apiRequest('/auth/sign-out', { method: 'POST' });

/**
 * Signs out, then loads the sign-in page afresh.
 *
 * A full page load rather than a client-side navigation, for two reasons. Nothing the member had
 * open (cached answers, page state, half-filled forms) stays in the tab's memory. And the
 * signed-in frame never renders with the anonymous session: it would take that for a session that
 * ended on its own and redirect to `/sign-in?next=…`, racing the navigation to `/sign-in` (the
 * router commits its location in a transition, which the session update overtakes). The new page
 * fetches the anonymous session, and with it the next sign-in's CSRF token, as any first load does.
 */
export function useSignOut() {
  return useMutation({
    mutationFn: async () => {
      try {
        await signOut();
      } catch (err) {
        // 401: the session had already ended on the server, which is what was asked for.
        if (!isApiError(err) || err.status !== 401) throw err;
      }
    },
    onSuccess: () => window.location.replace('/sign-in'),
  });
}
