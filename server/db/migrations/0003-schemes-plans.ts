import { DataTypes, type ModelAttributes } from 'sequelize';
import type { Migration } from '../migrator';

// Schemes of a project, the current plan of each scheme in normalized element tables
// (one row per plan element, keyed by scheme + element id), every saved revision as a full
// plan file snapshot, and design runs stored against the revision they were computed from.
// Portable: only queryInterface calls, no dialect-specific SQL.

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};

const userRef = {
  type: DataTypes.UUID,
  allowNull: true,
  references: { model: 'users', key: 'id' },
  onDelete: 'SET NULL',
} as const;

/** Columns every plan element table shares. position keeps the file's order. */
const elementBase = {
  id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
  scheme_id: {
    type: DataTypes.UUID,
    allowNull: false,
    references: { model: 'schemes', key: 'id' },
    onDelete: 'CASCADE',
  },
  element_id: { type: DataTypes.STRING(255), allowNull: false },
  position: { type: DataTypes.INTEGER, allowNull: false },
};

const point = (prefix: string) => ({
  [`${prefix}_x_ft`]: { type: DataTypes.DOUBLE, allowNull: false },
  [`${prefix}_y_ft`]: { type: DataTypes.DOUBLE, allowNull: false },
});

const ELEMENT_TABLES: Record<string, ModelAttributes> = {
  plan_levels: {
    name: { type: DataTypes.STRING(200), allowNull: false },
    elevation_ft: { type: DataTypes.DOUBLE, allowNull: false },
    roof: { type: DataTypes.BOOLEAN, allowNull: true },
  },
  plan_grid_lines: {
    axis: { type: DataTypes.STRING(1), allowNull: false },
    label: { type: DataTypes.STRING(50), allowNull: false },
    offset_ft: { type: DataTypes.DOUBLE, allowNull: false },
  },
  plan_columns: {
    x_ft: { type: DataTypes.DOUBLE, allowNull: false },
    y_ft: { type: DataTypes.DOUBLE, allowNull: false },
    // Level ids the column supports framing at, top to bottom as drawn.
    levels: { type: DataTypes.JSON, allowNull: false },
  },
  plan_members: {
    level_id: { type: DataTypes.STRING(255), allowNull: false },
    kind: { type: DataTypes.STRING(10), allowNull: false },
    ...point('start'),
    ...point('end'),
    shape: { type: DataTypes.STRING(40), allowNull: true },
    max_depth_in: { type: DataTypes.DOUBLE, allowNull: true },
    min_depth_in: { type: DataTypes.DOUBLE, allowNull: true },
    allowed_nominal_depths: { type: DataTypes.JSON, allowNull: true },
    lb_override_ft: { type: DataTypes.DOUBLE, allowNull: true },
    bracing: { type: DataTypes.JSON, allowNull: true },
    mark: { type: DataTypes.STRING(40), allowNull: true },
    mark_locked: { type: DataTypes.BOOLEAN, allowNull: true },
    // Optional fields written as an explicit null (NULL in their column means "absent").
    null_fields: { type: DataTypes.STRING(200), allowNull: true },
  },
  plan_zones: {
    name: { type: DataTypes.STRING(200), allowNull: false },
    dead_psf: { type: DataTypes.DOUBLE, allowNull: false },
    superimposed_dead_psf: { type: DataTypes.DOUBLE, allowNull: false },
    partition_psf: { type: DataTypes.DOUBLE, allowNull: false },
    live_psf: { type: DataTypes.DOUBLE, allowNull: false },
    live_reducible: { type: DataTypes.BOOLEAN, allowNull: false },
    roof_live_psf: { type: DataTypes.DOUBLE, allowNull: false },
    snow_psf: { type: DataTypes.DOUBLE, allowNull: false },
  },
  plan_decks: {
    level_id: { type: DataTypes.STRING(255), allowNull: false },
    polygon: { type: DataTypes.JSON, allowNull: false },
    span_direction: { type: DataTypes.STRING(1), allowNull: false },
    zone_id: { type: DataTypes.STRING(255), allowNull: false },
  },
  plan_point_loads: {
    level_id: { type: DataTypes.STRING(255), allowNull: false },
    x_ft: { type: DataTypes.DOUBLE, allowNull: false },
    y_ft: { type: DataTypes.DOUBLE, allowNull: false },
    d_kip: { type: DataTypes.DOUBLE, allowNull: false },
    l_kip: { type: DataTypes.DOUBLE, allowNull: false },
    lr_kip: { type: DataTypes.DOUBLE, allowNull: true },
    s_kip: { type: DataTypes.DOUBLE, allowNull: true },
  },
  plan_line_loads: {
    level_id: { type: DataTypes.STRING(255), allowNull: false },
    ...point('start'),
    ...point('end'),
    d_klf: { type: DataTypes.DOUBLE, allowNull: false },
    l_klf: { type: DataTypes.DOUBLE, allowNull: false },
    lr_klf: { type: DataTypes.DOUBLE, allowNull: true },
    s_klf: { type: DataTypes.DOUBLE, allowNull: true },
  },
  plan_openings: {
    level_id: { type: DataTypes.STRING(255), allowNull: false },
    polygon: { type: DataTypes.JSON, allowNull: false },
  },
};

export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('schemes', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    project_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'projects', key: 'id' },
      onDelete: 'CASCADE',
    },
    name: { type: DataTypes.STRING(200), allowNull: false },
    status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'draft' },
    archived: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    design_basis: { type: DataTypes.JSON, allowNull: false },
    // The plan file's optional grids[]: absent and empty are kept apart for an exact export.
    has_grids: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    created_by: userRef,
    updated_by: userRef,
    ...timestamps,
  });
  await qi.addIndex('schemes', ['project_id'], { name: 'schemes_project_id' });

  for (const [table, columns] of Object.entries(ELEMENT_TABLES)) {
    await qi.createTable(table, { ...elementBase, ...columns });
    await qi.addIndex(table, ['scheme_id', 'element_id'], { unique: true, name: `${table}_scheme_element_unique` });
  }

  await qi.createTable('plan_revisions', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    scheme_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'schemes', key: 'id' },
      onDelete: 'CASCADE',
    },
    revision: { type: DataTypes.INTEGER, allowNull: false },
    plan: { type: DataTypes.JSON, allowNull: false },
    note: { type: DataTypes.STRING(500), allowNull: true },
    user_id: userRef,
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('plan_revisions', ['scheme_id', 'revision'], {
    unique: true,
    name: 'plan_revisions_scheme_revision_unique',
  });

  await qi.createTable('design_runs', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    scheme_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'schemes', key: 'id' },
      onDelete: 'CASCADE',
    },
    revision: { type: DataTypes.INTEGER, allowNull: false },
    result: { type: DataTypes.JSON, allowNull: false },
    // Summary copied from result.totals so lists need not read the whole result.
    steel_weight_lb: { type: DataTypes.DOUBLE, allowNull: false },
    pieces: { type: DataTypes.INTEGER, allowNull: false },
    floor_area_ft2: { type: DataTypes.DOUBLE, allowNull: false },
    failing_members: { type: DataTypes.INTEGER, allowNull: false },
    problem_count: { type: DataTypes.INTEGER, allowNull: false },
    user_id: userRef,
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('design_runs', ['scheme_id', 'created_at'], { name: 'design_runs_scheme_created' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('design_runs');
  await qi.dropTable('plan_revisions');
  for (const table of Object.keys(ELEMENT_TABLES).reverse()) await qi.dropTable(table);
  await qi.dropTable('schemes');
};
