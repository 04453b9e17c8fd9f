import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import { invitationsQueryKey } from './get-invitations.api';
import { invitationSchema, type Invitation, type InviteInput } from './invitation.schema';

export async function createInvitation(input: InviteInput): Promise<Invitation> {
  const body = await api.post<unknown>('/api/invitations', input);
  return z.object({ invitation: invitationSchema }).parse(body).invitation;
}

export function useCreateInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createInvitation,
    onSettled: () => queryClient.invalidateQueries({ queryKey: invitationsQueryKey }),
  });
}
