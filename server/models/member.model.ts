import { DataTypes, type Sequelize } from 'sequelize';
import type { PlanBracing, PlanMemberDeflectionLimits } from '../../shared/schemas/plan.schema';
import { definePlanElementModel, type PlanElementBase } from './plan-element.base';

export interface MemberAttributes extends PlanElementBase {
  levelId: string;
  kind: 'girder' | 'beam';
  startXFt: number;
  startYFt: number;
  endXFt: number;
  endYFt: number;
  /** Locked shape, or NULL for "engine selects". */
  shape: string | null;
  maxDepthIn: number | null;
  minDepthIn: number | null;
  allowedNominalDepths: number[] | null;
  lbOverrideFt: number | null;
  bracing: PlanBracing | null;
  mark: string | null;
  markLocked: boolean | null;
  /** Plan version 2: composite on/off (NULL with 'composite' in nullFields = follow the design basis). */
  composite: boolean | null;
  /** Plan version 2: a stud count to check. */
  studs: number | null;
  /** Per-member deflection limits (migration 0012); NULL with 'deflectionLimits' in nullFields = explicit null. */
  deflectionLimits: PlanMemberDeflectionLimits | null;
  /** Comma list of optional fields the file gave as an explicit null (NULL alone means absent). */
  nullFields: string | null;
}

export function defineMemberModel(sequelize: Sequelize) {
  return definePlanElementModel<MemberAttributes>(sequelize, 'Member', 'plan_members', {
    levelId: { type: DataTypes.STRING(255), allowNull: false },
    kind: { type: DataTypes.STRING(10), allowNull: false },
    startXFt: { type: DataTypes.DOUBLE, allowNull: false },
    startYFt: { type: DataTypes.DOUBLE, allowNull: false },
    endXFt: { type: DataTypes.DOUBLE, allowNull: false },
    endYFt: { type: DataTypes.DOUBLE, allowNull: false },
    shape: { type: DataTypes.STRING(40), allowNull: true },
    maxDepthIn: { type: DataTypes.DOUBLE, allowNull: true },
    minDepthIn: { type: DataTypes.DOUBLE, allowNull: true },
    allowedNominalDepths: { type: DataTypes.JSON, allowNull: true },
    lbOverrideFt: { type: DataTypes.DOUBLE, allowNull: true },
    bracing: { type: DataTypes.JSON, allowNull: true },
    mark: { type: DataTypes.STRING(40), allowNull: true },
    markLocked: { type: DataTypes.BOOLEAN, allowNull: true },
    composite: { type: DataTypes.BOOLEAN, allowNull: true },
    studs: { type: DataTypes.INTEGER, allowNull: true },
    deflectionLimits: { type: DataTypes.JSON, allowNull: true },
    nullFields: { type: DataTypes.STRING(200), allowNull: true },
  });
}
