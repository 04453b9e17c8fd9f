import type { Adapter, DatabaseSession, DatabaseUser } from 'lucia';
import { Op } from 'sequelize';
import type { Models } from '../models/models';

// Lucia v3 adapter over our Sequelize models (lucia ships none for Sequelize).
export class SequelizeSessionAdapter implements Adapter {
  constructor(private readonly models: Pick<Models, 'Session' | 'User'>) {}

  async getSessionAndUser(
    sessionId: string,
  ): Promise<[session: DatabaseSession | null, user: DatabaseUser | null]> {
    const row = await this.models.Session.findByPk(sessionId);
    if (!row) return [null, null];
    const session = row.get({ plain: true });
    const userRow = await this.models.User.findByPk(session.userId);
    if (!userRow) return [null, null];
    const user = userRow.get({ plain: true });
    return [
      {
        id: session.id,
        userId: session.userId,
        expiresAt: new Date(session.expiresAt),
        attributes: { firmId: session.firmId },
      },
      { id: user.id, attributes: { email: user.email, name: user.name } },
    ];
  }

  async getUserSessions(userId: string): Promise<DatabaseSession[]> {
    const rows = await this.models.Session.findAll({ where: { userId } });
    return rows.map((r) => {
      const s = r.get({ plain: true });
      return {
        id: s.id,
        userId: s.userId,
        expiresAt: new Date(s.expiresAt),
        attributes: { firmId: s.firmId },
      };
    });
  }

  async setSession(session: DatabaseSession): Promise<void> {
    await this.models.Session.create({
      id: session.id,
      userId: session.userId,
      firmId: session.attributes.firmId,
      expiresAt: session.expiresAt,
    });
  }

  async updateSessionExpiration(sessionId: string, expiresAt: Date): Promise<void> {
    await this.models.Session.update({ expiresAt }, { where: { id: sessionId } });
  }

  async deleteSession(sessionId: string): Promise<void> {
    await this.models.Session.destroy({ where: { id: sessionId } });
  }

  async deleteUserSessions(userId: string): Promise<void> {
    await this.models.Session.destroy({ where: { userId } });
  }

  async deleteExpiredSessions(): Promise<void> {
    await this.models.Session.destroy({ where: { expiresAt: { [Op.lte]: new Date() } } });
  }
}
