import { DataTypes, type Sequelize } from 'sequelize';
import { definePlanElementModel, type PlanElementBase } from './plan-element.base';

export interface LevelAttributes extends PlanElementBase {
  name: string;
  elevationFt: number;
  /** NULL: the file did not say (the plan's roof flag is optional). */
  roof: boolean | null;
}

export function defineLevelModel(sequelize: Sequelize) {
  return definePlanElementModel<LevelAttributes>(sequelize, 'Level', 'plan_levels', {
    name: { type: DataTypes.STRING(200), allowNull: false },
    elevationFt: { type: DataTypes.DOUBLE, allowNull: false },
    roof: { type: DataTypes.BOOLEAN, allowNull: true },
  });
}
