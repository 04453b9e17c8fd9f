import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

// Per-member deflection limits (plan file members[].deflectionLimits, set from the Member
// sheet): a JSON column on plan_members so the field round-trips through the database. NULL
// means absent unless 'deflectionLimits' is listed in the row's null_fields.
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('plan_members', 'deflection_limits', { type: DataTypes.JSON, allowNull: true });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn('plan_members', 'deflection_limits');
};
