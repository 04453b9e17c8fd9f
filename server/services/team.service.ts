import type { AppContext } from '../app-context';
import type { AuthContext } from '../auth/auth-context';
import type { Role } from '../auth/policy';
import { AppError } from '../errors/app-error';
import { AUDIT_ACTIONS, recordAudit } from './audit.service';

export interface TeamMemberView {
  userId: string;
  name: string;
  email: string;
  role: Role;
  joinedAt: string;
}

function lastOwner(): AppError {
  return AppError.conflict(
    'last_owner',
    'A firm always keeps at least one owner. Make someone else owner first.',
    { role: 'The firm’s last owner keeps the owner role' },
  );
}

/** The firm's people with their roles, owners first, then by name. */
export async function listMembers(ctx: AppContext, firmId: string): Promise<TeamMemberView[]> {
  const { Membership, User } = ctx.db.models;
  const memberships = await Membership.findAll({ where: { firmId } });
  const users = memberships.length
    ? await User.findAll({ where: { id: memberships.map((m) => m.getDataValue('userId')) } })
    : [];
  const byId = new Map(users.map((u) => [u.getDataValue('id'), u.get({ plain: true })]));
  const order: Record<Role, number> = { owner: 0, engineer: 1, manager: 2, drafter: 3 };
  return memberships
    .map((m) => {
      const user = byId.get(m.getDataValue('userId'));
      return user
        ? {
            userId: user.id,
            name: user.name,
            email: user.email,
            role: m.getDataValue('role'),
            joinedAt: new Date(m.getDataValue('createdAt')).toISOString(),
          }
        : null;
    })
    .filter((v): v is TeamMemberView => v !== null)
    .sort((a, b) => order[a.role] - order[b.role] || a.name.localeCompare(b.name));
}

/** Sets a person's role; the firm's last owner cannot be demoted (409 last_owner). */
export async function changeRole(
  ctx: AppContext,
  auth: AuthContext,
  userId: string,
  role: Role,
): Promise<TeamMemberView> {
  const { sequelize, models } = ctx.db;
  const from = await sequelize.transaction(async (transaction) => {
    const membership = await models.Membership.findOne({ where: { firmId: auth.firmId, userId }, transaction });
    if (!membership) throw AppError.notFound('Team member');
    const current = membership.getDataValue('role');
    if (current === role) return current;
    if (current === 'owner') {
      const owners = await models.Membership.count({ where: { firmId: auth.firmId, role: 'owner' }, transaction });
      if (owners <= 1) throw lastOwner();
    }
    await membership.update({ role }, { transaction });
    return current;
  });
  const member = (await listMembers(ctx, auth.firmId)).find((m) => m.userId === userId);
  if (!member) throw AppError.notFound('Team member');
  if (from !== role) {
    await recordAudit(ctx, {
      firmId: auth.firmId,
      userId: auth.userId,
      action: AUDIT_ACTIONS.roleChanged,
      target: member.email,
      detail: { from, to: role, memberId: userId },
    });
  }
  return member;
}

/**
 * Removes a person from the firm and ends their sessions for it. The account stays (its
 * name on earlier work stays readable); it can be invited again. Never the last owner.
 */
export async function removeMember(ctx: AppContext, auth: AuthContext, userId: string): Promise<void> {
  const { sequelize, models } = ctx.db;
  const removed = await sequelize.transaction(async (transaction) => {
    const membership = await models.Membership.findOne({ where: { firmId: auth.firmId, userId }, transaction });
    if (!membership) throw AppError.notFound('Team member');
    const role = membership.getDataValue('role');
    if (role === 'owner') {
      const owners = await models.Membership.count({ where: { firmId: auth.firmId, role: 'owner' }, transaction });
      if (owners <= 1) throw lastOwner();
    }
    const user = await models.User.findByPk(userId, { transaction });
    await membership.destroy({ transaction });
    await models.Session.destroy({ where: { userId, firmId: auth.firmId }, transaction });
    await models.NotificationPreference.destroy({ where: { userId, firmId: auth.firmId }, transaction });
    return { role, email: user?.getDataValue('email') ?? userId, name: user?.getDataValue('name') ?? '' };
  });
  await recordAudit(ctx, {
    firmId: auth.firmId,
    userId: auth.userId,
    action: AUDIT_ACTIONS.memberRemoved,
    target: removed.email,
    detail: { role: removed.role, name: removed.name, memberId: userId },
  });
}
