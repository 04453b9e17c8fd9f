import { UniqueConstraintError } from 'sequelize';
import type { AppContext } from '../app-context';
import { hashPassword } from '../auth/password';
import { AppError } from '../errors/app-error';
import type { SignUpInput } from '../schemas/session.schema';
import { buildSessionView, countAttemptFromIp, openSession, type SessionView } from './session.service';

function emailTaken(): AppError {
  return AppError.conflict('email_taken', 'An account with this email already exists.', {
    email: 'This email is already registered',
  });
}

/** Sign-up: a new firm with its creator as owner, signed in. */
export async function signUpFirm(
  ctx: AppContext,
  input: SignUpInput & { ip: string },
): Promise<{ sessionId: string; view: SessionView }> {
  countAttemptFromIp(ctx, input.ip);
  const { sequelize, models } = ctx.db;
  if (await models.User.findOne({ where: { email: input.email } })) throw emailTaken();
  const passwordHash = await hashPassword(input.password);
  let who: { userId: string; firmId: string };
  try {
    who = await sequelize.transaction(async (transaction) => {
      const firm = await models.Firm.create({ name: input.firmName }, { transaction });
      const user = await models.User.create(
        { email: input.email, name: input.name, passwordHash },
        { transaction },
      );
      await models.Membership.create(
        { firmId: firm.getDataValue('id'), userId: user.getDataValue('id'), role: 'owner' },
        { transaction },
      );
      return { userId: user.getDataValue('id'), firmId: firm.getDataValue('id') };
    });
  } catch (err) {
    if (err instanceof UniqueConstraintError) throw emailTaken();
    throw err;
  }
  const sessionId = await openSession(ctx, who);
  const view = await buildSessionView(ctx, who);
  if (!view) throw new Error('session view missing right after sign-up');
  return { sessionId, view };
}
