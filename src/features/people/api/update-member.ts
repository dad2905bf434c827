import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UpdateMemberInput } from '@shared/api/people.schema.js';
import { apiRequest } from '@/lib/api-client.js';
import { peopleQueryOptions } from './get-people.js';

/** `PATCH /api/people/:membershipId` (admin): changes a member's role or (de)activates them. */
export const updateMember = ({ membershipId, ...change }: UpdateMemberInput & { membershipId: number }) =>
  apiRequest<unknown>(`/people/${membershipId}`, { method: 'PATCH', body: change });

export function useUpdateMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateMember,
    // Refetch on failure too: a refused change must not leave the select showing the new value.
    onSettled: () => queryClient.invalidateQueries({ queryKey: peopleQueryOptions().queryKey }),
  });
}
