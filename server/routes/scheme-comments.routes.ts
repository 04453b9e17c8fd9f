import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../app-context';
import { authOf, requireRole } from '../auth/auth.middleware';
import { idParams, validate } from '../middleware/validate.middleware';
import { addComment, listActivity, listComments } from '../services/scheme-comments.service';
import type { ReviewContext } from '../services/scheme-status.service';
import type { Response } from 'express';

export const commentBody = z.object({
  body: z
    .string({ error: 'Comment text is required' })
    .trim()
    .min(1, 'Comment text is required')
    .max(4000, 'A comment is at most 4,000 characters'),
});

function reviewContext(ctx: AppContext, res: Response): ReviewContext {
  const auth = authOf(res);
  return { db: ctx.db, config: ctx.config, actor: { firmId: auth.firmId, userId: auth.userId } };
}

/** /api/schemes/:id/comments and /activity: everyone reads; engineers, managers and owners post. */
export function schemeCommentsRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/:id/comments', requireRole('project:read'), async (req, res) => {
    const { params } = validate(req, { params: idParams });
    res.json({ comments: await listComments(reviewContext(ctx, res), params.id) });
  });

  router.post('/:id/comments', requireRole('comment:write'), async (req, res) => {
    const { params, body } = validate(req, { params: idParams, body: commentBody });
    res.status(201).json({ comment: await addComment(reviewContext(ctx, res), params.id, body.body) });
  });

  router.get('/:id/activity', requireRole('project:read'), async (req, res) => {
    const { params } = validate(req, { params: idParams });
    res.json({ activity: await listActivity(reviewContext(ctx, res), params.id) });
  });

  return router;
}
