import { Router } from 'express';
import type { AppContext } from '../app-context';
import { limitTokenUsePerIp } from '../middleware/rate-limit.middleware';
import { validate } from '../middleware/validate.middleware';
import { passwordResetCompleteBody, passwordResetRequestBody, tokenParams } from '../schemas/team.schema';
import { publicBaseUrl } from '../services/mail.service';
import {
  checkPasswordReset,
  completePasswordReset,
  requestPasswordReset,
} from '../services/password-reset.service';

// Public: someone who forgot their password is not signed in. Asking for a link counts against
// the per-IP sign-in limit; using one counts against the per-IP one-time-link limit.
export function passwordResetRoutes(ctx: AppContext): Router {
  const router = Router();
  const limited = limitTokenUsePerIp(ctx);

  router.post('/', async (req, res) => {
    const { body } = validate(req, { body: passwordResetRequestBody });
    const baseUrl = publicBaseUrl(ctx, { protocol: req.protocol, host: req.get('host') });
    res.status(202).json(await requestPasswordReset(ctx, { email: body.email, ip: req.ip ?? 'unknown', baseUrl }));
  });

  router.get('/:token', limited, async (req, res) => {
    const { params } = validate(req, { params: tokenParams });
    res.json({ reset: await checkPasswordReset(ctx, params.token) });
  });

  router.post('/:token', limited, async (req, res) => {
    const { params, body } = validate(req, { params: tokenParams, body: passwordResetCompleteBody });
    const result = await completePasswordReset(ctx, params.token, body);
    // Every session of the person ended, this browser's included.
    if (res.locals.auth?.userId) {
      res.append('Set-Cookie', ctx.lucia.createBlankSessionCookie().serialize());
    }
    res.json({ email: result.email, message: 'Your new password is set. Sign in with it.' });
  });

  return router;
}
