import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { InviteInput } from '@shared/api/people.schema.js';
import { apiRequest } from '@/lib/api-client.js';
import { peopleQueryOptions } from './get-people.js';

/** `POST /api/people/invitations` (admin): e-mails an invitation; a staff role needs a free seat. */
export const invitePerson = (input: InviteInput) =>
  apiRequest<unknown>('/people/invitations', { method: 'POST', body: input });

export function useInvitePerson() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: invitePerson,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: peopleQueryOptions().queryKey }),
  });
}
