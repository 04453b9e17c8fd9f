import { DataTypes, type Sequelize } from 'sequelize';
import { definePlanElementModel, type PlanElementBase } from './plan-element.base';

export interface PointLoadAttributes extends PlanElementBase {
  levelId: string;
  xFt: number;
  yFt: number;
  dKip: number;
  lKip: number;
  /** NULL: not given in the file. */
  lrKip: number | null;
  sKip: number | null;
}

export function definePointLoadModel(sequelize: Sequelize) {
  return definePlanElementModel<PointLoadAttributes>(sequelize, 'PointLoad', 'plan_point_loads', {
    levelId: { type: DataTypes.STRING(255), allowNull: false },
    xFt: { type: DataTypes.DOUBLE, allowNull: false },
    yFt: { type: DataTypes.DOUBLE, allowNull: false },
    dKip: { type: DataTypes.DOUBLE, allowNull: false },
    lKip: { type: DataTypes.DOUBLE, allowNull: false },
    lrKip: { type: DataTypes.DOUBLE, allowNull: true },
    sKip: { type: DataTypes.DOUBLE, allowNull: true },
  });
}
