import { DataTypes, type Sequelize } from 'sequelize';
import { definePlanElementModel, type PlanElementBase } from './plan-element.base';

export interface ColumnAttributes extends PlanElementBase {
  xFt: number;
  yFt: number;
  /** Level ids at which the column supports framing (it runs through all of them). */
  levels: string[];
  /** Plan version 2: a locked column size. */
  shape: string | null;
  /** Plan version 2: level ids where a new tier starts. */
  spliceLevels: string[] | null;
  /** Locked tier sizes (columns[].tierShapes), null when absent. */
  tierShapes: { level: string; shape: string }[] | null;
  /** Comma list of optional fields the file gave as an explicit null. */
  nullFields: string | null;
}

export function defineColumnModel(sequelize: Sequelize) {
  return definePlanElementModel<ColumnAttributes>(sequelize, 'Column', 'plan_columns', {
    xFt: { type: DataTypes.DOUBLE, allowNull: false },
    yFt: { type: DataTypes.DOUBLE, allowNull: false },
    levels: { type: DataTypes.JSON, allowNull: false },
    shape: { type: DataTypes.STRING(40), allowNull: true },
    spliceLevels: { type: DataTypes.JSON, allowNull: true },
    tierShapes: { type: DataTypes.JSON, allowNull: true },
    nullFields: { type: DataTypes.STRING(200), allowNull: true },
  });
}
