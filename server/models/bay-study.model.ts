import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

/** A bay study of a scheme, against the plan revision it was computed from. */
export interface BayStudyAttributes {
  id: string;
  schemeId: string;
  revision: number;
  /** The checked request (StudySpec: region, ranges, unit prices used). */
  request: Record<string, unknown>;
  /** The `calc study` output (calc-interface.md) as JSON. */
  result: Record<string, unknown>;
  optionCount: number;
  userId: string | null;
  createdAt: Date;
}
export type BayStudyCreation = Optional<BayStudyAttributes, 'id' | 'createdAt'>;
export type BayStudyModel = ModelStatic<Model<BayStudyAttributes, BayStudyCreation>>;

export function defineBayStudyModel(sequelize: Sequelize): BayStudyModel {
  return sequelize.define<Model<BayStudyAttributes, BayStudyCreation>>(
    'BayStudy',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      schemeId: { type: DataTypes.UUID, allowNull: false },
      revision: { type: DataTypes.INTEGER, allowNull: false },
      request: { type: DataTypes.JSON, allowNull: false },
      result: { type: DataTypes.JSON, allowNull: false },
      optionCount: { type: DataTypes.INTEGER, allowNull: false },
      userId: { type: DataTypes.UUID, allowNull: true },
      createdAt: { type: DataTypes.DATE, allowNull: false },
    },
    { tableName: 'bay_studies', underscored: true, updatedAt: false },
  );
}
