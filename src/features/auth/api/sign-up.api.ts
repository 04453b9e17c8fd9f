import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import { sessionQueryKey } from './get-session.api';
import { sessionSchema, type Session } from './session.schema';

export const PASSWORD_MIN_LENGTH = 10;

// Sign-up creates a firm and its first person, its owner.
export const signUpInputSchema = z.object({
  firmName: z.string().trim().min(1, 'Enter your firm’s name.').max(200, 'Keep the firm name under 200 characters.'),
  name: z.string().trim().min(1, 'Enter your name.').max(200, 'Keep your name under 200 characters.'),
  email: z.string().trim().min(1, 'Enter your email address.').pipe(z.email('Enter a valid email address.')),
  password: z
    .string()
    .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters.`)
    .max(200, 'Keep the password under 200 characters.'),
});

export type SignUpInput = z.infer<typeof signUpInputSchema>;

export async function signUp(input: SignUpInput): Promise<Session> {
  return sessionSchema.parse(await api.post<unknown>('/api/firms', input));
}

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: (session) => {
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== sessionQueryKey[0] });
      queryClient.setQueryData(sessionQueryKey, session);
    },
  });
}
