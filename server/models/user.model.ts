import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';
import { emailAttribute } from './email-attribute';

export interface UserAttributes {
  id: string;
  /** Stored trimmed and lower-cased; unique. */
  email: string;
  name: string;
  passwordHash: string;
  createdAt: Date;
  updatedAt: Date;
}
export type UserCreation = Optional<UserAttributes, 'id' | 'createdAt' | 'updatedAt'>;
export type UserModel = ModelStatic<Model<UserAttributes, UserCreation>>;

export function defineUserModel(sequelize: Sequelize): UserModel {
  return sequelize.define<Model<UserAttributes, UserCreation>>(
    'User',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      email: emailAttribute({ unique: true }),
      name: { type: DataTypes.STRING(200), allowNull: false },
      passwordHash: { type: DataTypes.STRING(255), allowNull: false },
      createdAt: { type: DataTypes.DATE, allowNull: false },
      updatedAt: { type: DataTypes.DATE, allowNull: false },
    },
    { tableName: 'users', underscored: true },
  );
}
