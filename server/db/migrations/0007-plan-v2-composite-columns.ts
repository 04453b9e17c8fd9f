import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

// Plan file version 2 (composite beams and column sizes): the element tables gain the new
// fields so a scheme round-trips through the database. designBasis.composite lives inside
// the scheme's design_basis JSON and needs no column. NULL means absent unless the field is
// listed in the row's null_fields (members already have that column; columns get one).
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('plan_decks', 'slab', { type: DataTypes.JSON, allowNull: true });
  await qi.addColumn('plan_members', 'composite', { type: DataTypes.BOOLEAN, allowNull: true });
  await qi.addColumn('plan_members', 'studs', { type: DataTypes.INTEGER, allowNull: true });
  await qi.addColumn('plan_columns', 'shape', { type: DataTypes.STRING(40), allowNull: true });
  await qi.addColumn('plan_columns', 'splice_levels', { type: DataTypes.JSON, allowNull: true });
  await qi.addColumn('plan_columns', 'null_fields', { type: DataTypes.STRING(200), allowNull: true });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn('plan_columns', 'null_fields');
  await qi.removeColumn('plan_columns', 'splice_levels');
  await qi.removeColumn('plan_columns', 'shape');
  await qi.removeColumn('plan_members', 'studs');
  await qi.removeColumn('plan_members', 'composite');
  await qi.removeColumn('plan_decks', 'slab');
};
