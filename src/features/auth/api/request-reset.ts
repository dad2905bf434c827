import { useMutation } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client.js';

/** `POST /api/auth/reset-request`: answers 202 whether or not the address has an account. */
export const requestReset = (input: { email: string }) =>
  apiRequest('/auth/reset-request', { method: 'POST', body: input });

export const useRequestReset = () => useMutation({ mutationFn: requestReset });
