import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

/** One comment in a scheme's thread. Comments are never edited (the thread is a record). */
export interface SchemeCommentAttributes {
  id: string;
  schemeId: string;
  userId: string | null;
  body: string;
  createdAt: Date;
}
export type SchemeCommentCreation = Optional<SchemeCommentAttributes, 'id' | 'createdAt'>;
export type SchemeCommentModel = ModelStatic<Model<SchemeCommentAttributes, SchemeCommentCreation>>;

export function defineSchemeCommentModel(sequelize: Sequelize): SchemeCommentModel {
  return sequelize.define<Model<SchemeCommentAttributes, SchemeCommentCreation>>(
    'SchemeComment',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      schemeId: { type: DataTypes.UUID, allowNull: false },
      userId: { type: DataTypes.UUID, allowNull: true },
      body: { type: DataTypes.TEXT, allowNull: false },
      createdAt: { type: DataTypes.DATE, allowNull: false },
    },
    { tableName: 'scheme_comments', underscored: true, updatedAt: false },
  );
}
