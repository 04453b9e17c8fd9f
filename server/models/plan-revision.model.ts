import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';
import type { PlanFileInput } from '../../shared/schemas/plan.schema';

/** One saved state of a scheme's plan: the full plan file, who saved it and when. */
export interface PlanRevisionAttributes {
  id: string;
  schemeId: string;
  revision: number;
  plan: PlanFileInput;
  note: string | null;
  userId: string | null;
  createdAt: Date;
}
export type PlanRevisionCreation = Optional<PlanRevisionAttributes, 'id' | 'note' | 'createdAt'>;
export type PlanRevisionModel = ModelStatic<Model<PlanRevisionAttributes, PlanRevisionCreation>>;

export function definePlanRevisionModel(sequelize: Sequelize): PlanRevisionModel {
  return sequelize.define<Model<PlanRevisionAttributes, PlanRevisionCreation>>(
    'PlanRevision',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      schemeId: { type: DataTypes.UUID, allowNull: false },
      revision: { type: DataTypes.INTEGER, allowNull: false },
      plan: { type: DataTypes.JSON, allowNull: false },
      note: { type: DataTypes.STRING(500), allowNull: true },
      userId: { type: DataTypes.UUID, allowNull: true },
      createdAt: { type: DataTypes.DATE, allowNull: false },
    },
    { tableName: 'plan_revisions', underscored: true, updatedAt: false },
  );
}
