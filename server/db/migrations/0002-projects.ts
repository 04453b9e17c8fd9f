import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('projects', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    firm_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'firms', key: 'id' },
      onDelete: 'CASCADE',
    },
    name: { type: DataTypes.STRING(200), allowNull: false },
    number: { type: DataTypes.STRING(50), allowNull: true },
    address: { type: DataTypes.STRING(300), allowNull: true },
    client: { type: DataTypes.STRING(200), allowNull: true },
    description: { type: DataTypes.TEXT, allowNull: true },
    created_by: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
    },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('projects', ['firm_id'], { name: 'projects_firm_id' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('projects');
};
