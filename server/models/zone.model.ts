import { DataTypes, type Sequelize } from 'sequelize';
import { definePlanElementModel, type PlanElementBase } from './plan-element.base';

/** A load zone: the area load set a deck area carries. */
export interface ZoneAttributes extends PlanElementBase {
  name: string;
  deadPsf: number;
  superimposedDeadPsf: number;
  partitionPsf: number;
  livePsf: number;
  liveReducible: boolean;
  roofLivePsf: number;
  snowPsf: number;
}

export function defineZoneModel(sequelize: Sequelize) {
  return definePlanElementModel<ZoneAttributes>(sequelize, 'Zone', 'plan_zones', {
    name: { type: DataTypes.STRING(200), allowNull: false },
    deadPsf: { type: DataTypes.DOUBLE, allowNull: false },
    superimposedDeadPsf: { type: DataTypes.DOUBLE, allowNull: false },
    partitionPsf: { type: DataTypes.DOUBLE, allowNull: false },
    livePsf: { type: DataTypes.DOUBLE, allowNull: false },
    liveReducible: { type: DataTypes.BOOLEAN, allowNull: false },
    roofLivePsf: { type: DataTypes.DOUBLE, allowNull: false },
    snowPsf: { type: DataTypes.DOUBLE, allowNull: false },
  });
}
