import { QueryClientProvider } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { ToastProvider } from '@/components/ui/toast.js';
import { sessionQueryOptions } from '@/features/auth/api/get-session.js';
import { configureCsrf } from '@/lib/api-client.js';
import { queryClient, setSignedOutHandler } from '@/lib/query-client.js';

// Writes carry the CSRF token of the current session; a refused token is refreshed once.
configureCsrf({
  get: async () => (await queryClient.ensureQueryData(sessionQueryOptions())).csrfToken,
  refresh: async () => (await queryClient.fetchQuery({ ...sessionQueryOptions(), staleTime: 0 })).csrfToken,
});
// A 401 anywhere means the session ended. Forget the member at once (so the sign-in page does not
// bounce back on stale data), then re-read the session for a current CSRF token.
setSignedOutHandler(() => {
  const { queryKey } = sessionQueryOptions();
  queryClient.setQueryData(queryKey, (old) => old && { ...old, user: null, membership: null });
  void queryClient.invalidateQueries({ queryKey });
});

export function AppProvider({ children }: { children: ReactNode }) {
  return (
    <QueryClientProvider client={queryClient}>
      <ToastProvider>{children}</ToastProvider>
    </QueryClientProvider>
  );
}
