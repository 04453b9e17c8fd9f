import { z } from 'zod';

export const emailField = z
  .string({ error: 'Email is required' })
  .trim()
  .toLowerCase()
  .pipe(z.email({ error: 'Enter a valid email address' }).max(254, 'Email is too long'));

export const signInBody = z.object({
  email: emailField,
  password: z
    .string({ error: 'Password is required' })
    .min(1, 'Password is required')
    .max(1024, 'Password is too long'),
});
export type SignInInput = z.output<typeof signInBody>;

export const signUpBody = z.object({
  firmName: z
    .string({ error: 'Firm name is required' })
    .trim()
    .min(1, 'Firm name is required')
    .max(200, 'Firm name is at most 200 characters'),
  name: z
    .string({ error: 'Your name is required' })
    .trim()
    .min(1, 'Your name is required')
    .max(200, 'Name is at most 200 characters'),
  email: emailField,
  password: z
    .string({ error: 'Password is required' })
    .min(10, 'Password must be at least 10 characters')
    .max(1024, 'Password is too long'),
});
export type SignUpInput = z.output<typeof signUpBody>;
