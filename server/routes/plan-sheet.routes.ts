import { Router, type Response } from 'express';
import { z } from 'zod';
import type { AppContext } from '../app-context';
import { authOf, requireRole } from '../auth/auth.middleware';
import { idParams, validate } from '../middleware/validate.middleware';
import type { SchemeServiceContext } from '../services/plan-store.service';
import { getPlanSheetPdf, getPlanSheets } from '../services/plan-sheet.service';
import { cautionHeader } from './schedule.routes';

const sheetQuery = z.object({
  level: z.string({ error: 'level must be a level id' }).min(1, 'level must be a level id').max(255, 'level is too long').optional(),
  reactions: z
    .enum(['0', '1', 'true', 'false'], { error: 'reactions must be 1 or 0' })
    .optional()
    .transform((v) => v === '1' || v === 'true'),
});

function serviceContext(ctx: AppContext, res: Response): SchemeServiceContext {
  const auth = authOf(res);
  return { db: ctx.db, actor: { firmId: auth.firmId, userId: auth.userId } };
}

/** /api/schemes/:id/plan-sheet…: framing plan sheets, as a drawing model (for the screen) and as PDF. */
export function planSheetRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/:id/plan-sheet', requireRole('project:read'), async (req, res) => {
    const { params, query } = validate(req, { params: idParams, query: sheetQuery });
    const options = { levelId: query.level, showReactions: query.reactions, preparedBy: authOf(res).name };
    res.json(await getPlanSheets(serviceContext(ctx, res), params.id, options));
  });

  router.get('/:id/plan-sheet.pdf', requireRole('export:read'), async (req, res) => {
    const { params, query } = validate(req, { params: idParams, query: sheetQuery });
    const options = { levelId: query.level, showReactions: query.reactions, preparedBy: authOf(res).name };
    const { filename, pdf, caution } = await getPlanSheetPdf(serviceContext(ctx, res), params.id, options);
    res.setHeader('Content-Disposition', `attachment; filename="${filename}"`);
    res.setHeader('X-Baywright-Caution', cautionHeader(caution));
    res.type('application/pdf').send(pdf);
  });

  return router;
}
