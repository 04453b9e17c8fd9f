import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

export interface ProjectAttributes {
  id: string;
  firmId: string;
  name: string;
  number: string | null;
  address: string | null;
  client: string | null;
  description: string | null;
  createdBy: string | null;
  createdAt: Date;
  updatedAt: Date;
}
export type ProjectCreation = Optional<
  ProjectAttributes,
  'id' | 'number' | 'address' | 'client' | 'description' | 'createdAt' | 'updatedAt'
>;
export type ProjectModel = ModelStatic<Model<ProjectAttributes, ProjectCreation>>;

export function defineProjectModel(sequelize: Sequelize): ProjectModel {
  return sequelize.define<Model<ProjectAttributes, ProjectCreation>>(
    'Project',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      firmId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.STRING(200), allowNull: false },
      number: { type: DataTypes.STRING(50), allowNull: true },
      address: { type: DataTypes.STRING(300), allowNull: true },
      client: { type: DataTypes.STRING(200), allowNull: true },
      description: { type: DataTypes.TEXT, allowNull: true },
      createdBy: { type: DataTypes.UUID, allowNull: true },
      createdAt: { type: DataTypes.DATE, allowNull: false },
      updatedAt: { type: DataTypes.DATE, allowNull: false },
    },
    { tableName: 'projects', underscored: true },
  );
}
