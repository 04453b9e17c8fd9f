import { Router } from 'express';
import type { AppContext } from '../app-context';
import { authOf } from '../auth/auth.middleware';
import { validate } from '../middleware/validate.middleware';
import { signInBody } from '../schemas/session.schema';
import { getSessionView, signIn, signOut } from '../services/session.service';

export function sessionRoutes(ctx: AppContext): Router {
  const router = Router();

  router.post('/', async (req, res) => {
    const { body } = validate(req, { body: signInBody });
    const result = await signIn(ctx, { ...body, ip: req.ip ?? 'unknown' });
    // A fresh session id on every sign-in; drop the one the browser had, if any.
    await signOut(ctx, res.locals.auth?.sessionId);
    res.append('Set-Cookie', ctx.lucia.createSessionCookie(result.sessionId).serialize());
    res.status(200).json(result.view);
  });

  router.get('/', async (_req, res) => {
    res.json(await getSessionView(ctx, authOf(res)));
  });

  // Idempotent: signing out without a session is fine.
  router.delete('/', async (_req, res) => {
    await signOut(ctx, res.locals.auth?.sessionId);
    res.append('Set-Cookie', ctx.lucia.createBlankSessionCookie().serialize());
    res.status(204).end();
  });

  return router;
}
