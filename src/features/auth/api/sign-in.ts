import { useMutation, useQueryClient } from '@tanstack/react-query';
import { sessionSchema, type SignInInput } from '@shared/api/auth.schema.js';
import { apiRequest } from '@/lib/api-client.js';
import { storeSession } from './get-session.js';

export const signIn = (input: SignInInput) =>
  apiRequest('/auth/sign-in', { method: 'POST', body: input, schema: sessionSchema });

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: signIn, onSuccess: (session) => storeSession(queryClient, session) });
}
