import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

// Schemes as first-class items (issue 7): a comment thread per scheme, the scheme's own
// activity (status changes; other history is read from revisions, design runs and comments),
// at most one chosen scheme per project (a partial unique index, so two requests racing to
// choose cannot both win), and the firm's unit prices as an append-only history.
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('scheme_comments', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    scheme_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'schemes', key: 'id' },
      onDelete: 'CASCADE',
    },
    user_id: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
    },
    body: { type: DataTypes.TEXT, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('scheme_comments', ['scheme_id', 'created_at'], { name: 'scheme_comments_scheme_created' });

  await qi.createTable('scheme_activity', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    scheme_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'schemes', key: 'id' },
      onDelete: 'CASCADE',
    },
    user_id: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
    },
    // status_changed (from, to in detail); more kinds may be added, none renamed.
    kind: { type: DataTypes.STRING(40), allowNull: false },
    detail: { type: DataTypes.TEXT, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('scheme_activity', ['scheme_id', 'created_at'], { name: 'scheme_activity_scheme_created' });

  await qi.addIndex('schemes', ['project_id'], {
    name: 'schemes_one_chosen_per_project',
    unique: true,
    where: { status: 'chosen' },
  });

  await qi.createTable('unit_prices', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    firm_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'firms', key: 'id' },
      onDelete: 'CASCADE',
    },
    steel_usd_per_ton: { type: DataTypes.DOUBLE, allowNull: false },
    connection_usd_each: { type: DataTypes.DOUBLE, allowNull: false },
    // True for the demo's invented example prices until someone sets real ones.
    example: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    note: { type: DataTypes.STRING(500), allowNull: true },
    user_id: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
    },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('unit_prices', ['firm_id', 'created_at'], { name: 'unit_prices_firm_created' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('unit_prices');
  await qi.removeIndex('schemes', 'schemes_one_chosen_per_project');
  await qi.dropTable('scheme_activity');
  await qi.dropTable('scheme_comments');
};
