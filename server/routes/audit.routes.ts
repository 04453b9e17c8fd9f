import { Router } from 'express';
import type { AppContext } from '../app-context';
import { authOf, requireRole } from '../auth/auth.middleware';
import { validate } from '../middleware/validate.middleware';
import { auditQuery } from '../schemas/team.schema';
import { listAudit } from '../services/audit.service';

export function auditRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/', requireRole('audit:read'), async (req, res) => {
    const { query } = validate(req, { query: auditQuery });
    res.json({ events: await listAudit(ctx, authOf(res).firmId, query) });
  });
  return router;
}
