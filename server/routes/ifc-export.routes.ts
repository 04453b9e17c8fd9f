import { Router } from 'express';
import type { AppContext } from '../app-context';
import { authOf, requireRole } from '../auth/auth.middleware';
import { idParams, validate } from '../middleware/validate.middleware';
import { getSchemeIfc } from '../services/ifc-export.service';
import { cautionHeader } from './schedule.routes';

// GET /api/schemes/:id/model.ifc   the framing as an IFC4 model (ISO 16739)   every role that exports
export function ifcExportRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/:id/model.ifc', requireRole('export:read'), async (req, res) => {
    const { params } = validate(req, { params: idParams });
    const auth = authOf(res);
    const { filename, ifc, caution } = await getSchemeIfc({ db: ctx.db, actor: { firmId: auth.firmId, userId: auth.userId } }, params.id);
    res.setHeader('Content-Disposition', `attachment; filename="${filename}"`);
    res.setHeader('X-Baywright-Caution', cautionHeader(caution));
    res.setHeader('Access-Control-Expose-Headers', 'X-Baywright-Caution');
    res.type('application/x-step').send(Buffer.from(ifc));
  });

  return router;
}
