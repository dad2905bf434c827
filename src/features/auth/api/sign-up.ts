import { useMutation, useQueryClient } from '@tanstack/react-query';
import { sessionSchema, type SignUpInput } from '@shared/api/auth.schema.js';
import { apiRequest } from '@/lib/api-client.js';
import { storeSession } from './get-session.js';

/** `POST /api/auth/sign-up`: creates a studio with its first admin and signs them in. */
export const signUp = (input: SignUpInput) =>
  apiRequest('/auth/sign-up', { method: 'POST', body: input, schema: sessionSchema });

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: signUp, onSuccess: (session) => storeSession(queryClient, session) });
}
