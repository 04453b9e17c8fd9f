import { DataTypes, type Sequelize } from 'sequelize';
import { definePlanElementModel, type PlanElementBase } from './plan-element.base';

export interface ColumnAttributes extends PlanElementBase {
  xFt: number;
  yFt: number;
  /** Level ids at which the column supports framing (it runs through all of them). */
  levels: string[];
}

export function defineColumnModel(sequelize: Sequelize) {
  return definePlanElementModel<ColumnAttributes>(sequelize, 'Column', 'plan_columns', {
    xFt: { type: DataTypes.DOUBLE, allowNull: false },
    yFt: { type: DataTypes.DOUBLE, allowNull: false },
    levels: { type: DataTypes.JSON, allowNull: false },
  });
}
