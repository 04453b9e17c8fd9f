import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../app-context';
import { authOf, requireRole } from '../auth/auth.middleware';
import { validate } from '../middleware/validate.middleware';
import { deckProfileBody, deckProfileRenameBody } from '../../shared/schemas/deck-profile.schema';
import { createDeckProfile, deleteDeckProfile, listDeckProfiles, updateDeckProfile } from '../services/deck-profiles.service';

// A built-in id ("builtin:…") or a UUID; anything else is bad input naming the id.
const profileParams = z.object({
  id: z.string().regex(/^(builtin:[a-z0-9.-]{1,40}|[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12})$/i, 'Not a deck profile id'),
});

/** /api/deck-profiles: everyone of the firm reads; engineers and owners keep the firm's own (plan:write). */
export function deckProfilesRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/', requireRole('project:read'), async (_req, res) => {
    res.json({ profiles: await listDeckProfiles(ctx, authOf(res).firmId) });
  });

  router.post('/', requireRole('plan:write'), async (req, res) => {
    const { body } = validate(req, { body: deckProfileBody });
    const auth = authOf(res);
    res.status(201).json({ profile: await createDeckProfile(ctx, { firmId: auth.firmId, userId: auth.userId }, body) });
  });

  router.put('/:id', requireRole('plan:write'), async (req, res) => {
    const { params, body } = validate(req, { params: profileParams, body: deckProfileBody });
    const auth = authOf(res);
    res.json({ profile: await updateDeckProfile(ctx, { firmId: auth.firmId, userId: auth.userId }, params.id, body) });
  });

  // Rename only: the build-up stays as stored.
  router.patch('/:id', requireRole('plan:write'), async (req, res) => {
    const { params, body } = validate(req, { params: profileParams, body: deckProfileRenameBody });
    const auth = authOf(res);
    res.json({ profile: await updateDeckProfile(ctx, { firmId: auth.firmId, userId: auth.userId }, params.id, body) });
  });

  router.delete('/:id', requireRole('plan:write'), async (req, res) => {
    const { params } = validate(req, { params: profileParams });
    await deleteDeckProfile(ctx, authOf(res).firmId, params.id);
    res.status(204).end();
  });

  return router;
}
