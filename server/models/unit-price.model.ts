import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

/**
 * One setting of the firm's unit prices. Rows are only ever added: the latest row is the
 * current price and every earlier row is its history (who set what, when).
 */
export interface UnitPriceAttributes {
  id: string;
  firmId: string;
  steelUsdPerTon: number;
  connectionUsdEach: number;
  /** US$ per shear stud, installed; null = not priced (0010). */
  studUsdEach: number | null;
  /** US$ per cambered piece; null = not priced (0010). */
  camberUsdEach: number | null;
  /** The demo's invented example prices, until someone sets real ones. */
  example: boolean;
  note: string | null;
  userId: string | null;
  createdAt: Date;
}
export type UnitPriceCreation = Optional<UnitPriceAttributes, 'id' | 'example' | 'note' | 'createdAt' | 'studUsdEach' | 'camberUsdEach'>;
export type UnitPriceModel = ModelStatic<Model<UnitPriceAttributes, UnitPriceCreation>>;

export function defineUnitPriceModel(sequelize: Sequelize): UnitPriceModel {
  return sequelize.define<Model<UnitPriceAttributes, UnitPriceCreation>>(
    'UnitPrice',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      firmId: { type: DataTypes.UUID, allowNull: false },
      steelUsdPerTon: { type: DataTypes.DOUBLE, allowNull: false, field: 'steel_usd_per_ton' },
      connectionUsdEach: { type: DataTypes.DOUBLE, allowNull: false, field: 'connection_usd_each' },
      studUsdEach: { type: DataTypes.DOUBLE, allowNull: true, field: 'stud_usd_each' },
      camberUsdEach: { type: DataTypes.DOUBLE, allowNull: true, field: 'camber_usd_each' },
      example: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      note: { type: DataTypes.STRING(500), allowNull: true },
      userId: { type: DataTypes.UUID, allowNull: true },
      createdAt: { type: DataTypes.DATE, allowNull: false },
    },
    { tableName: 'unit_prices', underscored: true, updatedAt: false },
  );
}
