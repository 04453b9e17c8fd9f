import { Router } from 'express';
import type { Response } from 'express';
import type { AppContext } from '../app-context';
import { authOf, requireRole } from '../auth/auth.middleware';
import { idParams, validate } from '../middleware/validate.middleware';
import { studyBody, studyParams, studySchemeBody } from '../schemas/bay-study.schema';
import { getSchemeStudy, listSchemeStudies, makeSchemeFromOption, runSchemeStudy } from '../services/bay-studies.service';
import type { SchemeServiceContext } from '../services/plan-store.service';

function serviceContext(ctx: AppContext, res: Response): SchemeServiceContext {
  const auth = authOf(res);
  return { db: ctx.db, actor: { firmId: auth.firmId, userId: auth.userId } };
}

/** /api/schemes/:id/studies…: bay studies of a scheme (engineers and owners run them; everyone reads). */
export function bayStudiesRoutes(ctx: AppContext): Router {
  const router = Router();

  router.post('/:id/studies', requireRole('scheme:write'), async (req, res) => {
    const { params, body } = validate(req, { params: idParams, body: studyBody });
    res.status(201).json({ study: await runSchemeStudy(serviceContext(ctx, res), params.id, body) });
  });

  router.get('/:id/studies', requireRole('project:read'), async (req, res) => {
    const { params } = validate(req, { params: idParams });
    res.json({ studies: await listSchemeStudies(serviceContext(ctx, res), params.id) });
  });

  router.get('/:id/studies/:studyId', requireRole('project:read'), async (req, res) => {
    const { params } = validate(req, { params: studyParams });
    res.json({ study: await getSchemeStudy(serviceContext(ctx, res), params.id, params.studyId) });
  });

  router.post('/:id/studies/:studyId/schemes', requireRole('scheme:write'), async (req, res) => {
    const { params, body } = validate(req, { params: studyParams, body: studySchemeBody });
    res.status(201).json(await makeSchemeFromOption(serviceContext(ctx, res), params.id, params.studyId, body));
  });

  return router;
}
