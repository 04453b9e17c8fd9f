import { z } from 'zod';

// Request shapes of the schemes API. The plan itself is checked by parsePlanFile
// (migrations, zod, repair) in the service, so it answers 422 naming each element; here it
// only has to be present.

export const schemeName = z
  .string({ error: 'Scheme name is required' })
  .trim()
  .min(1, 'Scheme name is required')
  .max(200, 'Scheme name is at most 200 characters');

const planDocument = z.unknown().refine((v) => v !== undefined && v !== null, { error: 'A plan file is required' });

const note = z
  .string({ error: 'Note must be text' })
  .trim()
  .max(500, 'Note is at most 500 characters')
  .optional()
  .transform((v) => (v ? v : null));

/** {name} starts an empty plan; {name?, plan} imports a plan file (name defaults to the file's). */
export const schemeCreateBody = z
  .object({ name: schemeName.optional(), plan: planDocument.optional() })
  .refine((v) => v.name !== undefined || v.plan !== undefined, {
    error: 'Give a scheme name, or a plan file to import',
    path: ['name'],
  });
export type SchemeCreateInput = { name?: string; plan?: unknown };

export const schemeCloneBody = z.object({ name: schemeName.optional() });

export const schemePatchBody = z
  .object({
    name: schemeName.optional(),
    archived: z.boolean({ error: 'archived must be true or false' }).optional(),
  })
  .refine((v) => v.name !== undefined || v.archived !== undefined, { error: 'Give at least one field to change' });
export type SchemePatchInput = z.output<typeof schemePatchBody>;

export const planPutBody = z.object({
  revision: z
    .number({ error: 'revision must be the whole number of the revision you edited' })
    .int('revision must be a whole number')
    .min(1, 'revision starts at 1'),
  plan: planDocument,
  note,
});

export const schemesListQuery = z.object({
  archived: z.enum(['include', 'exclude', 'only'], { error: 'archived must be include, exclude or only' }).default('include'),
});

export const revisionParams = z.object({
  id: z.uuid({ error: 'Must be a valid id' }),
  revision: z.coerce
    .number({ error: 'revision must be a whole number' })
    .int('revision must be a whole number')
    .min(1, 'revision starts at 1'),
});
