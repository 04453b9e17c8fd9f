import type { AppContext } from '../app-context';
import type { AuthContext } from '../auth/auth-context';
import { verifyAgainstDummy, verifyPassword } from '../auth/password';
import { isRole, type Role } from '../auth/policy';
import { AppError } from '../errors/app-error';
import type { SignInInput } from '../schemas/session.schema';
import { AUDIT_ACTIONS, recordAudit } from './audit.service';

export interface SessionView {
  user: { id: string; email: string; name: string };
  firm: { id: string; name: string };
  role: Role;
}

function rateLimited(retryAfterSeconds: number, message: string): AppError {
  return new AppError(429, 'rate_limited', message, {
    headers: { 'Retry-After': String(retryAfterSeconds) },
  });
}

/**
 * Counts one sign-in or sign-up attempt (or, with the token limiter, one use of a one-time
 * link) from ip; throws 429 above the per-IP ceiling.
 */
export function countAttemptFromIp(ctx: AppContext, ip: string, limiter = ctx.limiters.perIpAttempts): void {
  const decision = limiter.consume(ip);
  if (!decision.allowed) {
    throw rateLimited(
      decision.retryAfterSeconds,
      `Too many attempts from this address. Try again in ${decision.retryAfterSeconds} s.`,
    );
  }
}

export async function buildSessionView(
  ctx: AppContext,
  who: { userId: string; firmId: string },
): Promise<SessionView | null> {
  const { User, Firm, Membership } = ctx.db.models;
  const [user, firm, membership] = await Promise.all([
    User.findByPk(who.userId),
    Firm.findByPk(who.firmId),
    Membership.findOne({ where: { userId: who.userId, firmId: who.firmId } }),
  ]);
  if (!user || !firm || !membership) return null;
  const role = membership.getDataValue('role');
  if (!isRole(role)) return null;
  return {
    user: { id: user.getDataValue('id'), email: user.getDataValue('email'), name: user.getDataValue('name') },
    firm: { id: firm.getDataValue('id'), name: firm.getDataValue('name') },
    role,
  };
}

export async function getSessionView(ctx: AppContext, auth: AuthContext): Promise<SessionView> {
  const view = await buildSessionView(ctx, auth);
  if (!view) throw AppError.unauthenticated();
  return view;
}

/** Opens a session for the user's firm; the caller sets the cookie. */
export async function openSession(
  ctx: AppContext,
  who: { userId: string; firmId: string },
): Promise<string> {
  const session = await ctx.lucia.createSession(who.userId, { firmId: who.firmId });
  return session.id;
}

/**
 * Checks credentials under the rate limits: per IP (all attempts) and per account
 * (failures). Unknown email and wrong password give the same 401.
 */
export async function signIn(
  ctx: AppContext,
  input: SignInInput & { ip: string },
): Promise<{ sessionId: string; view: SessionView }> {
  countAttemptFromIp(ctx, input.ip);
  const accountKey = input.email;
  const locked = ctx.limiters.perAccountFailures.check(accountKey);
  if (!locked.allowed) {
    throw rateLimited(
      locked.retryAfterSeconds,
      `Too many failed sign-ins for this account. Try again in ${Math.ceil(locked.retryAfterSeconds / 60)} min.`,
    );
  }

  const { User, Membership } = ctx.db.models;
  const user = await User.findOne({ where: { email: input.email } });
  const ok = user
    ? await verifyPassword(user.getDataValue('passwordHash'), input.password)
    : (await verifyAgainstDummy(input.password), false);
  if (!user || !ok) {
    ctx.limiters.perAccountFailures.hit(accountKey);
    // Only known accounts have a firm whose log can show it.
    if (user) await recordSignInAudit(ctx, user.getDataValue('id'), AUDIT_ACTIONS.signInFailed, input.ip);
    throw new AppError(401, 'invalid_credentials', 'Email or password is not right.');
  }
  ctx.limiters.perAccountFailures.reset(accountKey);

  // One firm per user today; the oldest membership decides when there are several.
  const membership = await Membership.findOne({
    where: { userId: user.getDataValue('id') },
    order: [['createdAt', 'ASC']],
  });
  if (!membership) throw new AppError(401, 'invalid_credentials', 'Email or password is not right.');
  const who = { userId: user.getDataValue('id'), firmId: membership.getDataValue('firmId') };
  const sessionId = await openSession(ctx, who);
  const view = await buildSessionView(ctx, who);
  if (!view) throw new Error('session view missing right after sign-in');
  await recordAudit(ctx, { firmId: who.firmId, userId: who.userId, action: AUDIT_ACTIONS.signedIn, detail: { ip: input.ip } });
  return { sessionId, view };
}

async function recordSignInAudit(ctx: AppContext, userId: string, action: string, ip: string): Promise<void> {
  const membership = await ctx.db.models.Membership.findOne({ where: { userId }, order: [['createdAt', 'ASC']] });
  if (!membership) return;
  const user = await ctx.db.models.User.findByPk(userId);
  await recordAudit(ctx, {
    firmId: membership.getDataValue('firmId'),
    userId,
    action,
    target: user?.getDataValue('email') ?? null,
    detail: { ip },
  });
}

export async function signOut(ctx: AppContext, sessionId: string | undefined): Promise<void> {
  if (sessionId) await ctx.lucia.invalidateSession(sessionId);
}

/**
 * Validates a session id from a cookie. Returns auth: null for an unknown, expired or
 * orphaned session (no membership any more), which the caller treats as anonymous.
 */
export async function authenticateSession(
  ctx: AppContext,
  sessionId: string,
): Promise<{ auth: AuthContext | null; refreshed: boolean }> {
  const { session, user } = await ctx.lucia.validateSession(sessionId);
  if (!session) return { auth: null, refreshed: false };
  const membership = await ctx.db.models.Membership.findOne({
    where: { userId: user.id, firmId: session.firmId },
  });
  const role = membership?.getDataValue('role');
  if (!membership || !isRole(role)) {
    await ctx.lucia.invalidateSession(session.id);
    return { auth: null, refreshed: false };
  }
  return {
    auth: {
      sessionId: session.id,
      userId: user.id,
      email: user.email,
      name: user.name,
      firmId: session.firmId,
      role,
    },
    refreshed: session.fresh,
  };
}
