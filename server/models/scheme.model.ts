import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';
import type { PlanDesignBasis } from '../../shared/schemas/plan.schema';

export const SCHEME_STATUSES = ['draft', 'in_review', 'chosen'] as const;
export type SchemeStatus = (typeof SCHEME_STATUSES)[number];

export interface SchemeAttributes {
  id: string;
  projectId: string;
  name: string;
  status: SchemeStatus;
  archived: boolean;
  designBasis: PlanDesignBasis;
  /** Whether the plan file carries grids[] (absent and empty are kept apart). */
  hasGrids: boolean;
  /** Bumped by every saved change of the plan; equals the latest plan_revisions row. */
  revision: number;
  createdBy: string | null;
  updatedBy: string | null;
  createdAt: Date;
  updatedAt: Date;
}
export type SchemeCreation = Optional<
  SchemeAttributes,
  'id' | 'status' | 'archived' | 'hasGrids' | 'revision' | 'createdAt' | 'updatedAt'
>;
export type SchemeModel = ModelStatic<Model<SchemeAttributes, SchemeCreation>>;

export function defineSchemeModel(sequelize: Sequelize): SchemeModel {
  return sequelize.define<Model<SchemeAttributes, SchemeCreation>>(
    'Scheme',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      projectId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.STRING(200), allowNull: false },
      status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'draft' },
      archived: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      designBasis: { type: DataTypes.JSON, allowNull: false },
      hasGrids: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      createdBy: { type: DataTypes.UUID, allowNull: true },
      updatedBy: { type: DataTypes.UUID, allowNull: true },
      createdAt: { type: DataTypes.DATE, allowNull: false },
      updatedAt: { type: DataTypes.DATE, allowNull: false },
    },
    { tableName: 'schemes', underscored: true },
  );
}
