import { Router } from 'express';
import type { AppContext } from '../app-context';
import { authOf, requireRole } from '../auth/auth.middleware';
import { listOutbox } from '../services/mail.service';

// The local outbox: only while no SMTP server is configured (else 404).
export function outboxRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/', requireRole('outbox:read'), async (_req, res) => {
    res.json({ messages: await listOutbox(ctx, authOf(res).firmId) });
  });
  return router;
}
