import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../app-context';
import { authOf, requireRole } from '../auth/auth.middleware';
import { idParams, validate } from '../middleware/validate.middleware';
import { getCalcBookPdf } from '../services/calc-book.service';
import { cautionHeader } from './schedule.routes';

const calcBookQuery = z.object({
  members: z.enum(['all', 'distinct'], { error: 'members must be all or distinct' }).optional().default('distinct'),
  level: z.string({ error: 'level must be a level id' }).min(1, 'level must be a level id').max(255, 'level is too long').optional(),
});

/** /api/schemes/:id/calc-book.pdf: the printable calculation report of a scheme. */
export function calcBookRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/:id/calc-book.pdf', requireRole('export:read'), async (req, res) => {
    const { params, query } = validate(req, { params: idParams, query: calcBookQuery });
    const auth = authOf(res);
    const { filename, pdf, caution } = await getCalcBookPdf(
      { db: ctx.db, actor: { firmId: auth.firmId, userId: auth.userId } },
      params.id,
      { members: query.members, levelId: query.level, downloadedBy: auth.name },
    );
    res.setHeader('Content-Disposition', `attachment; filename="${filename}"`);
    res.setHeader('X-Baywright-Caution', cautionHeader(caution));
    res.type('application/pdf').send(pdf);
  });

  return router;
}
