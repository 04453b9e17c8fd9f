import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

export interface FirmAttributes {
  id: string;
  name: string;
  createdAt: Date;
  updatedAt: Date;
}
export type FirmCreation = Optional<FirmAttributes, 'id' | 'createdAt' | 'updatedAt'>;
export type FirmModel = ModelStatic<Model<FirmAttributes, FirmCreation>>;

export function defineFirmModel(sequelize: Sequelize): FirmModel {
  return sequelize.define<Model<FirmAttributes, FirmCreation>>(
    'Firm',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      name: { type: DataTypes.STRING(200), allowNull: false },
      createdAt: { type: DataTypes.DATE, allowNull: false },
      updatedAt: { type: DataTypes.DATE, allowNull: false },
    },
    { tableName: 'firms', underscored: true },
  );
}
