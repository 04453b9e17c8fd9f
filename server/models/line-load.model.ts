import { DataTypes, type Sequelize } from 'sequelize';
import { definePlanElementModel, type PlanElementBase } from './plan-element.base';

export interface LineLoadAttributes extends PlanElementBase {
  levelId: string;
  startXFt: number;
  startYFt: number;
  endXFt: number;
  endYFt: number;
  dKlf: number;
  lKlf: number;
  /** NULL: not given in the file. */
  lrKlf: number | null;
  sKlf: number | null;
}

export function defineLineLoadModel(sequelize: Sequelize) {
  return definePlanElementModel<LineLoadAttributes>(sequelize, 'LineLoad', 'plan_line_loads', {
    levelId: { type: DataTypes.STRING(255), allowNull: false },
    startXFt: { type: DataTypes.DOUBLE, allowNull: false },
    startYFt: { type: DataTypes.DOUBLE, allowNull: false },
    endXFt: { type: DataTypes.DOUBLE, allowNull: false },
    endYFt: { type: DataTypes.DOUBLE, allowNull: false },
    dKlf: { type: DataTypes.DOUBLE, allowNull: false },
    lKlf: { type: DataTypes.DOUBLE, allowNull: false },
    lrKlf: { type: DataTypes.DOUBLE, allowNull: true },
    sKlf: { type: DataTypes.DOUBLE, allowNull: true },
  });
}
