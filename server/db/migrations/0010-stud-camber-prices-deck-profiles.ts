import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

// Composite beams (issue 11): the firm's unit prices gain a price per shear stud and per
// cambered piece (null = not priced, as every earlier row stays), and the firm keeps a small
// library of slab build-ups on deck (Baywright's own profile names) that decks are set from.
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('unit_prices', 'stud_usd_each', { type: DataTypes.DOUBLE, allowNull: true });
  await qi.addColumn('unit_prices', 'camber_usd_each', { type: DataTypes.DOUBLE, allowNull: true });

  await qi.createTable('deck_profiles', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    firm_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'firms', key: 'id' },
      onDelete: 'CASCADE',
    },
    name: { type: DataTypes.STRING(120), allowNull: false },
    // The slab build-up (plan file decks[].slab without its profile name), as JSON.
    slab: { type: DataTypes.JSON, allowNull: false },
    user_id: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
    },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('deck_profiles', ['firm_id', 'name'], { name: 'deck_profiles_firm_name', unique: true });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('deck_profiles');
  await qi.removeColumn('unit_prices', 'camber_usd_each');
  await qi.removeColumn('unit_prices', 'stud_usd_each');
};
