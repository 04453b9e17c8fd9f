import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { invitationsQueryKey } from './get-invitations.api';

export async function resendInvitation(id: string): Promise<void> {
  await api.post(`/api/invitations/${encodeURIComponent(id)}/resend`);
}

export function useResendInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: resendInvitation,
    onSettled: () => queryClient.invalidateQueries({ queryKey: invitationsQueryKey }),
  });
}
