import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

// A message kept by the local outbox transport (no SMTP server configured).
export interface OutboxMessageAttributes {
  id: string;
  firmId: string | null;
  fromAddress: string;
  toAddress: string;
  subject: string;
  textBody: string;
  htmlBody: string | null;
  sentAt: Date;
}
export type OutboxMessageCreation = Optional<OutboxMessageAttributes, 'id' | 'htmlBody'>;
export type OutboxMessageModel = ModelStatic<Model<OutboxMessageAttributes, OutboxMessageCreation>>;

export function defineOutboxMessageModel(sequelize: Sequelize): OutboxMessageModel {
  return sequelize.define<Model<OutboxMessageAttributes, OutboxMessageCreation>>(
    'OutboxMessage',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      firmId: { type: DataTypes.UUID, allowNull: true },
      fromAddress: { type: DataTypes.STRING(320), allowNull: false },
      toAddress: { type: DataTypes.STRING(320), allowNull: false },
      subject: { type: DataTypes.STRING(300), allowNull: false },
      textBody: { type: DataTypes.TEXT, allowNull: false },
      htmlBody: { type: DataTypes.TEXT, allowNull: true },
      sentAt: { type: DataTypes.DATE, allowNull: false },
    },
    { tableName: 'outbox_messages', underscored: true, timestamps: false },
  );
}
