import { z } from 'zod';
import { ROLES } from '../../../lib/permissions';

export const invitationSchema = z.object({
  id: z.string(),
  email: z.string(),
  role: z.enum(ROLES),
  status: z.string(),
  expired: z.boolean(),
  invitedBy: z.string().nullable(),
  expiresAt: z.string(),
  createdAt: z.string(),
});
export type Invitation = z.output<typeof invitationSchema>;

export const invitationPreviewSchema = z.object({
  firmName: z.string(),
  email: z.string(),
  role: z.enum(ROLES),
  expiresAt: z.string(),
});
export type InvitationPreview = z.output<typeof invitationPreviewSchema>;

export const PASSWORD_MIN_LENGTH = 10;

// What an owner types to invite someone.
export const inviteInputSchema = z.object({
  email: z.string().trim().min(1, 'Enter the person’s e-mail address.').pipe(z.email('Enter a valid e-mail address.')),
  role: z.enum(ROLES, { error: 'Choose a role.' }),
});
export type InviteInput = z.infer<typeof inviteInputSchema>;

// What the invited person types to join.
export const acceptInputSchema = z.object({
  name: z.string().trim().min(1, 'Enter your name.').max(200, 'Keep your name under 200 characters.'),
  password: z
    .string()
    .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters.`)
    .max(200, 'Keep the password under 200 characters.'),
});
export type AcceptInput = z.infer<typeof acceptInputSchema>;
