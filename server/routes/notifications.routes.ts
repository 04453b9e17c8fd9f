import { Router } from 'express';
import type { AppContext } from '../app-context';
import { authOf, requireAuth } from '../auth/auth.middleware';
import { validate } from '../middleware/validate.middleware';
import { notificationPrefsBody } from '../schemas/team.schema';
import { getNotificationPrefs, setNotificationPrefs } from '../services/notifications.service';

// The signed-in person's own e-mail notification settings (/api/me/notifications).
export function notificationsRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/', requireAuth, async (_req, res) => {
    res.json({ notifications: await getNotificationPrefs(ctx, authOf(res)) });
  });
  router.put('/', requireAuth, async (req, res) => {
    const { body } = validate(req, { body: notificationPrefsBody });
    res.json({ notifications: await setNotificationPrefs(ctx, authOf(res), body) });
  });
  return router;
}
