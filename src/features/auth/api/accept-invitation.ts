import { useMutation, useQueryClient } from '@tanstack/react-query';
import { sessionSchema } from '@shared/api/auth.schema.js';
import { apiRequest } from '@/lib/api-client.js';
import { storeSession } from './get-session.js';

export interface AcceptInvitationInput {
  token: string;
  name: string;
  password: string;
}

/** `POST /api/invitations/accept`: joins the studio and signs in as the new member. */
export const acceptInvitation = (input: AcceptInvitationInput) =>
  apiRequest('/invitations/accept', { method: 'POST', body: input, schema: sessionSchema });

export function useAcceptInvitation() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: acceptInvitation, onSuccess: (session) => storeSession(queryClient, session) });
}
