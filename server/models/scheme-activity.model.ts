import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

export const SCHEME_ACTIVITY_KINDS = ['status_changed'] as const;
export type SchemeActivityKind = (typeof SCHEME_ACTIVITY_KINDS)[number];

/** An event of a scheme that no other table records (status changes). */
export interface SchemeActivityAttributes {
  id: string;
  schemeId: string;
  userId: string | null;
  kind: SchemeActivityKind;
  /** JSON text, e.g. {"from":"draft","to":"in_review"}. */
  detail: string | null;
  createdAt: Date;
}
export type SchemeActivityCreation = Optional<SchemeActivityAttributes, 'id' | 'detail' | 'createdAt'>;
export type SchemeActivityModel = ModelStatic<Model<SchemeActivityAttributes, SchemeActivityCreation>>;

export function defineSchemeActivityModel(sequelize: Sequelize): SchemeActivityModel {
  return sequelize.define<Model<SchemeActivityAttributes, SchemeActivityCreation>>(
    'SchemeActivity',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      schemeId: { type: DataTypes.UUID, allowNull: false },
      userId: { type: DataTypes.UUID, allowNull: true },
      kind: { type: DataTypes.STRING(40), allowNull: false },
      detail: { type: DataTypes.TEXT, allowNull: true },
      createdAt: { type: DataTypes.DATE, allowNull: false },
    },
    { tableName: 'scheme_activity', underscored: true, updatedAt: false },
  );
}
