import type { Model } from 'sequelize';
import { AppError } from '../errors/app-error';
import type { Db } from '../models/models';
import type { ProjectAttributes, ProjectCreation } from '../models/project.model';
import type { ProjectCreateInput, ProjectPatchInput } from '../schemas/project.schema';

export interface ProjectView {
  id: string;
  name: string;
  number: string | null;
  client: string | null;
  address: string | null;
  description: string | null;
  createdBy: string | null;
  createdAt: string;
  updatedAt: string;
}

function toView(row: Model<ProjectAttributes, ProjectCreation>): ProjectView {
  const p = row.get({ plain: true });
  return {
    id: p.id,
    name: p.name,
    number: p.number ?? null,
    client: p.client ?? null,
    address: p.address ?? null,
    description: p.description ?? null,
    createdBy: p.createdBy ?? null,
    createdAt: new Date(p.createdAt).toISOString(),
    updatedAt: new Date(p.updatedAt).toISOString(),
  };
}

/** A project of the caller's firm; another firm's project is "not found", never forbidden. */
async function findOwn(db: Db, firmId: string, id: string) {
  const row = await db.models.Project.findOne({ where: { id, firmId } });
  if (!row) throw AppError.notFound('Project');
  return row;
}

export async function listProjects(db: Db, firmId: string): Promise<ProjectView[]> {
  const rows = await db.models.Project.findAll({
    where: { firmId },
    order: [['updatedAt', 'DESC'], ['name', 'ASC']],
  });
  return rows.map(toView);
}

export async function getProject(db: Db, firmId: string, id: string): Promise<ProjectView> {
  return toView(await findOwn(db, firmId, id));
}

export async function createProject(
  db: Db,
  actor: { firmId: string; userId: string },
  input: ProjectCreateInput,
): Promise<ProjectView> {
  const row = await db.models.Project.create({
    firmId: actor.firmId,
    createdBy: actor.userId,
    name: input.name,
    number: input.number ?? null,
    client: input.client ?? null,
    address: input.address ?? null,
    description: input.description ?? null,
  });
  return toView(row);
}

export async function updateProject(
  db: Db,
  firmId: string,
  id: string,
  patch: ProjectPatchInput,
): Promise<ProjectView> {
  const row = await findOwn(db, firmId, id);
  const changes: Partial<ProjectAttributes> = {};
  for (const key of ['name', 'number', 'client', 'address', 'description'] as const) {
    if (patch[key] !== undefined) (changes as Record<string, unknown>)[key] = patch[key];
  }
  await row.update(changes);
  return toView(row);
}

export async function deleteProject(db: Db, firmId: string, id: string): Promise<void> {
  const row = await findOwn(db, firmId, id);
  await row.destroy();
}
