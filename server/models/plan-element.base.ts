import { DataTypes, type Model, type ModelAttributes, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

// Shared columns of the plan element tables (0003-schemes-plans): a surrogate id, the
// scheme, the element's id inside the plan (unique per scheme) and its position in the file.
export interface PlanElementBase {
  id: string;
  schemeId: string;
  elementId: string;
  position: number;
}

export type PlanElementModel<A extends PlanElementBase> = ModelStatic<Model<A, Optional<A, 'id'>>>;

export function definePlanElementModel<A extends PlanElementBase>(
  sequelize: Sequelize,
  modelName: string,
  tableName: string,
  attributes: Omit<ModelAttributes<Model<A, Optional<A, 'id'>>, A>, keyof PlanElementBase>,
): PlanElementModel<A> {
  return sequelize.define<Model<A, Optional<A, 'id'>>>(
    modelName,
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      schemeId: { type: DataTypes.UUID, allowNull: false },
      elementId: { type: DataTypes.STRING(255), allowNull: false },
      position: { type: DataTypes.INTEGER, allowNull: false },
      ...attributes,
    } as ModelAttributes<Model<A, Optional<A, 'id'>>, A>,
    { tableName, underscored: true, timestamps: false },
  );
}
