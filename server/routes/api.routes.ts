import express, { Router } from 'express';
import type { AppContext } from '../app-context';
import { loadSession } from '../auth/auth.middleware';
import { limitJsonDepth, requireJsonBody } from '../middleware/body-type.middleware';
import { requireSameOrigin } from '../middleware/csrf.middleware';
import { apiNotFound } from '../middleware/error.middleware';
import { auditRoutes } from './audit.routes';
import { bayStudiesRoutes } from './bay-studies.routes';
import { calcBookRoutes } from './calc-book.routes';
import { comparisonRoutes } from './comparison.routes';
import { firmsRoutes } from './firms.routes';
import { healthRoutes } from './health.routes';
import { ifcExportRoutes } from './ifc-export.routes';
import { invitationsRoutes } from './invitations.routes';
import { marksRoutes } from './marks.routes';
import { notificationsRoutes } from './notifications.routes';
import { outboxRoutes } from './outbox.routes';
import { passwordResetRoutes } from './password-reset.routes';
import { planSheetRoutes } from './plan-sheet.routes';
import { projectsRoutes } from './projects.routes';
import { schemeCommentsRoutes } from './scheme-comments.routes';
import { schemeStatusRoutes } from './scheme-status.routes';
import { scheduleRoutes } from './schedule.routes';
import { projectSchemesRoutes, schemesRoutes } from './schemes.routes';
import { sessionRoutes } from './session.routes';
import { teamRoutes } from './team.routes';
import { UNDERLAY_UPLOAD_PATHS, underlaysRoutes } from './underlays.routes';
import { unitPricesRoutes } from './unit-prices.routes';
import { deckProfilesRoutes } from './deck-profiles.routes';

export const JSON_BODY_LIMIT = '2mb';

/** Everything under /api. Add a feature's router here (and its rows to the route table). */
export function apiRoutes(ctx: AppContext): Router {
  const api = Router();
  api.use(requireSameOrigin);
  api.use(requireJsonBody(UNDERLAY_UPLOAD_PATHS));
  api.use(express.json({ limit: JSON_BODY_LIMIT }));
  api.use(limitJsonDepth);
  api.use(loadSession(ctx));

  api.use('/health', healthRoutes());
  api.use('/session', sessionRoutes(ctx));
  api.use('/firms', firmsRoutes(ctx));
  api.use('/projects', projectsRoutes(ctx));
  api.use('/projects', projectSchemesRoutes(ctx));
  api.use('/schemes', schemesRoutes(ctx));
  // Drafting (issue 6): marks, schedule, plan sheets.
  api.use('/schemes', marksRoutes(ctx));
  api.use('/schemes', scheduleRoutes(ctx));
  api.use('/schemes', planSheetRoutes(ctx));
  api.use('/schemes', calcBookRoutes(ctx));
  // Models out (issue 14): the framing as IFC4.
  api.use('/schemes', ifcExportRoutes(ctx));
  // Review (issue 7): status, comments, activity; Tonnage comparison; firm unit prices.
  api.use('/schemes', schemeStatusRoutes(ctx));
  api.use('/schemes', schemeCommentsRoutes(ctx));
  api.use('/projects', comparisonRoutes(ctx));
  // Bay studies (issue 15).
  api.use('/schemes', bayStudiesRoutes(ctx));
  api.use('/unit-prices', unitPricesRoutes(ctx));
  api.use('/deck-profiles', deckProfilesRoutes(ctx));
  api.use('/invitations', invitationsRoutes(ctx));
  api.use('/password-resets', passwordResetRoutes(ctx));
  api.use('/team', teamRoutes(ctx));
  api.use('/outbox', outboxRoutes(ctx));
  api.use('/audit', auditRoutes(ctx));
  api.use('/me/notifications', notificationsRoutes(ctx));
  // /schemes/:id/underlays and /underlays/:id (full paths inside).
  api.use('/', underlaysRoutes(ctx));

  api.use(apiNotFound);
  return api;
}
