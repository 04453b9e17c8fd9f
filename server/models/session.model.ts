import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

// Lucia session row. firmId is the firm the session acts for.
export interface SessionAttributes {
  id: string;
  userId: string;
  firmId: string;
  expiresAt: Date;
  createdAt: Date;
}
export type SessionCreation = Optional<SessionAttributes, 'createdAt'>;
export type SessionModel = ModelStatic<Model<SessionAttributes, SessionCreation>>;

export function defineSessionModel(sequelize: Sequelize): SessionModel {
  return sequelize.define<Model<SessionAttributes, SessionCreation>>(
    'Session',
    {
      id: { type: DataTypes.STRING(255), primaryKey: true },
      userId: { type: DataTypes.UUID, allowNull: false },
      firmId: { type: DataTypes.UUID, allowNull: false },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      createdAt: { type: DataTypes.DATE, allowNull: false },
    },
    { tableName: 'sessions', underscored: true, updatedAt: false },
  );
}
