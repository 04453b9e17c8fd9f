import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import { sessionQueryKey } from './get-session.api';
import { sessionSchema, type Session } from './session.schema';

export const signInInputSchema = z.object({
  email: z.string().trim().min(1, 'Enter your email address.').pipe(z.email('Enter a valid email address.')),
  password: z.string().min(1, 'Enter your password.'),
});

export type SignInInput = z.infer<typeof signInInputSchema>;

export async function signIn(input: SignInInput): Promise<Session> {
  return sessionSchema.parse(await api.post<unknown>('/api/session', input));
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (session) => {
      // A new person may be signing in on this browser: start from a clean cache.
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== sessionQueryKey[0] });
      queryClient.setQueryData(sessionQueryKey, session);
    },
  });
}
