import { DataTypes, type Sequelize } from 'sequelize';
import { definePlanElementModel, type PlanElementBase } from './plan-element.base';

export interface GridLineAttributes extends PlanElementBase {
  /** 'x': a line of constant x (offsetFt is its x); 'y': constant y. */
  axis: 'x' | 'y';
  label: string;
  offsetFt: number;
}

export function defineGridLineModel(sequelize: Sequelize) {
  return definePlanElementModel<GridLineAttributes>(sequelize, 'GridLine', 'plan_grid_lines', {
    axis: { type: DataTypes.STRING(1), allowNull: false },
    label: { type: DataTypes.STRING(50), allowNull: false },
    offsetFt: { type: DataTypes.DOUBLE, allowNull: false },
  });
}
