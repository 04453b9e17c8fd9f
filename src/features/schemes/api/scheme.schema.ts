import { z } from 'zod';

// What the schemes API answers with (server/services/schemes.service.ts).
const idSchema = z.union([z.string(), z.number()]).transform(String);
const person = z.object({ id: idSchema, name: z.string() }).nullable();

export const designSummarySchema = z.object({
  revision: z.number().int(),
  designedAt: z.string(),
  stale: z.boolean(),
  steelWeight_lb: z.number(),
  pieces: z.number().int(),
  floorArea_ft2: z.number(),
  steel_psf: z.number(),
  failingMembers: z.number().int(),
  problemCount: z.number().int(),
});
export type DesignSummary = z.output<typeof designSummarySchema>;

export const schemeSummarySchema = z.object({
  id: idSchema,
  projectId: idSchema,
  name: z.string(),
  status: z.enum(['draft', 'in_review', 'chosen']).catch('draft'),
  archived: z.boolean(),
  revision: z.number().int(),
  createdBy: person,
  updatedBy: person,
  createdAt: z.string(),
  updatedAt: z.string(),
  design: designSummarySchema.nullable(),
  designStale: z.boolean(),
});
export type SchemeSummary = z.output<typeof schemeSummarySchema>;

export const schemeResponseSchema = z.object({ scheme: schemeSummarySchema });

export const SCHEME_STATUS_LABELS: Record<SchemeSummary['status'], string> = {
  draft: 'Draft',
  in_review: 'In review',
  chosen: 'Chosen',
};
