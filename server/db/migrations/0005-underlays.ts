import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

// Underlays: an architectural plan image (PNG or JPEG) placed under one level of a scheme.
// The bytes live on disk under UPLOAD_DIR (storage_key is the file name there); this row
// holds what the server read from the image's own header and where the image sits on the
// plan. Placement: origin_x_ft/origin_y_ft are the plan coordinates of the image's top-left
// pixel, scale_ft_per_px its size, rotation_deg counter-clockwise on the plan about that corner.
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('underlays', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    scheme_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'schemes', key: 'id' },
      onDelete: 'CASCADE',
    },
    // The plan level's id inside the scheme's plan (plan_levels.element_id), e.g. "L2".
    level_id: { type: DataTypes.STRING(255), allowNull: false },
    filename: { type: DataTypes.STRING(255), allowNull: false },
    mime: { type: DataTypes.STRING(50), allowNull: false },
    bytes: { type: DataTypes.INTEGER, allowNull: false },
    width_px: { type: DataTypes.INTEGER, allowNull: false },
    height_px: { type: DataTypes.INTEGER, allowNull: false },
    storage_key: { type: DataTypes.STRING(100), allowNull: false, unique: true },
    origin_x_ft: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    origin_y_ft: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    scale_ft_per_px: { type: DataTypes.DOUBLE, allowNull: false },
    rotation_deg: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    opacity: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0.5 },
    visible: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    created_by: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
    },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('underlays', ['scheme_id', 'level_id'], { name: 'underlays_scheme_level' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('underlays');
};
