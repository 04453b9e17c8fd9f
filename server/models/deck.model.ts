import { DataTypes, type Sequelize } from 'sequelize';
import type { PlanPolygon, PlanSlab } from '../../shared/schemas/plan.schema';
import { definePlanElementModel, type PlanElementBase } from './plan-element.base';

export interface DeckAttributes extends PlanElementBase {
  levelId: string;
  polygon: PlanPolygon;
  spanDirection: 'x' | 'y';
  zoneId: string;
  /** Plan version 2: the slab build-up, or NULL when absent. */
  slab: PlanSlab | null;
}

export function defineDeckModel(sequelize: Sequelize) {
  return definePlanElementModel<DeckAttributes>(sequelize, 'Deck', 'plan_decks', {
    levelId: { type: DataTypes.STRING(255), allowNull: false },
    polygon: { type: DataTypes.JSON, allowNull: false },
    spanDirection: { type: DataTypes.STRING(1), allowNull: false },
    zoneId: { type: DataTypes.STRING(255), allowNull: false },
    slab: { type: DataTypes.JSON, allowNull: true },
  });
}
