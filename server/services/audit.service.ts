import { Op, type WhereOptions } from 'sequelize';
import type { AppContext } from '../app-context';
import type { AuditEventAttributes } from '../models/audit-event.model';

// The firm's audit log. Any feature records through recordAudit(ctx, {...}); names are
// "<area>.<what happened>" in the past tense, e.g. scheme.status_changed, design.run,
// plan.revised. The ones recorded by accounts and the team:
export const AUDIT_ACTIONS = {
  signedIn: 'session.signed_in',
  signInFailed: 'session.sign_in_failed',
  roleChanged: 'team.role_changed',
  memberRemoved: 'team.member_removed',
  invitationSent: 'invitation.sent',
  invitationResent: 'invitation.resent',
  invitationAccepted: 'invitation.accepted',
  invitationRevoked: 'invitation.revoked',
  passwordResetRequested: 'password.reset_requested',
  passwordReset: 'password.reset',
} as const;

export interface AuditInput {
  firmId: string;
  /** Who did it (null: nobody signed in, e.g. a failed sign-in is recorded against the account). */
  userId?: string | null;
  action: string;
  /** What it was done to, in words a reader knows (an e-mail, a scheme name). */
  target?: string | null;
  detail?: Record<string, unknown> | null;
}

export interface AuditEventView {
  id: string;
  firmId: string;
  userId: string | null;
  actor: string | null;
  action: string;
  target: string | null;
  detail: Record<string, unknown> | null;
  createdAt: string;
}

type AuditCtx = Pick<AppContext, 'db'>;

function toView(row: AuditEventAttributes): AuditEventView {
  let detail: Record<string, unknown> | null = null;
  if (row.detail) {
    try {
      detail = JSON.parse(row.detail) as Record<string, unknown>;
    } catch {
      detail = { text: row.detail };
    }
  }
  return {
    id: row.id,
    firmId: row.firmId,
    userId: row.userId,
    actor: row.actorLabel,
    action: row.action,
    target: row.target,
    detail,
    createdAt: new Date(row.createdAt).toISOString(),
  };
}

/** Appends one event to the firm's audit log. */
export async function recordAudit(ctx: AuditCtx, input: AuditInput): Promise<AuditEventView> {
  const { User, AuditEvent } = ctx.db.models;
  let actorLabel: string | null = null;
  if (input.userId) {
    const user = await User.findByPk(input.userId);
    if (user) actorLabel = `${user.getDataValue('name')} <${user.getDataValue('email')}>`;
  }
  const row = await AuditEvent.create({
    firmId: input.firmId,
    userId: input.userId ?? null,
    actorLabel,
    action: input.action.slice(0, 80),
    target: input.target ? input.target.slice(0, 300) : null,
    detail: input.detail ? JSON.stringify(input.detail) : null,
    createdAt: new Date(),
  });
  return toView(row.get({ plain: true }));
}

export interface AuditFilter {
  /** Exact action, or an area ("invitation") for every action in it. */
  action?: string;
  userId?: string;
  from?: Date;
  to?: Date;
  limit?: number;
}

export const AUDIT_LIMIT_DEFAULT = 100;
export const AUDIT_LIMIT_MAX = 500;

/** The firm's events, newest first, filtered. */
export async function listAudit(ctx: AuditCtx, firmId: string, filter: AuditFilter = {}): Promise<AuditEventView[]> {
  const where: WhereOptions<AuditEventAttributes>[] = [{ firmId }];
  if (filter.action) {
    where.push(
      filter.action.includes('.')
        ? { action: filter.action }
        : { [Op.or]: [{ action: filter.action }, { action: { [Op.like]: `${filter.action}.%` } }] },
    );
  }
  if (filter.userId) where.push({ userId: filter.userId });
  if (filter.from) where.push({ createdAt: { [Op.gte]: filter.from } });
  if (filter.to) where.push({ createdAt: { [Op.lte]: filter.to } });
  const rows = await ctx.db.models.AuditEvent.findAll({
    where: { [Op.and]: where },
    order: [
      ['createdAt', 'DESC'],
      ['id', 'DESC'],
    ],
    limit: Math.min(filter.limit ?? AUDIT_LIMIT_DEFAULT, AUDIT_LIMIT_MAX),
  });
  return rows.map((r) => toView(r.get({ plain: true })));
}
