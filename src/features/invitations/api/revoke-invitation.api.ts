import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { invitationsQueryKey } from './get-invitations.api';

export async function revokeInvitation(id: string): Promise<void> {
  await api.delete(`/api/invitations/${encodeURIComponent(id)}`);
}

export function useRevokeInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeInvitation,
    onSettled: () => queryClient.invalidateQueries({ queryKey: invitationsQueryKey }),
  });
}
