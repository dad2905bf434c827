import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client.js';
import { peopleQueryOptions } from './get-people.js';

/** `DELETE /api/people/invitations/:id` (admin): the link stops working and its seat frees up. */
export const revokeInvitation = (invitationId: number) =>
  apiRequest(`/people/invitations/${invitationId}`, { method: 'DELETE' });

export function useRevokeInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeInvitation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: peopleQueryOptions().queryKey }),
  });
}
