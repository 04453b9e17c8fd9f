import type { AppContext } from '../app-context';
import { hashPassword } from '../auth/password';
import { RateLimiter } from '../auth/rate-limiter';
import { AppError } from '../errors/app-error';
import { passwordResetMail } from '../mail/mail-templates';
import { AUDIT_ACTIONS, recordAudit } from './audit.service';
import { sendMail } from './mail.service';
import { hashOneTimeToken, newOneTimeToken } from './one-time-token.service';
import { countAttemptFromIp } from './session.service';

export const PASSWORD_RESET_TTL_MS = 60 * 60 * 1000;
/**
 * Every reset request answers after this long, whether or not the address has an account
 * and however long the mail takes, so response time tells nothing (the work goes on in
 * the background if it takes longer).
 */
export const RESET_REQUEST_RESPONSE_MS = 300;
/** Reset e-mails per address: 3 per 15 minutes (more requests are accepted and dropped). */
const MAILS_PER_ADDRESS = 3;
const MAIL_WINDOW_MS = 15 * 60 * 1000;

const perAddress = new WeakMap<object, RateLimiter>();
function addressLimiter(ctx: AppContext): RateLimiter {
  let limiter = perAddress.get(ctx);
  if (!limiter) {
    limiter = new RateLimiter(MAILS_PER_ADDRESS, MAIL_WINDOW_MS);
    perAddress.set(ctx, limiter);
  }
  return limiter;
}

export const PASSWORD_RESET_ACCEPTED = {
  message:
    'If an account uses this address, an e-mail with a link to choose a new password is on its way. The link works for one hour.',
} as const;

export function passwordResetLink(baseUrl: string, token: string): string {
  return `${baseUrl}/password-reset/${token}`;
}

async function firmOf(ctx: AppContext, userId: string): Promise<string | null> {
  const m = await ctx.db.models.Membership.findOne({ where: { userId }, order: [['createdAt', 'ASC']] });
  return m?.getDataValue('firmId') ?? null;
}

async function issueReset(ctx: AppContext, email: string, baseUrl: string): Promise<void> {
  const { User, PasswordReset } = ctx.db.models;
  const user = await User.findOne({ where: { email } });
  if (!user) return;
  if (!addressLimiter(ctx).consume(email).allowed) return;
  const userId = user.getDataValue('id');
  // Only the newest link works.
  await PasswordReset.update({ status: 'superseded' }, { where: { userId, status: 'pending' } });
  const { token, tokenHash } = newOneTimeToken();
  const expiresAt = new Date(Date.now() + PASSWORD_RESET_TTL_MS);
  await PasswordReset.create({ userId, tokenHash, status: 'pending', expiresAt });
  const firmId = await firmOf(ctx, userId);
  const mail = passwordResetMail({ name: user.getDataValue('name'), link: passwordResetLink(baseUrl, token), expiresAt });
  await sendMail(ctx, { to: email, ...mail }, { firmId });
  if (firmId) {
    await recordAudit(ctx, {
      firmId,
      userId,
      action: AUDIT_ACTIONS.passwordResetRequested,
      target: email,
    });
  }
}

const sleep = (ms: number) => new Promise<void>((resolve) => setTimeout(resolve, ms));

/**
 * Starts a reset. The answer is the same, after the same time, for every address: known or
 * not, rate limited per address or not, mail sent or failed (failures are logged only).
 */
export async function requestPasswordReset(
  ctx: AppContext,
  input: { email: string; ip: string; baseUrl: string },
  logError: (err: unknown) => void = console.error,
): Promise<typeof PASSWORD_RESET_ACCEPTED> {
  countAttemptFromIp(ctx, input.ip);
  const floor = sleep(RESET_REQUEST_RESPONSE_MS);
  // Not awaited: the answer never waits for the mail (with the local outbox the work is
  // done well inside the floor).
  void issueReset(ctx, input.email, input.baseUrl).catch(logError);
  await floor;
  return PASSWORD_RESET_ACCEPTED;
}

async function findUsableReset(ctx: AppContext, token: string) {
  const row = await ctx.db.models.PasswordReset.findOne({ where: { tokenHash: hashOneTimeToken(token) } });
  if (!row) {
    throw new AppError(
      404,
      'reset_not_found',
      'This password link is not valid. Check that the whole address was copied, or ask for a new link.',
    );
  }
  const reset = row.get({ plain: true });
  if (reset.status === 'used') {
    throw new AppError(410, 'reset_used', 'This password link has already been used. Ask for a new one if needed.');
  }
  if (reset.status === 'superseded') {
    throw new AppError(410, 'reset_superseded', 'A newer password link was sent; use the one in the latest e-mail.');
  }
  if (new Date(reset.expiresAt).getTime() <= Date.now()) {
    throw new AppError(410, 'reset_expired', 'This password link has expired (links work for one hour). Ask for a new one.');
  }
  return reset;
}

/** Whether a reset link can still be used, and for which address. */
export async function checkPasswordReset(ctx: AppContext, token: string): Promise<{ email: string; expiresAt: string }> {
  const reset = await findUsableReset(ctx, token);
  const user = await ctx.db.models.User.findByPk(reset.userId);
  if (!user) throw new AppError(404, 'reset_not_found', 'This password link is not valid.');
  return { email: user.getDataValue('email'), expiresAt: new Date(reset.expiresAt).toISOString() };
}

/** Sets the new password and ends every session of that person. */
export async function completePasswordReset(
  ctx: AppContext,
  token: string,
  input: { password: string },
): Promise<{ email: string }> {
  const reset = await findUsableReset(ctx, token);
  const passwordHash = await hashPassword(input.password);
  const { sequelize, models } = ctx.db;
  await sequelize.transaction(async (transaction) => {
    const [claimed] = await models.PasswordReset.update(
      { status: 'used', usedAt: new Date() },
      { where: { id: reset.id, status: 'pending' }, transaction },
    );
    if (claimed !== 1) {
      throw new AppError(410, 'reset_used', 'This password link has already been used. Ask for a new one if needed.');
    }
    await models.User.update({ passwordHash }, { where: { id: reset.userId }, transaction });
    await models.PasswordReset.update(
      { status: 'superseded' },
      { where: { userId: reset.userId, status: 'pending' }, transaction },
    );
  });
  await ctx.lucia.invalidateUserSessions(reset.userId);
  const user = await models.User.findByPk(reset.userId);
  const email = user?.getDataValue('email') ?? '';
  ctx.limiters.perAccountFailures.reset(email);
  const firmId = await firmOf(ctx, reset.userId);
  if (firmId) {
    await recordAudit(ctx, {
      firmId,
      userId: reset.userId,
      action: AUDIT_ACTIONS.passwordReset,
      target: email,
      detail: { sessionsEnded: true },
    });
  }
  return { email };
}
