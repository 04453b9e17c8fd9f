import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../app-context';
import { authOf, requireRole } from '../auth/auth.middleware';
import { receiveCheckedUpload } from '../middleware/upload.middleware';
import { isPdf } from '../pdf/pdf-pages.reader';
import { idParams, validate } from '../middleware/validate.middleware';
import {
  createUnderlay,
  deleteUnderlay,
  getUnderlayImage,
  listUnderlays,
  sniffImage,
  UNDERLAY_MAX_BYTES,
  updateUnderlay,
} from '../services/underlays.service';

// POST   /api/schemes/:id/underlays   multipart: file (PNG, JPEG or PDF, ≤ 10 MB), level, page?   owner, engineer
// GET    /api/schemes/:id/underlays                                                   every role
// GET    /api/underlays/:id/image     the stored bytes (image or PDF)                 every role
// PATCH  /api/underlays/:id           { placement?, opacity?, visible?, locked?, page? }   owner, engineer
// DELETE /api/underlays/:id                                                           owner, engineer

/**
 * Underlay files: checked by content before anything is stored. Images are walked whole here
 * (PNG or JPEG structure and size); a PDF is recognised by its header here and read whole by
 * pdfjs (pages, encryption, damage) in createUnderlay before it is stored.
 */
const underlayUpload = {
  field: 'file',
  maxBytes: UNDERLAY_MAX_BYTES,
  what: 'a PNG or JPEG image or a PDF',
  check: (buf: Buffer) => (isPdf(buf) ? ('pdf' as const) : sniffImage(buf)),
};

const pageNumber = z.number({ error: 'page must be a whole number from 1' }).int('page must be a whole number from 1').min(1, 'page must be a whole number from 1').max(100000, 'page is out of range');

const uploadFields = z.object({
  level: z.string({ error: 'Choose the level this plan belongs to' }).trim().min(1, 'Choose the level this plan belongs to').max(255),
  // Multipart fields arrive as text: only digits are a page number.
  page: z
    .string()
    .trim()
    .regex(/^\d{1,6}$/, 'page must be a whole number from 1')
    .transform(Number)
    .pipe(pageNumber)
    .optional(),
});

const finite = (what: string) => z.number({ error: `${what} must be a number` }).refine(Number.isFinite, `${what} must be a finite number`);

const placementPatch = z
  .object({
    origin_ft: z.tuple([finite('origin x').refine((v) => Math.abs(v) <= 1e6, 'origin x is out of range'), finite('origin y').refine((v) => Math.abs(v) <= 1e6, 'origin y is out of range')]),
    scale_ft_per_px: finite('scale').refine((v) => v > 0 && v <= 1000, 'scale must be more than 0 and at most 1000 ft per px'),
    rotation_deg: finite('rotation').refine((v) => v >= -360 && v <= 360, 'rotation must be between -360 and 360 degrees'),
  })
  .partial()
  .strict();

const underlayPatchBody = z
  .object({
    placement: placementPatch.optional(),
    opacity: z.number({ error: 'opacity must be a number from 0 to 1' }).min(0, 'opacity must be from 0 to 1').max(1, 'opacity must be from 0 to 1').optional(),
    visible: z.boolean({ error: 'visible must be true or false' }).optional(),
    locked: z.boolean({ error: 'locked must be true or false' }).optional(),
    page: pageNumber.optional(),
  })
  .strict()
  .refine((b) => Object.values(b).some((v) => v !== undefined), 'Send placement, opacity, visible, locked or page');

/** Paths (under /api) whose write takes a multipart body; every other write body is JSON. */
export const UNDERLAY_UPLOAD_PATHS: readonly RegExp[] = [/^\/schemes\/[^/]+\/underlays\/?$/];

export function underlaysRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  const storage = { uploadDir: ctx.config.uploadDir };

  router.post('/schemes/:id/underlays', requireRole('plan:write'), async (req, res) => {
    const { params } = validate(req, { params: idParams });
    const file = await receiveCheckedUpload(req, res, underlayUpload);
    const { body } = validate(req, { body: uploadFields });
    const underlay = await createUnderlay(db, storage, authOf(res), params.id, {
      levelId: body.level,
      page: body.page,
      file: file ? { buffer: file.buffer, originalName: file.originalName } : null,
    });
    res.status(201).json({ underlay });
  });

  router.get('/schemes/:id/underlays', requireRole('project:read'), async (req, res) => {
    const { params } = validate(req, { params: idParams });
    res.json({ underlays: await listUnderlays(db, authOf(res).firmId, params.id) });
  });

  router.get('/underlays/:id/image', requireRole('project:read'), async (req, res) => {
    const { params } = validate(req, { params: idParams });
    const image = await getUnderlayImage(db, storage, authOf(res).firmId, params.id);
    await new Promise<void>((resolve, reject) => {
      res.sendFile(
        image.path,
        {
          headers: {
            'Content-Type': image.mime,
            // A PDF opened straight in a tab runs in a sandbox: no scripts, no same-origin access.
            'Content-Security-Policy': 'sandbox',
            'Cache-Control': 'private, max-age=3600',
            'X-Content-Type-Options': 'nosniff',
            'Content-Disposition': `inline; filename="${image.filename.replace(/["\\]/g, '_').replace(/[^\x20-\x7e]/g, '_')}"`,
          },
        },
        (err) => (err ? reject(err) : resolve()),
      );
    });
  });

  router.patch('/underlays/:id', requireRole('plan:write'), async (req, res) => {
    const { params, body } = validate(req, { params: idParams, body: underlayPatchBody });
    res.json({ underlay: await updateUnderlay(db, storage, authOf(res).firmId, params.id, body) });
  });

  router.delete('/underlays/:id', requireRole('plan:write'), async (req, res) => {
    const { params } = validate(req, { params: idParams });
    await deleteUnderlay(db, storage, authOf(res).firmId, params.id);
    res.status(204).end();
  });

  return router;
}
