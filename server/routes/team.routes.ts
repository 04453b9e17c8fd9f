import { Router } from 'express';
import type { AppContext } from '../app-context';
import { authOf, requireRole } from '../auth/auth.middleware';
import { validate } from '../middleware/validate.middleware';
import { roleChangeBody, userIdParams } from '../schemas/team.schema';
import { changeRole, listMembers, removeMember } from '../services/team.service';

export function teamRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/', requireRole('team:manage'), async (_req, res) => {
    res.json({ members: await listMembers(ctx, authOf(res).firmId) });
  });

  router.patch('/:userId', requireRole('team:manage'), async (req, res) => {
    const { params, body } = validate(req, { params: userIdParams, body: roleChangeBody });
    res.json({ member: await changeRole(ctx, authOf(res), params.userId, body.role) });
  });

  router.delete('/:userId', requireRole('team:manage'), async (req, res) => {
    const { params } = validate(req, { params: userIdParams });
    await removeMember(ctx, authOf(res), params.userId);
    res.status(204).end();
  });

  return router;
}
