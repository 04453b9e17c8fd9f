import { z } from 'zod';

// An underlay as the API returns it (server/services/underlays.service.ts UnderlayView).
export const underlayPlacementSchema = z.object({
  /** Plan coordinates (ft) of the image's top-left pixel. */
  origin_ft: z.tuple([z.number(), z.number()]),
  scale_ft_per_px: z.number().positive(),
  /** Counter-clockwise on the plan, about the top-left corner. */
  rotation_deg: z.number(),
});
export type UnderlayPlacement = z.infer<typeof underlayPlacementSchema>;

export const underlaySchema = z.object({
  id: z.string(),
  schemeId: z.string(),
  levelId: z.string(),
  filename: z.string(),
  mime: z.enum(['image/png', 'image/jpeg', 'application/pdf']),
  bytes: z.number(),
  /** Image pixels; for a PDF, the page's size in points (the unit its placement scales). */
  width_px: z.number().int().positive(),
  height_px: z.number().int().positive(),
  /** PDF only: the page shown and the document's page count (null for images). */
  page: z.number().int().positive().nullable().default(null),
  pageCount: z.number().int().positive().nullable().default(null),
  placement: underlayPlacementSchema,
  opacity: z.number().min(0).max(1),
  visible: z.boolean(),
  /** Locked: placement and page cannot change until unlocked. */
  locked: z.boolean().default(false),
  imageUrl: z.string(),
  createdBy: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Underlay = z.infer<typeof underlaySchema>;

export interface UnderlayPatch {
  placement?: Partial<UnderlayPlacement>;
  opacity?: number;
  visible?: boolean;
  locked?: boolean;
  /** PDF only. */
  page?: number;
}

/** The server's limit (UNDERLAY_MAX_BYTES), checked here first to spare a long upload. */
export const UNDERLAY_MAX_BYTES = 10 * 1024 * 1024;
