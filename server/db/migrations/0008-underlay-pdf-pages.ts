import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

// PDF underlays (issue 14): a PDF is stored once as uploaded, with the page shown under the
// level and the document's page count; any underlay can be locked against moving.
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('underlays', 'page_number', { type: DataTypes.INTEGER, allowNull: true });
  await qi.addColumn('underlays', 'page_count', { type: DataTypes.INTEGER, allowNull: true });
  await qi.addColumn('underlays', 'locked', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn('underlays', 'locked');
  await qi.removeColumn('underlays', 'page_count');
  await qi.removeColumn('underlays', 'page_number');
};
