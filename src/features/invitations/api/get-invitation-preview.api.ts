import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import { invitationPreviewSchema, type InvitationPreview } from './invitation.schema';

export const invitationPreviewQueryKey = (token: string) => ['invitation-preview', token] as const;

export async function getInvitationPreview(token: string, signal?: AbortSignal): Promise<InvitationPreview> {
  const body = await api.get<unknown>(`/api/invitations/${encodeURIComponent(token)}`, signal);
  return z.object({ invitation: invitationPreviewSchema }).parse(body).invitation;
}

/** Not retried: a used or expired link answers 410 and says why. */
export function useInvitationPreview(token: string) {
  return useQuery({
    queryKey: invitationPreviewQueryKey(token),
    queryFn: ({ signal }) => getInvitationPreview(token, signal),
    retry: false,
  });
}
