import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

export type PasswordResetStatus = 'pending' | 'used' | 'superseded';

export interface PasswordResetAttributes {
  id: string;
  userId: string;
  /** SHA-256 of the token, hex. */
  tokenHash: string;
  status: PasswordResetStatus;
  expiresAt: Date;
  usedAt: Date | null;
  createdAt: Date;
}
export type PasswordResetCreation = Optional<PasswordResetAttributes, 'id' | 'usedAt' | 'createdAt'>;
export type PasswordResetModel = ModelStatic<Model<PasswordResetAttributes, PasswordResetCreation>>;

export function definePasswordResetModel(sequelize: Sequelize): PasswordResetModel {
  return sequelize.define<Model<PasswordResetAttributes, PasswordResetCreation>>(
    'PasswordReset',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      userId: { type: DataTypes.UUID, allowNull: false },
      tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
      status: { type: DataTypes.STRING(20), allowNull: false },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      usedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: { type: DataTypes.DATE, allowNull: false },
    },
    { tableName: 'password_resets', underscored: true, updatedAt: false },
  );
}
