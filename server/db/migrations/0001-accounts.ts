import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

// Firms, users, memberships (role per firm) and Lucia sessions.
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('firms', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    name: { type: DataTypes.STRING(200), allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.createTable('users', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(200), allowNull: false },
    password_hash: { type: DataTypes.STRING(255), allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.createTable('memberships', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    firm_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'firms', key: 'id' },
      onDelete: 'CASCADE',
    },
    user_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    role: { type: DataTypes.STRING(20), allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('memberships', ['firm_id', 'user_id'], {
    unique: true,
    name: 'memberships_firm_user_unique',
  });
  await qi.addIndex('memberships', ['user_id'], { name: 'memberships_user_id' });
  await qi.createTable('sessions', {
    id: { type: DataTypes.STRING(255), primaryKey: true, allowNull: false },
    user_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    firm_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'firms', key: 'id' },
      onDelete: 'CASCADE',
    },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('sessions', ['user_id'], { name: 'sessions_user_id' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('sessions');
  await qi.dropTable('memberships');
  await qi.dropTable('users');
  await qi.dropTable('firms');
};
