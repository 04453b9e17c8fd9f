import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';

const resetSchema = z.object({ email: z.string(), expiresAt: z.string() });

export async function checkPasswordReset(token: string, signal?: AbortSignal) {
  const body = await api.get<unknown>(`/api/password-resets/${encodeURIComponent(token)}`, signal);
  return z.object({ reset: resetSchema }).parse(body).reset;
}

/** Not retried: a used or expired link answers 410 and says why. */
export function usePasswordResetCheck(token: string) {
  return useQuery({
    queryKey: ['password-reset', token],
    queryFn: ({ signal }) => checkPasswordReset(token, signal),
    retry: false,
  });
}
