import { Router, type Request, type Response } from 'express';
import { z } from 'zod';
import type { AppContext } from '../app-context';
import { authOf, requireRole } from '../auth/auth.middleware';
import { idParams, validate } from '../middleware/validate.middleware';
import { comparisonPdf } from '../pdf/tonnage-comparison.pdf';
import { comparisonCsv, comparisonFileStem, getComparison } from '../services/comparison.service';

export const comparisonQuery = z.object({
  schemes: z
    .string()
    .optional()
    .transform((v) => (v ? v.split(',').map((s) => s.trim()).filter(Boolean) : undefined))
    .pipe(z.array(z.uuid({ error: 'schemes must be scheme ids separated by commas' })).max(12, 'Compare at most 12 schemes').optional()),
  archived: z.enum(['include', 'exclude'], { error: 'archived must be include or exclude' }).default('exclude'),
});

async function load(ctx: AppContext, req: Request, res: Response) {
  const { params, query } = validate(req, { params: idParams, query: comparisonQuery });
  const auth = authOf(res);
  return getComparison({ db: ctx.db, actor: { firmId: auth.firmId, userId: auth.userId } }, params.id, {
    schemeIds: query.schemes,
    archived: query.archived,
  });
}

/** /api/projects/:id/comparison(.csv|.pdf): Tonnage, every role reads. */
export function comparisonRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/:id/comparison', requireRole('project:read'), async (req, res) => {
    res.json(await load(ctx, req, res));
  });

  router.get('/:id/comparison.csv', requireRole('export:read'), async (req, res) => {
    const c = await load(ctx, req, res);
    res.setHeader('Content-Disposition', `attachment; filename="${comparisonFileStem(c)}.csv"`);
    res.type('text/csv; charset=utf-8').send(comparisonCsv(c));
  });

  router.get('/:id/comparison.pdf', requireRole('export:read'), async (req, res) => {
    const c = await load(ctx, req, res);
    const pdf = await comparisonPdf(c);
    res.setHeader('Content-Disposition', `attachment; filename="${comparisonFileStem(c)}.pdf"`);
    res.type('application/pdf').send(pdf);
  });

  return router;
}
