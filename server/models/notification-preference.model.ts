import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

// One row per person and firm; no row means every notification is on.
export interface NotificationPreferenceAttributes {
  id: string;
  userId: string;
  firmId: string;
  schemeSubmitted: boolean;
  schemeChosen: boolean;
  createdAt: Date;
  updatedAt: Date;
}
export type NotificationPreferenceCreation = Optional<
  NotificationPreferenceAttributes,
  'id' | 'createdAt' | 'updatedAt'
>;
export type NotificationPreferenceModel = ModelStatic<
  Model<NotificationPreferenceAttributes, NotificationPreferenceCreation>
>;

export function defineNotificationPreferenceModel(sequelize: Sequelize): NotificationPreferenceModel {
  return sequelize.define<Model<NotificationPreferenceAttributes, NotificationPreferenceCreation>>(
    'NotificationPreference',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      userId: { type: DataTypes.UUID, allowNull: false },
      firmId: { type: DataTypes.UUID, allowNull: false },
      schemeSubmitted: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      schemeChosen: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      createdAt: { type: DataTypes.DATE, allowNull: false },
      updatedAt: { type: DataTypes.DATE, allowNull: false },
    },
    { tableName: 'notification_preferences', underscored: true },
  );
}
