import { Router, type Request } from 'express';
import type { AppContext } from '../app-context';
import { authOf, requireRole } from '../auth/auth.middleware';
import { limitTokenUsePerIp } from '../middleware/rate-limit.middleware';
import { idParams, validate } from '../middleware/validate.middleware';
import { invitationAcceptBody, invitationCreateBody, tokenParams } from '../schemas/team.schema';
import {
  acceptInvitation,
  createInvitation,
  listPendingInvitations,
  previewInvitation,
  resendInvitation,
  revokeInvitation,
} from '../services/invitations.service';
import { publicBaseUrl } from '../services/mail.service';
import { signOut } from '../services/session.service';

const requestAddress = (req: Request) => ({ protocol: req.protocol, host: req.get('host') });

export function invitationsRoutes(ctx: AppContext): Router {
  const router = Router();
  const limited = limitTokenUsePerIp(ctx);

  router.get('/', requireRole('team:manage'), async (_req, res) => {
    res.json({ invitations: await listPendingInvitations(ctx, authOf(res).firmId) });
  });

  router.post('/', requireRole('team:manage'), async (req, res) => {
    const { body } = validate(req, { body: invitationCreateBody });
    const baseUrl = publicBaseUrl(ctx, requestAddress(req));
    res.status(201).json({ invitation: await createInvitation(ctx, authOf(res), body, baseUrl) });
  });

  router.post('/:id/resend', requireRole('team:manage'), async (req, res) => {
    const { params } = validate(req, { params: idParams });
    const baseUrl = publicBaseUrl(ctx, requestAddress(req));
    res.status(201).json({ invitation: await resendInvitation(ctx, authOf(res), params.id, baseUrl) });
  });

  router.delete('/:id', requireRole('team:manage'), async (req, res) => {
    const { params } = validate(req, { params: idParams });
    await revokeInvitation(ctx, authOf(res), params.id);
    res.status(204).end();
  });

  // Public: the link in the e-mail is the credential. Both uses count against the per-IP
  // one-time-link limit (acceptance hashes a password).
  router.get('/:token', limited, async (req, res) => {
    const { params } = validate(req, { params: tokenParams });
    res.json({ invitation: await previewInvitation(ctx, params.token) });
  });

  router.post('/:token/accept', limited, async (req, res) => {
    const { params, body } = validate(req, { params: tokenParams, body: invitationAcceptBody });
    const result = await acceptInvitation(ctx, params.token, body);
    await signOut(ctx, res.locals.auth?.sessionId);
    res.append('Set-Cookie', ctx.lucia.createSessionCookie(result.sessionId).serialize());
    res.status(201).json(result.view);
  });

  return router;
}
