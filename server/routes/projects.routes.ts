import { Router } from 'express';
import type { AppContext } from '../app-context';
import { authOf, requireRole } from '../auth/auth.middleware';
import { idParams, validate } from '../middleware/validate.middleware';
import { projectCreateBody, projectPatchBody } from '../schemas/project.schema';
import {
  createProject,
  deleteProject,
  getProject,
  listProjects,
  updateProject,
} from '../services/projects.service';

export function projectsRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  router.get('/', requireRole('project:read'), async (_req, res) => {
    res.json({ projects: await listProjects(db, authOf(res).firmId) });
  });

  router.post('/', requireRole('project:write'), async (req, res) => {
    const { body } = validate(req, { body: projectCreateBody });
    const auth = authOf(res);
    const project = await createProject(db, auth, body);
    res.status(201).json({ project });
  });

  router.get('/:id', requireRole('project:read'), async (req, res) => {
    const { params } = validate(req, { params: idParams });
    res.json({ project: await getProject(db, authOf(res).firmId, params.id) });
  });

  router.patch('/:id', requireRole('project:write'), async (req, res) => {
    const { params, body } = validate(req, { params: idParams, body: projectPatchBody });
    res.json({ project: await updateProject(db, authOf(res).firmId, params.id, body) });
  });

  router.delete('/:id', requireRole('project:delete'), async (req, res) => {
    const { params } = validate(req, { params: idParams });
    await deleteProject(db, authOf(res).firmId, params.id);
    res.status(204).end();
  });

  return router;
}
