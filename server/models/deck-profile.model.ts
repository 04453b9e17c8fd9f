import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';
import type { DeckSlab } from '../../shared/schemas/deck-profile.schema';

/** One of the firm's own slab build-ups on deck (0010), picked from when editing a deck. */
export interface DeckProfileAttributes {
  id: string;
  firmId: string;
  name: string;
  slab: DeckSlab;
  userId: string | null;
  createdAt: Date;
  updatedAt: Date;
}
export type DeckProfileCreation = Optional<DeckProfileAttributes, 'id' | 'createdAt' | 'updatedAt'>;
export type DeckProfileModel = ModelStatic<Model<DeckProfileAttributes, DeckProfileCreation>>;

export function defineDeckProfileModel(sequelize: Sequelize): DeckProfileModel {
  return sequelize.define<Model<DeckProfileAttributes, DeckProfileCreation>>(
    'DeckProfile',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      firmId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false },
      slab: { type: DataTypes.JSON, allowNull: false },
      userId: { type: DataTypes.UUID, allowNull: true },
      createdAt: { type: DataTypes.DATE, allowNull: false },
      updatedAt: { type: DataTypes.DATE, allowNull: false },
    },
    { tableName: 'deck_profiles', underscored: true },
  );
}
