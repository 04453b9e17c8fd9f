import { z } from 'zod';
import { ROLES } from '../auth/policy';
import { AUDIT_LIMIT_MAX } from '../services/audit.service';
import { emailField } from './session.schema';

// Bodies, params and queries of the team, invitation, password-reset, outbox, audit and
// notification routes.

export const PASSWORD_MIN = 10;

const roleField = z.enum(ROLES, { error: `Role must be one of ${ROLES.join(', ')}` });

const newPassword = z
  .string({ error: 'Password is required' })
  .min(PASSWORD_MIN, `Password must be at least ${PASSWORD_MIN} characters`)
  .max(1024, 'Password is too long');

export const invitationCreateBody = z.object({ email: emailField, role: roleField });
export type InvitationCreateInput = z.output<typeof invitationCreateBody>;

export const invitationAcceptBody = z.object({
  name: z
    .string({ error: 'Your name is required' })
    .trim()
    .min(1, 'Your name is required')
    .max(200, 'Name is at most 200 characters'),
  password: newPassword,
});
export type InvitationAcceptInput = z.output<typeof invitationAcceptBody>;

/** A token from an e-mailed link; unknown ones are answered 404 by the service. */
export const tokenParams = z.object({
  token: z.string().min(1, 'Token is required').max(200, 'Token is too long'),
});

export const passwordResetRequestBody = z.object({ email: emailField });
export const passwordResetCompleteBody = z.object({ password: newPassword });

export const userIdParams = z.object({ userId: z.uuid({ error: 'Must be a valid person id' }) });
export const roleChangeBody = z.object({ role: roleField });

const dateOrDateTime = (name: string) =>
  z
    .string()
    .trim()
    .refine((v) => !Number.isNaN(Date.parse(v)), `${name} must be a date (YYYY-MM-DD) or date-time`)
    .optional();

export const auditQuery = z
  .object({
    action: z
      .string()
      .trim()
      .max(80, 'Action is at most 80 characters')
      .regex(/^[a-z_.]*$/, 'Action is letters, dots and underscores, e.g. invitation.sent')
      .optional(),
    userId: z.uuid({ error: 'userId must be a valid person id' }).optional(),
    from: dateOrDateTime('from'),
    to: dateOrDateTime('to'),
    limit: z.coerce
      .number({ error: 'limit must be a whole number' })
      .int('limit must be a whole number')
      .min(1, 'limit is at least 1')
      .max(AUDIT_LIMIT_MAX, `limit is at most ${AUDIT_LIMIT_MAX}`)
      .optional(),
  })
  .transform((q) => ({
    action: q.action || undefined,
    userId: q.userId,
    from: q.from ? new Date(q.from) : undefined,
    // A bare date as "to" means the whole of that day (UTC).
    to: q.to
      ? /^\d{4}-\d{2}-\d{2}$/.test(q.to)
        ? new Date(Date.parse(q.to) + 24 * 3600 * 1000 - 1)
        : new Date(q.to)
      : undefined,
    limit: q.limit,
  }));

export const notificationPrefsBody = z.object({
  schemeSubmitted: z.boolean({ error: 'schemeSubmitted must be true or false' }),
  schemeChosen: z.boolean({ error: 'schemeChosen must be true or false' }),
});
export type NotificationPrefs = z.output<typeof notificationPrefsBody>;
