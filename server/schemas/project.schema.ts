import { z } from 'zod';

const optionalText = (label: string, max: number) =>
  z
    .string({ error: `${label} must be text` })
    .trim()
    .max(max, `${label} is at most ${max} characters`)
    .nullish()
    .transform((v) => (v === undefined ? undefined : v === null || v === '' ? null : v));

export const projectName = z
  .string({ error: 'Project name is required' })
  .trim()
  .min(1, 'Project name is required')
  .max(200, 'Project name is at most 200 characters');

export const projectCreateBody = z.object({
  name: projectName,
  number: optionalText('Project number', 50),
  client: optionalText('Client', 200),
  address: optionalText('Address', 300),
  description: optionalText('Description', 4000),
});
/** Optional text fields: undefined = not given, null = empty. */
export interface ProjectCreateInput {
  name: string;
  number?: string | null;
  client?: string | null;
  address?: string | null;
  description?: string | null;
}

export const projectPatchBody = z
  .object({
    name: projectName.optional(),
    number: optionalText('Project number', 50),
    client: optionalText('Client', 200),
    address: optionalText('Address', 300),
    description: optionalText('Description', 4000),
  })
  .refine((v) => Object.values(v).some((x) => x !== undefined), {
    error: 'Give at least one field to change',
  });
export type ProjectPatchInput = Partial<ProjectCreateInput>;
