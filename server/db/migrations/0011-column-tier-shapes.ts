import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

// Locked tier sizes of a column (plan file columns[].tierShapes, issue 12): a JSON list of
// { level, shape }. NULL means absent.
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('plan_columns', 'tier_shapes', { type: DataTypes.JSON, allowNull: true });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn('plan_columns', 'tier_shapes');
};
