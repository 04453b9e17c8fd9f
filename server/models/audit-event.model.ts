import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

export interface AuditEventAttributes {
  id: string;
  firmId: string;
  userId: string | null;
  /** Name and e-mail of the actor when recorded, so the log reads the same later. */
  actorLabel: string | null;
  action: string;
  target: string | null;
  /** JSON text. */
  detail: string | null;
  createdAt: Date;
}
export type AuditEventCreation = Optional<
  AuditEventAttributes,
  'id' | 'userId' | 'actorLabel' | 'target' | 'detail' | 'createdAt'
>;
export type AuditEventModel = ModelStatic<Model<AuditEventAttributes, AuditEventCreation>>;

export function defineAuditEventModel(sequelize: Sequelize): AuditEventModel {
  return sequelize.define<Model<AuditEventAttributes, AuditEventCreation>>(
    'AuditEvent',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      firmId: { type: DataTypes.UUID, allowNull: false },
      userId: { type: DataTypes.UUID, allowNull: true },
      actorLabel: { type: DataTypes.STRING(320), allowNull: true },
      action: { type: DataTypes.STRING(80), allowNull: false },
      target: { type: DataTypes.STRING(300), allowNull: true },
      detail: { type: DataTypes.TEXT, allowNull: true },
      createdAt: { type: DataTypes.DATE, allowNull: false },
    },
    { tableName: 'audit_events', underscored: true, updatedAt: false },
  );
}
