import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import { ROLES } from '../../../lib/permissions';
import type { AcceptInput } from './invitation.schema';

// The answer is the new person's session (the same shape as sign-in).
const acceptedSessionSchema = z.object({
  user: z.object({ id: z.string(), email: z.string(), name: z.string() }),
  firm: z.object({ id: z.string(), name: z.string() }),
  role: z.enum(ROLES),
});
export type AcceptedSession = z.output<typeof acceptedSessionSchema>;

export async function acceptInvitation(token: string, input: AcceptInput): Promise<AcceptedSession> {
  const body = await api.post<unknown>(`/api/invitations/${encodeURIComponent(token)}/accept`, input);
  return acceptedSessionSchema.parse(body);
}

export function useAcceptInvitation(token: string) {
  return useMutation({ mutationFn: (input: AcceptInput) => acceptInvitation(token, input) });
}
