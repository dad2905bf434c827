import { QueryCache, QueryClient } from '@tanstack/react-query';
import { isApiError } from './api-client.js';

/** Called when any query meets a 401: the session ended on the server (expiry, deactivation). */
let onSignedOut: () => void = () => {};
export function setSignedOutHandler(fn: () => void) {
  onSignedOut = fn;
}

export const queryClient = new QueryClient({
  queryCache: new QueryCache({
    onError: (err) => {
      if (isApiError(err) && err.status === 401) onSignedOut();
    },
  }),
  defaultOptions: {
    queries: {
      staleTime: 30_000,
      // Refusals do not get better by asking again; network blips might.
      retry: (count, err) => (isApiError(err) && err.status > 0 && err.status < 500 ? false : count < 2),
      refetchOnWindowFocus: false,
    },
    mutations: { retry: false },
  },
});
