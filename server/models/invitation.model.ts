import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';
import { emailAttribute } from './email-attribute';
import type { Role } from '../auth/policy';

export const INVITATION_STATUSES = ['pending', 'accepted', 'revoked', 'replaced'] as const;
export type InvitationStatus = (typeof INVITATION_STATUSES)[number];

export interface InvitationAttributes {
  id: string;
  firmId: string;
  /** Stored trimmed and lower-cased. */
  email: string;
  role: Role;
  /** SHA-256 of the token, hex; the token itself is only ever in the e-mail. */
  tokenHash: string;
  status: InvitationStatus;
  invitedBy: string | null;
  expiresAt: Date;
  acceptedAt: Date | null;
  acceptedUserId: string | null;
  revokedAt: Date | null;
  createdAt: Date;
  updatedAt: Date;
}
export type InvitationCreation = Optional<
  InvitationAttributes,
  'id' | 'acceptedAt' | 'acceptedUserId' | 'revokedAt' | 'createdAt' | 'updatedAt'
>;
export type InvitationModel = ModelStatic<Model<InvitationAttributes, InvitationCreation>>;

export function defineInvitationModel(sequelize: Sequelize): InvitationModel {
  return sequelize.define<Model<InvitationAttributes, InvitationCreation>>(
    'Invitation',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      firmId: { type: DataTypes.UUID, allowNull: false },
      email: emailAttribute(),
      role: { type: DataTypes.STRING(20), allowNull: false },
      tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
      status: { type: DataTypes.STRING(20), allowNull: false },
      invitedBy: { type: DataTypes.UUID, allowNull: true },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      acceptedAt: { type: DataTypes.DATE, allowNull: true },
      acceptedUserId: { type: DataTypes.UUID, allowNull: true },
      revokedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: { type: DataTypes.DATE, allowNull: false },
      updatedAt: { type: DataTypes.DATE, allowNull: false },
    },
    { tableName: 'invitations', underscored: true },
  );
}
