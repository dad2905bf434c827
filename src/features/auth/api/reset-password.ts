import { useMutation } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client.js';

/** `POST /api/auth/reset`: sets a new password with the token from the e-mailed link. */
export const resetPassword = (input: { token: string; password: string }) =>
  apiRequest('/auth/reset', { method: 'POST', body: input });

export const useResetPassword = () => useMutation({ mutationFn: resetPassword });
