import { Op } from 'sequelize';
import type { AppContext } from '../app-context';
import type { AuthContext } from '../auth/auth-context';
import { hashPassword } from '../auth/password';
import type { Role } from '../auth/policy';
import { AppError } from '../errors/app-error';
import { invitationMail } from '../mail/mail-templates';
import type { InvitationAttributes } from '../models/invitation.model';
import type { InvitationAcceptInput, InvitationCreateInput } from '../schemas/team.schema';
import { AUDIT_ACTIONS, recordAudit } from './audit.service';
import { sendMail } from './mail.service';
import { hashOneTimeToken, newOneTimeToken } from './one-time-token.service';
import { buildSessionView, openSession, type SessionView } from './session.service';

export const INVITATION_TTL_MS = 7 * 24 * 3600 * 1000;

export interface InvitationView {
  id: string;
  email: string;
  role: Role;
  status: InvitationAttributes['status'];
  expired: boolean;
  invitedBy: string | null;
  expiresAt: string;
  createdAt: string;
}

/** What an invitation link shows before it is accepted. */
export interface InvitationPreview {
  firmName: string;
  email: string;
  role: Role;
  expiresAt: string;
}

export function invitationLink(baseUrl: string, token: string): string {
  return `${baseUrl}/invitations/${token}`;
}

function toView(row: InvitationAttributes, inviterName: string | null, now = Date.now()): InvitationView {
  return {
    id: row.id,
    email: row.email,
    role: row.role,
    status: row.status,
    expired: new Date(row.expiresAt).getTime() <= now,
    invitedBy: inviterName,
    expiresAt: new Date(row.expiresAt).toISOString(),
    createdAt: new Date(row.createdAt).toISOString(),
  };
}

function emailConflict(code: string, message: string): AppError {
  return AppError.conflict(code, message, { email: message });
}

function mailFailed(): AppError {
  return new AppError(
    502,
    'mail_failed',
    'The invitation is saved, but the e-mail could not be sent. Check the mail settings, then use Resend.',
  );
}

async function firmName(ctx: AppContext, firmId: string): Promise<string> {
  const firm = await ctx.db.models.Firm.findByPk(firmId);
  return firm?.getDataValue('name') ?? 'your firm';
}

/** Creates the invitation row and e-mails its link; the token exists only in the e-mail. */
async function issueInvitation(
  ctx: AppContext,
  auth: AuthContext,
  input: { email: string; role: Role },
  baseUrl: string,
): Promise<InvitationAttributes> {
  const { token, tokenHash } = newOneTimeToken();
  const expiresAt = new Date(Date.now() + INVITATION_TTL_MS);
  const row = await ctx.db.models.Invitation.create({
    firmId: auth.firmId,
    email: input.email,
    role: input.role,
    tokenHash,
    status: 'pending',
    invitedBy: auth.userId,
    expiresAt,
  });
  const mail = invitationMail({
    firmName: await firmName(ctx, auth.firmId),
    inviterName: auth.name,
    role: input.role,
    link: invitationLink(baseUrl, token),
    expiresAt,
  });
  try {
    await sendMail(ctx, { to: input.email, ...mail }, { firmId: auth.firmId });
  } catch {
    throw mailFailed();
  }
  return row.get({ plain: true });
}

/** Owners invite a person by e-mail with a role (7-day, single-use link). */
export async function createInvitation(
  ctx: AppContext,
  auth: AuthContext,
  input: InvitationCreateInput,
  baseUrl: string,
): Promise<InvitationView> {
  const { User, Membership, Invitation } = ctx.db.models;
  const existing = await User.findOne({ where: { email: input.email } });
  if (existing) {
    const memberships = await Membership.findAll({ where: { userId: existing.getDataValue('id') } });
    if (memberships.some((m) => m.getDataValue('firmId') === auth.firmId)) {
      throw emailConflict('already_member', 'This person is already in your team.');
    }
    if (memberships.length > 0) {
      throw emailConflict(
        'account_exists',
        'This address already belongs to a Baywright account in another firm; a person belongs to one firm.',
      );
    }
  }
  const waiting = await Invitation.findOne({
    where: { firmId: auth.firmId, email: input.email, status: 'pending', expiresAt: { [Op.gt]: new Date() } },
  });
  if (waiting) {
    throw emailConflict(
      'invitation_pending',
      'An invitation to this address is already waiting. Resend it from the list instead.',
    );
  }
  const row = await issueInvitation(ctx, auth, input, baseUrl);
  await recordAudit(ctx, {
    firmId: auth.firmId,
    userId: auth.userId,
    action: AUDIT_ACTIONS.invitationSent,
    target: input.email,
    detail: { role: input.role, invitationId: row.id },
  });
  return toView(row, auth.name);
}

/** Pending invitations of the firm (expired ones flagged, so they can be resent). */
export async function listPendingInvitations(ctx: AppContext, firmId: string): Promise<InvitationView[]> {
  const { Invitation, User } = ctx.db.models;
  const rows = await Invitation.findAll({
    where: { firmId, status: 'pending' },
    order: [['createdAt', 'DESC']],
  });
  const inviterIds = [...new Set(rows.map((r) => r.getDataValue('invitedBy')).filter((v): v is string => !!v))];
  const inviters = inviterIds.length ? await User.findAll({ where: { id: inviterIds } }) : [];
  const names = new Map(inviters.map((u) => [u.getDataValue('id'), u.getDataValue('name')]));
  return rows.map((r) => {
    const plain = r.get({ plain: true });
    return toView(plain, plain.invitedBy ? (names.get(plain.invitedBy) ?? null) : null);
  });
}

/** The invitation a token names, or the reason it can no longer be used. */
async function findUsable(ctx: AppContext, token: string): Promise<InvitationAttributes> {
  const row = await ctx.db.models.Invitation.findOne({ where: { tokenHash: hashOneTimeToken(token) } });
  if (!row) {
    throw new AppError(
      404,
      'invitation_not_found',
      'This invitation link is not valid. Check that the whole address was copied, or ask for a new invitation.',
    );
  }
  const inv = row.get({ plain: true });
  if (inv.status === 'accepted') {
    throw new AppError(410, 'invitation_used', 'This invitation has already been used. Sign in instead.');
  }
  if (inv.status === 'revoked') {
    throw new AppError(410, 'invitation_revoked', 'This invitation was withdrawn by the firm’s owner.');
  }
  if (inv.status === 'replaced') {
    throw new AppError(
      410,
      'invitation_revoked',
      'This link was replaced by a newer invitation. Use the link in the most recent e-mail.',
    );
  }
  if (new Date(inv.expiresAt).getTime() <= Date.now()) {
    throw new AppError(
      410,
      'invitation_expired',
      'This invitation has expired. Ask the firm’s owner to send it again.',
    );
  }
  return inv;
}

export async function previewInvitation(ctx: AppContext, token: string): Promise<InvitationPreview> {
  const inv = await findUsable(ctx, token);
  return {
    firmName: await firmName(ctx, inv.firmId),
    email: inv.email,
    role: inv.role,
    expiresAt: new Date(inv.expiresAt).toISOString(),
  };
}

/**
 * Accepts an invitation: creates the person with the invited role and signs them in.
 * An address whose account belongs to a firm is refused (409 account_exists): one firm per
 * person. An account left without any firm (removed earlier) is taken over, since the link
 * proves the e-mail is theirs: name and password are set anew and old sessions end.
 */
export async function acceptInvitation(
  ctx: AppContext,
  token: string,
  input: InvitationAcceptInput,
): Promise<{ sessionId: string; view: SessionView }> {
  const inv = await findUsable(ctx, token);
  const { sequelize, models } = ctx.db;
  const passwordHash = await hashPassword(input.password);
  const userId = await sequelize.transaction(async (transaction) => {
    // Single use even under a race: only one request can move it out of pending.
    const [claimed] = await models.Invitation.update(
      { status: 'accepted', acceptedAt: new Date() },
      { where: { id: inv.id, status: 'pending' }, transaction },
    );
    if (claimed !== 1) {
      throw new AppError(410, 'invitation_used', 'This invitation has already been used. Sign in instead.');
    }
    let user = await models.User.findOne({ where: { email: inv.email }, transaction });
    if (user) {
      const memberships = await models.Membership.count({ where: { userId: user.getDataValue('id') }, transaction });
      if (memberships > 0) {
        throw AppError.conflict(
          'account_exists',
          'This address already has a Baywright account in a firm. Sign in with it instead.',
        );
      }
      await user.update({ name: input.name, passwordHash }, { transaction });
      await models.Session.destroy({ where: { userId: user.getDataValue('id') }, transaction });
    } else {
      user = await models.User.create({ email: inv.email, name: input.name, passwordHash }, { transaction });
    }
    const id = user.getDataValue('id');
    await models.Membership.create({ firmId: inv.firmId, userId: id, role: inv.role }, { transaction });
    await models.Invitation.update({ acceptedUserId: id }, { where: { id: inv.id }, transaction });
    return id;
  });
  await recordAudit(ctx, {
    firmId: inv.firmId,
    userId,
    action: AUDIT_ACTIONS.invitationAccepted,
    target: inv.email,
    detail: { role: inv.role, invitationId: inv.id },
  });
  const who = { userId, firmId: inv.firmId };
  const sessionId = await openSession(ctx, who);
  const view = await buildSessionView(ctx, who);
  if (!view) throw new Error('session view missing right after accepting an invitation');
  return { sessionId, view };
}

async function pendingOfFirm(ctx: AppContext, firmId: string, id: string): Promise<InvitationAttributes> {
  const row = await ctx.db.models.Invitation.findOne({ where: { id, firmId } });
  if (!row) throw AppError.notFound('Invitation');
  const inv = row.get({ plain: true });
  if (inv.status !== 'pending') {
    throw AppError.conflict(
      'invitation_closed',
      inv.status === 'accepted'
        ? 'This invitation has already been accepted.'
        : 'This invitation was withdrawn or replaced; send a new one.',
    );
  }
  return inv;
}

/** A new link (and a fresh 7 days); the old link stops working at once. */
export async function resendInvitation(
  ctx: AppContext,
  auth: AuthContext,
  id: string,
  baseUrl: string,
): Promise<InvitationView> {
  const old = await pendingOfFirm(ctx, auth.firmId, id);
  await ctx.db.models.Invitation.update(
    { status: 'replaced', revokedAt: new Date() },
    { where: { id: old.id, status: 'pending' } },
  );
  const row = await issueInvitation(ctx, auth, { email: old.email, role: old.role }, baseUrl);
  await recordAudit(ctx, {
    firmId: auth.firmId,
    userId: auth.userId,
    action: AUDIT_ACTIONS.invitationResent,
    target: old.email,
    detail: { role: old.role, invitationId: row.id, replaces: old.id },
  });
  return toView(row, auth.name);
}

/** Withdraws a pending invitation; its link answers 410 from then on. */
export async function revokeInvitation(ctx: AppContext, auth: AuthContext, id: string): Promise<void> {
  const inv = await pendingOfFirm(ctx, auth.firmId, id);
  await ctx.db.models.Invitation.update(
    { status: 'revoked', revokedAt: new Date() },
    { where: { id: inv.id, status: 'pending' } },
  );
  await recordAudit(ctx, {
    firmId: auth.firmId,
    userId: auth.userId,
    action: AUDIT_ACTIONS.invitationRevoked,
    target: inv.email,
    detail: { role: inv.role, invitationId: inv.id },
  });
}
