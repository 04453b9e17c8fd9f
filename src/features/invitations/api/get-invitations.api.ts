import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import { invitationSchema, type Invitation } from './invitation.schema';

export const invitationsQueryKey = ['invitations'] as const;

export async function getInvitations(signal?: AbortSignal): Promise<Invitation[]> {
  const body = await api.get<unknown>('/api/invitations', signal);
  return z.object({ invitations: z.array(invitationSchema) }).parse(body).invitations;
}

export function invitationsQueryOptions() {
  return queryOptions({ queryKey: invitationsQueryKey, queryFn: ({ signal }) => getInvitations(signal), staleTime: 0 });
}

export function useInvitations() {
  return useQuery(invitationsQueryOptions());
}
