import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../app-context';
import { authOf, requireRole } from '../auth/auth.middleware';
import { SCHEME_STATUSES } from '../models/scheme.model';
import { idParams, validate } from '../middleware/validate.middleware';
import { setSchemeStatus } from '../services/scheme-status.service';

export const statusBody = z.object({
  status: z.enum(SCHEME_STATUSES, { error: 'status must be draft, in_review or chosen' }),
});

/** POST /api/schemes/:id/status: managers, engineers and owners move a scheme through review. */
export function schemeStatusRoutes(ctx: AppContext): Router {
  const router = Router();
  router.post('/:id/status', requireRole('scheme:status'), async (req, res) => {
    const { params, body } = validate(req, { params: idParams, body: statusBody });
    const auth = authOf(res);
    res.json(
      await setSchemeStatus({ db: ctx.db, config: ctx.config, actor: { firmId: auth.firmId, userId: auth.userId } }, params.id, body.status),
    );
  });
  return router;
}
