import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';
import type { Role } from '../auth/policy';

export interface MembershipAttributes {
  id: string;
  firmId: string;
  userId: string;
  role: Role;
  createdAt: Date;
  updatedAt: Date;
}
export type MembershipCreation = Optional<MembershipAttributes, 'id' | 'createdAt' | 'updatedAt'>;
export type MembershipModel = ModelStatic<Model<MembershipAttributes, MembershipCreation>>;

export function defineMembershipModel(sequelize: Sequelize): MembershipModel {
  return sequelize.define<Model<MembershipAttributes, MembershipCreation>>(
    'Membership',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      firmId: { type: DataTypes.UUID, allowNull: false },
      userId: { type: DataTypes.UUID, allowNull: false },
      role: { type: DataTypes.STRING(20), allowNull: false },
      createdAt: { type: DataTypes.DATE, allowNull: false },
      updatedAt: { type: DataTypes.DATE, allowNull: false },
    },
    { tableName: 'memberships', underscored: true },
  );
}
