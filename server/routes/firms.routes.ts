import { Router } from 'express';
import type { AppContext } from '../app-context';
import { validate } from '../middleware/validate.middleware';
import { signUpBody } from '../schemas/session.schema';
import { signUpFirm } from '../services/firms.service';
import { signOut } from '../services/session.service';

export function firmsRoutes(ctx: AppContext): Router {
  const router = Router();

  // Sign-up: creates the firm and its owner, and signs the owner in.
  router.post('/', async (req, res) => {
    const { body } = validate(req, { body: signUpBody });
    const result = await signUpFirm(ctx, { ...body, ip: req.ip ?? 'unknown' });
    await signOut(ctx, res.locals.auth?.sessionId);
    res.append('Set-Cookie', ctx.lucia.createSessionCookie(result.sessionId).serialize());
    res.status(201).json(result.view);
  });

  return router;
}
