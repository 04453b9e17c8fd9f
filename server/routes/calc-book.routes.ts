import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../app-context';
import { authOf, requireRole } from '../auth/auth.middleware';
import { idParams, validate } from '../middleware/validate.middleware';
import { getCalcBookPdf, getMemberCalcSheetPdf } from '../services/calc-book.service';
import { cautionHeader } from './schedule.routes';

const calcBookQuery = z.object({
  members: z.enum(['all', 'distinct'], { error: 'members must be all or distinct' }).optional().default('distinct'),
  level: z.string({ error: 'level must be a level id' }).min(1, 'level must be a level id').max(255, 'level is too long').optional(),
});

const memberParams = idParams.extend({
  memberId: z.string({ error: 'memberId must be a member id' }).min(1, 'memberId must be a member id').max(255, 'memberId is too long'),
});

/**
 * /api/schemes/:id/calc-book.pdf: the printable calculation report of a scheme;
 * /api/schemes/:id/members/:memberId/calc-sheet.pdf: one member's calc sheet (from the Member sheet).
 */
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

  router.get('/:id/members/:memberId/calc-sheet.pdf', requireRole('export:read'), async (req, res) => {
    const { params } = validate(req, { params: memberParams });
    const auth = authOf(res);
    const { filename, pdf, caution } = await getMemberCalcSheetPdf(
      { db: ctx.db, actor: { firmId: auth.firmId, userId: auth.userId } },
      params.id,
      params.memberId,
      { downloadedBy: auth.name },
    );
    res.setHeader('Content-Disposition', `attachment; filename="${filename}"`);
    res.setHeader('X-Baywright-Caution', cautionHeader(caution));
    res.type('application/pdf').send(pdf);
  });

  return router;
}
