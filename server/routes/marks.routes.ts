import { Router, type Response } from 'express';
import { z } from 'zod';
import type { AppContext } from '../app-context';
import { authOf, requireRole } from '../auth/auth.middleware';
import { idParams, validate } from '../middleware/validate.middleware';
import { editMarks, renumberMarks } from '../services/marks.service';
import type { SchemeServiceContext } from '../services/plan-store.service';

const markText = z
  .string({ error: 'mark must be text, or null to return the member to the marking rule' })
  .trim()
  .min(1, 'mark cannot be empty (send null to return the member to the marking rule)')
  .max(40, 'mark is at most 40 characters')
  .regex(/^[^\u0000-\u001f\u007f]+$/, 'mark cannot hold control characters');

const marksPatchBody = z.object({
  revision: z
    .number({ error: 'revision must be the whole number of the revision you edited' })
    .int('revision must be a whole number')
    .min(1, 'revision starts at 1'),
  marks: z
    .array(
      z.object({
        memberId: z.string({ error: 'memberId is required' }).min(1, 'memberId is required').max(255, 'memberId is too long'),
        mark: markText.nullable(),
      }),
      { error: 'marks must be a list of {memberId, mark}' },
    )
    .min(1, 'Give at least one mark to change')
    .max(5000, 'At most 5000 marks at once'),
});

const renumberBody = z.object({
  keepManual: z.boolean({ error: 'keepManual must be true or false' }).default(true),
});

function serviceContext(ctx: AppContext, res: Response): SchemeServiceContext {
  const auth = authOf(res);
  return { db: ctx.db, actor: { firmId: auth.firmId, userId: auth.userId } };
}

/** /api/schemes/:id/marks…: piece marks (drafters, engineers, owners). */
export function marksRoutes(ctx: AppContext): Router {
  const router = Router();

  router.patch('/:id/marks', requireRole('marks:edit'), async (req, res) => {
    const { params, body } = validate(req, { params: idParams, body: marksPatchBody });
    res.json(await editMarks(serviceContext(ctx, res), params.id, body));
  });

  router.post('/:id/marks/renumber', requireRole('marks:edit'), async (req, res) => {
    const { params, body } = validate(req, { params: idParams, body: renumberBody });
    res.json(await renumberMarks(serviceContext(ctx, res), params.id, body));
  });

  return router;
}
