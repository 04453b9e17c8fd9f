import { Router } from 'express';
import type { Response } from 'express';
import type { AppContext } from '../app-context';
import { authOf, requireRole } from '../auth/auth.middleware';
import { idParams, validate } from '../middleware/validate.middleware';
import {
  planPutBody,
  revisionParams,
  schemeCloneBody,
  schemeCreateBody,
  schemePatchBody,
  schemesListQuery,
} from '../schemas/scheme.schema';
import { designSchemeNowBody, getLatestDesignBody } from '../services/scheme-design.service';
import { sendJsonBody } from './send-json-body';
import {
  cloneScheme,
  createScheme,
  deleteScheme,
  exportScheme,
  getScheme,
  listRevisions,
  listSchemes,
  restoreRevision,
  saveSchemePlan,
  updateScheme,
  type SchemeServiceContext,
} from '../services/schemes.service';

function serviceContext(ctx: AppContext, res: Response): SchemeServiceContext {
  const auth = authOf(res);
  return { db: ctx.db, actor: { firmId: auth.firmId, userId: auth.userId } };
}

/** /api/projects/:id/schemes: a project's schemes. */
export function projectSchemesRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/:id/schemes', requireRole('project:read'), async (req, res) => {
    const { params, query } = validate(req, { params: idParams, query: schemesListQuery });
    res.json({ schemes: await listSchemes(serviceContext(ctx, res), params.id, query) });
  });

  router.post('/:id/schemes', requireRole('scheme:write'), async (req, res) => {
    const { params, body } = validate(req, { params: idParams, body: schemeCreateBody });
    const { repairs, problems, ...scheme } = await createScheme(serviceContext(ctx, res), params.id, body);
    res.status(201).json({ scheme, repairs, problems });
  });

  return router;
}

/** /api/schemes/:id…: one scheme, its plan, revisions and design. */
export function schemesRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/:id', requireRole('project:read'), async (req, res) => {
    const { params } = validate(req, { params: idParams });
    res.json({ scheme: await getScheme(serviceContext(ctx, res), params.id) });
  });

  router.patch('/:id', requireRole('scheme:write'), async (req, res) => {
    const { params, body } = validate(req, { params: idParams, body: schemePatchBody });
    res.json({ scheme: await updateScheme(serviceContext(ctx, res), params.id, body) });
  });

  router.delete('/:id', requireRole('scheme:write'), async (req, res) => {
    const { params } = validate(req, { params: idParams });
    await deleteScheme(serviceContext(ctx, res), params.id);
    res.status(204).end();
  });

  router.get('/:id/export', requireRole('export:read'), async (req, res) => {
    const { params } = validate(req, { params: idParams });
    const { filename, plan } = await exportScheme(serviceContext(ctx, res), params.id);
    res.setHeader('Content-Disposition', `attachment; filename="${filename}"`);
    res.type('application/json').send(`${JSON.stringify(plan, null, 2)}\n`);
  });

  router.put('/:id/plan', requireRole('plan:write'), async (req, res) => {
    const { params, body } = validate(req, { params: idParams, body: planPutBody });
    res.json(await saveSchemePlan(serviceContext(ctx, res), params.id, body));
  });

  router.post('/:id/design', requireRole('scheme:write'), async (req, res) => {
    const { params } = validate(req, { params: idParams });
    sendJsonBody(req, res, await designSchemeNowBody(serviceContext(ctx, res), params.id));
  });

  router.get('/:id/design', requireRole('project:read'), async (req, res) => {
    const { params } = validate(req, { params: idParams });
    sendJsonBody(req, res, await getLatestDesignBody(serviceContext(ctx, res), params.id));
  });

  router.post('/:id/clone', requireRole('scheme:write'), async (req, res) => {
    const { params, body } = validate(req, { params: idParams, body: schemeCloneBody });
    res.status(201).json({ scheme: await cloneScheme(serviceContext(ctx, res), params.id, body) });
  });

  router.get('/:id/revisions', requireRole('project:read'), async (req, res) => {
    const { params } = validate(req, { params: idParams });
    res.json({ revisions: await listRevisions(serviceContext(ctx, res), params.id) });
  });

  router.post('/:id/revisions/:revision/restore', requireRole('plan:write'), async (req, res) => {
    const { params } = validate(req, { params: revisionParams });
    const { restoredFrom, ...scheme } = await restoreRevision(serviceContext(ctx, res), params.id, params.revision);
    res.json({ scheme, restoredFrom });
  });

  return router;
}
