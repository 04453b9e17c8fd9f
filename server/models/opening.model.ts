import { DataTypes, type Sequelize } from 'sequelize';
import type { PlanPolygon } from '../../shared/schemas/plan.schema';
import { definePlanElementModel, type PlanElementBase } from './plan-element.base';

export interface OpeningAttributes extends PlanElementBase {
  levelId: string;
  polygon: PlanPolygon;
}

export function defineOpeningModel(sequelize: Sequelize) {
  return definePlanElementModel<OpeningAttributes>(sequelize, 'Opening', 'plan_openings', {
    levelId: { type: DataTypes.STRING(255), allowNull: false },
    polygon: { type: DataTypes.JSON, allowNull: false },
  });
}
