import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import type { ForgotInput } from './password-reset.schema';

export async function requestPasswordReset(input: ForgotInput): Promise<string> {
  const body = await api.post<unknown>('/api/password-resets', input);
  return z.object({ message: z.string() }).parse(body).message;
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
