import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';

export async function completePasswordReset(token: string, password: string): Promise<string> {
  const body = await api.post<unknown>(`/api/password-resets/${encodeURIComponent(token)}`, { password });
  return z.object({ email: z.string() }).parse(body).email;
}

export function useCompletePasswordReset(token: string) {
  return useMutation({ mutationFn: (password: string) => completePasswordReset(token, password) });
}
