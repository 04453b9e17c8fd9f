import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

// Bay studies (issue 15): a study run for a scheme keeps its request (region and ranges), the
// plan revision it was computed from and its options (the `calc study` output).
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('bay_studies', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    scheme_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'schemes', key: 'id' },
      onDelete: 'CASCADE',
    },
    revision: { type: DataTypes.INTEGER, allowNull: false },
    request: { type: DataTypes.JSON, allowNull: false },
    result: { type: DataTypes.JSON, allowNull: false },
    option_count: { type: DataTypes.INTEGER, allowNull: false },
    user_id: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
    },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('bay_studies', ['scheme_id', 'created_at'], { name: 'bay_studies_scheme_created' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('bay_studies');
};
