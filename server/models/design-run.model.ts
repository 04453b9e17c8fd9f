import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

/** A design of a scheme, stored against the plan revision it was computed from. */
export interface DesignRunAttributes {
  id: string;
  schemeId: string;
  revision: number;
  /** The `calc plan` output (calc-interface.md) as JSON. */
  result: Record<string, unknown>;
  steelWeightLb: number;
  pieces: number;
  floorAreaFt2: number;
  failingMembers: number;
  problemCount: number;
  userId: string | null;
  createdAt: Date;
}
export type DesignRunCreation = Optional<DesignRunAttributes, 'id' | 'createdAt'>;
export type DesignRunModel = ModelStatic<Model<DesignRunAttributes, DesignRunCreation>>;

export function defineDesignRunModel(sequelize: Sequelize): DesignRunModel {
  return sequelize.define<Model<DesignRunAttributes, DesignRunCreation>>(
    'DesignRun',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      schemeId: { type: DataTypes.UUID, allowNull: false },
      revision: { type: DataTypes.INTEGER, allowNull: false },
      result: { type: DataTypes.JSON, allowNull: false },
      steelWeightLb: { type: DataTypes.DOUBLE, allowNull: false },
      pieces: { type: DataTypes.INTEGER, allowNull: false },
      floorAreaFt2: { type: DataTypes.DOUBLE, allowNull: false },
      failingMembers: { type: DataTypes.INTEGER, allowNull: false },
      problemCount: { type: DataTypes.INTEGER, allowNull: false },
      userId: { type: DataTypes.UUID, allowNull: true },
      createdAt: { type: DataTypes.DATE, allowNull: false },
    },
    { tableName: 'design_runs', underscored: true, updatedAt: false },
  );
}
