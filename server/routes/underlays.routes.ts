import type { Request, Response } from 'express';
import { Router } from 'express';
import multer from 'multer';
import { z } from 'zod';
import type { AppContext } from '../app-context';
import { authOf, requireRole } from '../auth/auth.middleware';
import { AppError } from '../errors/app-error';
import { idParams, validate } from '../middleware/validate.middleware';
import {
  createUnderlay,
  deleteUnderlay,
  getUnderlayImage,
  listUnderlays,
  UNDERLAY_MAX_BYTES,
  updateUnderlay,
} from '../services/underlays.service';

// POST   /api/schemes/:id/underlays   multipart: file (PNG or JPEG, ≤ 10 MB), level   owner, engineer
// GET    /api/schemes/:id/underlays                                                   every role
// GET    /api/underlays/:id/image     the stored bytes                                every role
// PATCH  /api/underlays/:id           { placement?, opacity?, visible? }              owner, engineer
// DELETE /api/underlays/:id                                                           owner, engineer

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: UNDERLAY_MAX_BYTES, files: 1, fields: 5, fieldSize: 1024, parts: 8 },
});

const MB = UNDERLAY_MAX_BYTES / (1024 * 1024);

/** Reads the multipart body; multer's limits become clear 413/400 answers. */
function receiveUpload(req: Request, res: Response): Promise<void> {
  return new Promise((resolve, reject) => {
    upload.single('file')(req, res, (err: unknown) => {
      if (!err) return resolve();
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') {
          return reject(new AppError(413, 'payload_too_large', `The image is larger than ${MB} MB. Reduce its resolution or save it as JPEG and try again.`, {
            fields: { file: `At most ${MB} MB` },
          }));
        }
        if (err.code === 'LIMIT_UNEXPECTED_FILE') {
          return reject(AppError.badRequest(`Send one image in the multipart part named "file" (got "${err.field ?? ''}").`, { file: 'Send one image as "file"' }));
        }
        return reject(AppError.badRequest(`The upload could not be read: ${err.message}.`, { file: 'Send one image as "file" with a "level" field' }));
      }
      // The multipart parser's own errors (a truncated or malformed body) are the client's.
      if (err instanceof Error && !(err instanceof AppError)) {
        return reject(AppError.badRequest(`The upload could not be read: ${err.message}.`, { file: 'Send a complete multipart/form-data body' }));
      }
      reject(err);
    });
  });
}

const uploadFields = z.object({
  level: z.string({ error: 'Choose the level this plan belongs to' }).trim().min(1, 'Choose the level this plan belongs to').max(255),
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
  })
  .strict()
  .refine((b) => b.placement !== undefined || b.opacity !== undefined || b.visible !== undefined, 'Send placement, opacity or visible');

/** Paths (under /api) whose write takes a multipart body; every other write body is JSON. */
export const UNDERLAY_UPLOAD_PATHS: readonly RegExp[] = [/^\/schemes\/[^/]+\/underlays\/?$/];

export function underlaysRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  const storage = { uploadDir: ctx.config.uploadDir };

  router.post('/schemes/:id/underlays', requireRole('plan:write'), async (req, res) => {
    const { params } = validate(req, { params: idParams });
    await receiveUpload(req, res);
    const { body } = validate(req, { body: uploadFields });
    const underlay = await createUnderlay(db, storage, authOf(res), params.id, {
      levelId: body.level,
      file: req.file ? { buffer: req.file.buffer, originalName: req.file.originalname } : null,
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
    res.json({ underlay: await updateUnderlay(db, authOf(res).firmId, params.id, body) });
  });

  router.delete('/underlays/:id', requireRole('plan:write'), async (req, res) => {
    const { params } = validate(req, { params: idParams });
    await deleteUnderlay(db, storage, authOf(res).firmId, params.id);
    res.status(204).end();
  });

  return router;
}
