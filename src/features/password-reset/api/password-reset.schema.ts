import { z } from 'zod';

export const PASSWORD_MIN_LENGTH = 10;

export const forgotInputSchema = z.object({
  email: z.string().trim().min(1, 'Enter your e-mail address.').pipe(z.email('Enter a valid e-mail address.')),
});
export type ForgotInput = z.infer<typeof forgotInputSchema>;

export const newPasswordInputSchema = z
  .object({
    password: z
      .string()
      .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters.`)
      .max(200, 'Keep the password under 200 characters.'),
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords differ.' });
export type NewPasswordInput = z.infer<typeof newPasswordInputSchema>;
