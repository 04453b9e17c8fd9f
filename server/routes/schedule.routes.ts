import { Router, type Response } from 'express';
import { z } from 'zod';
import type { AppContext } from '../app-context';
import { authOf, requireRole } from '../auth/auth.middleware';
import { idParams, validate } from '../middleware/validate.middleware';
import type { SchemeServiceContext } from '../services/plan-store.service';
import { getScheduleBody, getScheduleCsv } from '../services/schedule.service';
import { sendJsonBody } from './send-json-body';

function serviceContext(ctx: AppContext, res: Response): SchemeServiceContext {
  const auth = authOf(res);
  return { db: ctx.db, actor: { firmId: auth.firmId, userId: auth.userId } };
}

/** Header values are Latin-1: the caution's punctuation is kept ASCII there. */
export function cautionHeader(caution: string): string {
  return caution.replace(/[\u2018\u2019]/g, "'").replace(/[\u201c\u201d]/g, '"').replace(/[\u2013\u2014]/g, '-').replace(/[^\x20-\x7e]/g, '');
}

const csvQuery = z.object({
  by: z.enum(['member', 'mark'], { message: 'by: "member" (one row per member) or "mark" (one row per mark)' }).default('member'),
});

/** /api/schemes/:id/schedule…: the member schedule as JSON and CSV. */
export function scheduleRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/:id/schedule', requireRole('project:read'), async (req, res) => {
    const { params } = validate(req, { params: idParams });
    sendJsonBody(req, res, await getScheduleBody(serviceContext(ctx, res), params.id));
  });

  router.get('/:id/schedule.csv', requireRole('export:read'), async (req, res) => {
    const { params, query } = validate(req, { params: idParams, query: csvQuery });
    const { filename, csv, caution } = await getScheduleCsv(serviceContext(ctx, res), params.id, query.by);
    res.setHeader('Content-Disposition', `attachment; filename="${filename}"`);
    res.setHeader('X-Baywright-Caution', cautionHeader(caution));
    res.setHeader('Access-Control-Expose-Headers', 'X-Baywright-Caution');
    res.type('text/csv; charset=utf-8').send(csv);
  });

  return router;
}
